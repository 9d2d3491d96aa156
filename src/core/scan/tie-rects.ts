/**
 * A refinement rectangle whose corners are crystals (two or more), certified without
 * splitting it down to the pixels (docs/certified-maps.md, "Rectangles over several
 * crystals").
 *
 * On affine axes each crystal's Omega_X(s) is affine in the normalised coordinates s
 * (boundary-lines.ts). For a set K of crystals (the corners' and others met on the map) the
 * rectangle (a convex polygon in s: each axis's s is monotone in its index) splits into the
 * convex polygons P_X = rect ∩ {Omega_X <= Omega_Y for all Y in K}. If X is the minimum of
 * Omega (over all states) at every vertex of P_X, then g = Omega* - Omega_X, concave and
 * >= 0 at the vertices, is >= 0 on P_X: X is the minimum on P_X. The vertices are corners
 * of the rectangle (solved) and points where two or more crystals of K tie, confirmed by a
 * solve whose winner is one of the tied crystals, or inside a confirmed interval of one of
 * their tie lines (two confirmed points of a line confirm the segment between them). A
 * crystal missing from K cannot hide inside a P_X: it would make g < 0 there. Each pixel
 * then carries the crystal of the polygon it lies in; pixels within TIE_TOL of a tie are
 * left to be solved.
 */
import type { Rect } from './refinement.ts';
import type { AffineOmega } from './boundary-lines.ts';

/** Relative Omega difference below which two crystals tie (vertices) or a pixel is on a tie line. */
export const TIE_TOL = 1e-9;

/** A vertex of a polygon in s; corner: the rectangle's corner pixel it is (solved). */
export interface Vertex { s: number[]; corner?: [number, number] }

function value(m: AffineOmega, s: readonly number[]): number {
  let v = m.c0;
  for (let k = 0; k < s.length; k++) v += m.slope[k] * s[k];
  return v;
}

/** The rectangle as a polygon in s (cyclic; two vertices for one row, one column or a one-axis map). */
export function rectPolygon(r: Rect, sAt: (ix: number, iy: number) => number[]): Vertex[] {
  const ring: Array<[number, number]> = r.x0 === r.x1 && r.y0 === r.y1 ? [[r.x0, r.y0]]
    : r.x0 === r.x1 ? [[r.x0, r.y0], [r.x0, r.y1]]
    : r.y0 === r.y1 ? [[r.x0, r.y0], [r.x1, r.y0]]
    : [[r.x0, r.y0], [r.x1, r.y0], [r.x1, r.y1], [r.x0, r.y1]];
  return ring.map((c) => ({ s: sAt(c[0], c[1]), corner: c }));
}

/**
 * Clip a convex polygon to the half-plane h(s) <= 0, h affine (Sutherland-Hodgman); new
 * vertices on the line h = 0 have no corner.
 */
function clip(poly: Vertex[], h: (s: readonly number[]) => number): Vertex[] {
  if (poly.length === 1) return h(poly[0].s) <= 0 ? poly : [];
  const out: Vertex[] = [];
  const n = poly.length, edges = n === 2 ? 1 : n;
  const hv = poly.map((v) => h(v.s));
  for (let k = 0; k < edges; k++) {
    const i = k, j = (k + 1) % n;
    if (hv[i] <= 0) out.push(poly[i]);
    if ((hv[i] < 0 && hv[j] > 0) || (hv[i] > 0 && hv[j] < 0)) {
      const tau = hv[i] / (hv[i] - hv[j]);
      out.push({ s: poly[i].s.map((v, d) => v + tau * (poly[j].s[d] - v)) });
    }
  }
  if (n === 2 && hv[1] <= 0) out.push(poly[1]);
  return out;
}

/** The polygon of crystal k of models: where its Omega is the lowest of all (ties on the boundary). */
export function region(rect: Vertex[], models: readonly AffineOmega[], k: number): Vertex[] {
  let poly = rect;
  for (let j = 0; j < models.length && poly.length; j++) {
    if (j === k) continue;
    const mk = models[k], mj = models[j];
    poly = clip(poly, (s) => value(mk, s) - value(mj, s));
  }
  return poly;
}

/** Indices of the models within rel (relative) of the lowest at s. */
export function tied(models: readonly AffineOmega[], s: readonly number[], rel = TIE_TOL): number[] {
  const vs = models.map((m) => value(m, s));
  const low = Math.min(...vs), tol = rel * Math.max(1, Math.abs(low));
  return vs.flatMap((v, i) => (v <= low + tol ? [i] : []));
}

/** Index of the model lowest at s by more than TIE_TOL (relative) over every other, or -1. */
export function lowest(models: readonly AffineOmega[], s: readonly number[]): number {
  const t = tied(models, s);
  return t.length === 1 ? t[0] : -1;
}
