/**
 * SVG geometry as PDF path operators (ISO 32000-1:2008, 8.5.2: m, l, c, re, h) in the
 * SVG's own user units, and SVG transforms (SVG 1.1, 7.6) as matrices [a b c d e f]
 * mapping (x, y) to (a x + c y + e, b x + d y + f), which is also the order of the PDF
 * `cm` operands. Circles and ellipses are four cubic Beziers (kappa = 4(sqrt 2 - 1)/3,
 * the standard quarter-circle fit); elliptical arcs of paths are flattened into short
 * chords; quadratic segments are raised to cubics exactly.
 */
import type { SvgNode } from './svg-tree.ts';

export type Matrix = [number, number, number, number, number, number];
export const IDENTITY: Matrix = [1, 0, 0, 1, 0, 0];

/** A number for a content stream: at most 3 decimals, no exponent, no "-0". */
export function num(v: number): string {
  const r = Math.round(v * 1000) / 1000;
  return Object.is(r, -0) || r === 0 ? '0' : String(r);
}

/** The matrix of "first m, then n" (m applied to the point first). */
export function compose(m: Matrix, n: Matrix): Matrix {
  return [m[0] * n[0] + m[1] * n[2], m[0] * n[1] + m[1] * n[3], m[2] * n[0] + m[3] * n[2], m[2] * n[1] + m[3] * n[3],
    m[4] * n[0] + m[5] * n[2] + n[4], m[4] * n[1] + m[5] * n[3] + n[5]];
}

const NUMBER = /[-+]?(?:\d*\.\d+|\d+\.?)(?:[eE][-+]?\d+)?/g;
const numbers = (s: string) => (s.match(NUMBER) ?? []).map(Number);

/**
 * A transform list as the matrices in the order a PDF writer concatenates them with `cm`
 * (SVG: "rotate(a) translate(x)" rotates the translated figure, so rotate comes first).
 */
export function parseTransform(text: string | undefined): Matrix[] {
  const out: Matrix[] = [];
  for (const m of (text ?? '').matchAll(/(matrix|translate|scale|rotate|skewX|skewY)\s*\(([^)]*)\)/g)) {
    const v = numbers(m[2]);
    const rad = ((v[0] ?? 0) * Math.PI) / 180;
    switch (m[1]) {
      case 'matrix': if (v.length === 6) out.push(v as Matrix); break;
      case 'translate': out.push([1, 0, 0, 1, v[0] ?? 0, v[1] ?? 0]); break;
      case 'scale': out.push([v[0] ?? 1, 0, 0, v[1] ?? v[0] ?? 1, 0, 0]); break;
      case 'rotate': {
        const [c, s] = [Math.cos(rad), Math.sin(rad)];
        const [cx, cy] = [v[1] ?? 0, v[2] ?? 0];
        // translate(cx, cy) rotate(a) translate(-cx, -cy)
        out.push([c, s, -s, c, cx - c * cx + s * cy, cy - s * cx - c * cy]);
        break;
      }
      case 'skewX': out.push([1, 0, Math.tan(rad), 1, 0, 0]); break;
      case 'skewY': out.push([1, Math.tan(rad), 0, 1, 0, 0]); break;
    }
  }
  return out;
}

const K = (4 * (Math.SQRT2 - 1)) / 3;

/** An ellipse centred at (cx, cy) as four Beziers. */
function ellipse(cx: number, cy: number, rx: number, ry: number): string {
  const [ox, oy] = [rx * K, ry * K];
  return [`${num(cx + rx)} ${num(cy)} m`,
    `${num(cx + rx)} ${num(cy + oy)} ${num(cx + ox)} ${num(cy + ry)} ${num(cx)} ${num(cy + ry)} c`,
    `${num(cx - ox)} ${num(cy + ry)} ${num(cx - rx)} ${num(cy + oy)} ${num(cx - rx)} ${num(cy)} c`,
    `${num(cx - rx)} ${num(cy - oy)} ${num(cx - ox)} ${num(cy - ry)} ${num(cx)} ${num(cy - ry)} c`,
    `${num(cx + ox)} ${num(cy - ry)} ${num(cx + rx)} ${num(cy - oy)} ${num(cx + rx)} ${num(cy)} c`, 'h'].join('\n');
}

/** Path operators of a shape element (rect, circle, ellipse, line, polyline, polygon, path); '' if none. */
export function shapePath(n: SvgNode): string {
  const a = (k: string) => Number.parseFloat(n.attrs[k] ?? '0') || 0;
  switch (n.tag) {
    case 'rect': return a('width') > 0 && a('height') > 0 ? `${num(a('x'))} ${num(a('y'))} ${num(a('width'))} ${num(a('height'))} re` : '';
    case 'circle': return a('r') > 0 ? ellipse(a('cx'), a('cy'), a('r'), a('r')) : '';
    case 'ellipse': return a('rx') > 0 && a('ry') > 0 ? ellipse(a('cx'), a('cy'), a('rx'), a('ry')) : '';
    case 'line': return `${num(a('x1'))} ${num(a('y1'))} m ${num(a('x2'))} ${num(a('y2'))} l`;
    case 'polyline': case 'polygon': {
      const v = numbers(n.attrs.points ?? '');
      if (v.length < 4) return '';
      const ops = [`${num(v[0])} ${num(v[1])} m`];
      for (let i = 2; i + 1 < v.length; i += 2) ops.push(`${num(v[i])} ${num(v[i + 1])} l`);
      if (n.tag === 'polygon') ops.push('h');
      return ops.join('\n');
    }
    case 'path': return pathData(n.attrs.d ?? '');
    default: return '';
  }
}

/** SVG path data (SVG 1.1, 8.3) as PDF path operators. */
export function pathData(d: string): string {
  const tokens = d.match(/[MmLlHhVvCcSsQqTtAaZz]|[-+]?(?:\d*\.\d+|\d+\.?)(?:[eE][-+]?\d+)?/g) ?? [];
  const ops: string[] = [];
  let i = 0, cmd = '', x = 0, y = 0, sx = 0, sy = 0, cx = 0, cy = 0, qx = 0, qy = 0, prev = '';
  const next = () => Number(tokens[i++]);
  const curve = (x1: number, y1: number, x2: number, y2: number, ex: number, ey: number) => {
    ops.push(`${num(x1)} ${num(y1)} ${num(x2)} ${num(y2)} ${num(ex)} ${num(ey)} c`);
    cx = x2; cy = y2; x = ex; y = ey;
  };
  const quad = (x1: number, y1: number, ex: number, ey: number) => {
    qx = x1; qy = y1;
    curve(x + (2 / 3) * (x1 - x), y + (2 / 3) * (y1 - y), ex + (2 / 3) * (x1 - ex), ey + (2 / 3) * (y1 - ey), ex, ey);
  };
  while (i < tokens.length) {
    if (/[A-Za-z]/.test(tokens[i])) cmd = tokens[i++];
    else if (!cmd) break;
    const rel = cmd === cmd.toLowerCase();
    const [ox, oy] = rel ? [x, y] : [0, 0];
    const C = cmd.toUpperCase();
    if (C === 'Z') { ops.push('h'); x = sx; y = sy; prev = C; cmd = ''; continue; }
    if (i >= tokens.length || /[A-Za-z]/.test(tokens[i])) { cmd = ''; continue; }
    switch (C) {
      case 'M': x = ox + next(); y = oy + next(); sx = x; sy = y; ops.push(`${num(x)} ${num(y)} m`); cmd = rel ? 'l' : 'L'; break;
      case 'L': x = ox + next(); y = oy + next(); ops.push(`${num(x)} ${num(y)} l`); break;
      case 'H': x = (rel ? x : 0) + next(); ops.push(`${num(x)} ${num(y)} l`); break;
      case 'V': y = (rel ? y : 0) + next(); ops.push(`${num(x)} ${num(y)} l`); break;
      case 'C': { const v = [next(), next(), next(), next(), next(), next()]; curve(ox + v[0], oy + v[1], ox + v[2], oy + v[3], ox + v[4], oy + v[5]); break; }
      case 'S': {
        const [x1, y1] = prev === 'C' || prev === 'S' ? [2 * x - cx, 2 * y - cy] : [x, y];
        const v = [next(), next(), next(), next()];
        curve(x1, y1, ox + v[0], oy + v[1], ox + v[2], oy + v[3]);
        break;
      }
      case 'Q': { const v = [next(), next(), next(), next()]; quad(ox + v[0], oy + v[1], ox + v[2], oy + v[3]); break; }
      case 'T': {
        const [x1, y1] = prev === 'Q' || prev === 'T' ? [2 * x - qx, 2 * y - qy] : [x, y];
        quad(x1, y1, ox + next(), oy + next());
        break;
      }
      case 'A': {
        const [rx, ry, rot, large, sweep] = [next(), next(), next(), next(), next()];
        const [ex, ey] = [ox + next(), oy + next()];
        for (const [px, py] of arcPoints(x, y, rx, ry, rot, large !== 0, sweep !== 0, ex, ey)) ops.push(`${num(px)} ${num(py)} l`);
        x = ex; y = ey;
        break;
      }
      default: i = tokens.length;
    }
    prev = C;
  }
  return ops.join('\n');
}

/**
 * Points along an elliptical arc (SVG 1.1, F.6.5: endpoint to centre parametrisation),
 * one chord per 1/32 turn at most, ending at (x2, y2).
 */
function arcPoints(x1: number, y1: number, rx: number, ry: number, phiDeg: number, large: boolean, sweep: boolean, x2: number, y2: number): [number, number][] {
  rx = Math.abs(rx); ry = Math.abs(ry);
  if (rx === 0 || ry === 0 || (x1 === x2 && y1 === y2)) return [[x2, y2]];
  const phi = (phiDeg * Math.PI) / 180, [c, s] = [Math.cos(phi), Math.sin(phi)];
  const dx = (x1 - x2) / 2, dy = (y1 - y2) / 2;
  const xp = c * dx + s * dy, yp = -s * dx + c * dy;
  const lam = (xp * xp) / (rx * rx) + (yp * yp) / (ry * ry);
  if (lam > 1) { rx *= Math.sqrt(lam); ry *= Math.sqrt(lam); }
  const num2 = rx * rx * ry * ry - rx * rx * yp * yp - ry * ry * xp * xp;
  const coef = (large === sweep ? -1 : 1) * Math.sqrt(Math.max(0, num2 / (rx * rx * yp * yp + ry * ry * xp * xp)));
  const cxp = (coef * rx * yp) / ry, cyp = (-coef * ry * xp) / rx;
  const ccx = c * cxp - s * cyp + (x1 + x2) / 2, ccy = s * cxp + c * cyp + (y1 + y2) / 2;
  const ang = (ux: number, uy: number, vx: number, vy: number) => Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  const t1 = ang(1, 0, (xp - cxp) / rx, (yp - cyp) / ry);
  let dt = ang((xp - cxp) / rx, (yp - cyp) / ry, (-xp - cxp) / rx, (-yp - cyp) / ry);
  if (!sweep && dt > 0) dt -= 2 * Math.PI;
  if (sweep && dt < 0) dt += 2 * Math.PI;
  const n = Math.max(1, Math.ceil(Math.abs(dt) / (Math.PI / 16)));
  const out: [number, number][] = [];
  for (let k = 1; k < n; k++) {
    const t = t1 + (dt * k) / n;
    out.push([ccx + rx * Math.cos(t) * c - ry * Math.sin(t) * s, ccy + rx * Math.cos(t) * s + ry * Math.sin(t) * c]);
  }
  out.push([x2, y2]);
  return out;
}
