/**
 * Phase boundaries of a map as polylines. Wherever two neighbouring pixels (along a row or
 * a column) carry different phases, the edge between them holds a crossing:
 *
 *   two crystals A, B (crystal.ts) on an affine axis: Omega_A - Omega_B is affine in the
 *   axis's affine coordinate u (affine-axes.ts), so it vanishes at
 *       u* = u1 + (u2 - u1) f1 / (f1 - f2),   f = Omega_A - Omega_B at the two pixels,
 *   exact to rounding (far below 1e-9 of the span). One solve at u* confirms that no third
 *   state lies below both there; then A is the minimum on [u1, u*] and B on [u*, u2] (the
 *   affine argument on each half) and the boundary is first order with the density jump
 *   rho_B - rho_A. When a third state R is found there, the edge holds A|R and R|B,
 *   placed halfway between u* and the pixels (not located further).
 *   anything else: halfway between the pixels (known to half a pixel).
 * Crossings are joined into polylines cell by cell (the four edges of each 2 x 2 block of
 * pixels, as in marching squares): two crossings of one pair in a block are joined, a lone
 * one meets the block's centre (a triple point, approximately).
 */
import type { SolveResult } from '../meanfield/ground-state.ts';
import type { ModelParams } from '../model.ts';
import { cellCouplings } from '../meanfield/coupling-cache.ts';
import { lattice } from '../lattice/geometry.ts';
import { resolvePotential } from '../interaction/potential.ts';
import { supercell } from '../lattice/supercells.ts';
import type { Crystal } from './crystal.ts';

/** The name a boundary gives a phase: the label, with the fraction of a modulated phase. */
export function phaseName(s: SolveResult | undefined): string {
  if (!s) return 'unsolved';
  return s.fraction ? `${s.phase} ${s.fraction}` : s.phase;
}

/**
 * Omega per site of the fixed crystal (cell, n) at parameters p, as a trial state
 * (alpha = 0, T = 0): Omega_n = (1/M) [-mu sum_s n_s + (1/2) sum_st n_s J_st(0) n_t], affine
 * in mu and in the strength. (It equals the solver's Omega where n is self-consistent;
 * beyond, it is the energy of the fixed state, which is what the crossing needs.)
 */
export function crystalOmega(p: ModelParams, c: Crystal): number {
  const cell = supercell(c.cell.a, c.cell.b, c.cell.c);
  // J_st(0) of the crystal's own cell (cached), without listing every cell up to maxCell
  const l = lattice(p.lattice);
  const J = cellCouplings(l, p.interaction, resolvePotential(p.interaction, l), cell);
  const M = cell.M, mu = p.mu as number;
  let e = 0;
  for (let s = 0; s < M; s++) {
    if (!c.n[s]) continue;
    let h = 0;
    for (let t = 0; t < M; t++) h += J[s * M + t] * c.n[t];
    e += -mu + h / 2;
  }
  return e / M;
}

/** Where Omega_A = Omega_B on the edge, as the fraction t in [0, 1] of the affine coordinate from u1 to u2 (null: no sign change). */
export function affineCrossing(f1: number, f2: number): number | null {
  if (!(f1 <= 0 && f2 >= 0) && !(f1 >= 0 && f2 <= 0)) return null;
  if (f1 === f2) return 0.5;
  return Math.min(1, Math.max(0, f1 / (f1 - f2)));
}

/** One crossing of a boundary over an edge between pixels. */
export interface Crossing {
  /** 'h' + index of the left pixel (edge along x) or 'v' + index of the lower pixel (along y). */
  edge: string;
  /** The two phase names, sorted. */
  phases: [string, string];
  /** Axis values of the crossing ([x] on a one-axis map). */
  point: number[];
  /** Located exactly (a confirmed crystal-crystal crossing). */
  exact: boolean;
  /** rho_second - rho_first (phases order) for an exact crossing, else null. */
  jump: number | null;
}

/** A boundary line between two phases. */
export interface Boundary {
  phases: [string, string];
  points: number[][];
  /** true: every crossing is a confirmed jump between crystals; null: not determined. */
  firstOrder: boolean | null;
  /** Excitation-density jump rho(phases[1]) - rho(phases[0]) (mean over the line) where first order. */
  densityJump: number | null;
}

/** A crossing record with the phases ordered and the jump signed to match. */
export function crossing(edge: string, a: string, b: string, point: number[], exact: boolean, rhoA?: number, rhoB?: number): Crossing {
  const swap = b < a;
  const jump = exact && rhoA !== undefined && rhoB !== undefined ? (swap ? rhoA - rhoB : rhoB - rhoA) : null;
  return { edge, phases: swap ? [b, a] : [a, b], point, exact, jump };
}

const pairKey = (c: Crossing) => `${c.phases[0]}|${c.phases[1]}`;

/**
 * Join the crossings of an nx x ny map into polylines (see the module note). On a
 * one-axis map (ny = 1) every crossing is a boundary of one point.
 */
export function chainBoundaries(crossings: readonly Crossing[], nx: number, ny: number, centre: (ix: number, iy: number) => number[]): Boundary[] {
  const line = (cs: Crossing[], pts: number[][]): Boundary => {
    const exact = cs.every((c) => c.exact);
    const jumps = cs.map((c) => c.jump).filter((j): j is number => j !== null);
    return {
      phases: cs[0].phases, points: pts, firstOrder: exact ? true : null,
      densityJump: exact && jumps.length ? jumps.reduce((x, y) => x + y, 0) / jumps.length : null,
    };
  };
  if (ny === 1 || nx === 1) return crossings.map((c) => line([c], [c.point]));
  const byEdge = new Map<string, Crossing[]>();
  for (const c of crossings) byEdge.set(c.edge, [...(byEdge.get(c.edge) ?? []), c]);
  // nodes: crossings (edge|pair) and block centres (c<block>|pair); links between them
  const links = new Map<string, string[]>();
  const node = new Map<string, { point: number[]; c: Crossing }>();
  const link = (u: string, v: string) => {
    links.set(u, [...(links.get(u) ?? []), v]);
    links.set(v, [...(links.get(v) ?? []), u]);
  };
  for (const c of crossings) node.set(`${c.edge}|${pairKey(c)}`, { point: c.point, c });
  for (let iy = 0; iy + 1 < ny; iy++) {
    for (let ix = 0; ix + 1 < nx; ix++) {
      const i = iy * nx + ix;
      const edges = [`h${i}`, `v${i + 1}`, `h${i + nx}`, `v${i}`];
      const byPair = new Map<string, Crossing[]>();
      for (const e of edges) for (const c of byEdge.get(e) ?? []) byPair.set(pairKey(c), [...(byPair.get(pairKey(c)) ?? []), c]);
      for (const [k, cs] of byPair) {
        const ids = cs.map((c) => `${c.edge}|${k}`);
        if (ids.length === 2) { link(ids[0], ids[1]); continue; }
        const mid = `c${i}|${k}`;
        node.set(mid, { point: centre(ix, iy), c: cs[0] });
        for (const id of ids) link(mid, id);
      }
    }
  }
  const seen = new Set<string>();
  const out: Boundary[] = [];
  const walk = (start: string) => {
    const pts: number[][] = [], cs: Crossing[] = [];
    let prev = '', cur: string | undefined = start;
    for (let guard = 0; cur !== undefined && !seen.has(cur) && guard <= node.size; guard++) {
      seen.add(cur);
      const n = node.get(cur) as { point: number[]; c: Crossing };
      pts.push(n.point);
      if (!cur.startsWith('c')) cs.push(n.c);
      const next: string | undefined = (links.get(cur) ?? []).find((v) => v !== prev && !seen.has(v));
      prev = cur;
      cur = next;
    }
    if (cs.length) out.push(line(cs, pts));
  };
  // open lines from their ends first, then closed loops
  for (const id of node.keys()) if (!seen.has(id) && (links.get(id) ?? []).length <= 1) walk(id);
  for (const id of node.keys()) if (!seen.has(id)) walk(id);
  return out;
}
