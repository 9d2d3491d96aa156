/**
 * Lines where a function f(u, v) on the unit square changes sign, traced rather than read
 * off a dense grid (the soft-mode lines of soft-lines.ts; f = the stability margin):
 *
 *  1. seeds: f on a coarse n x n grid; every grid edge whose ends have opposite signs is a
 *     seed, and a line starts from a seed not yet passed by an earlier line (its crossing
 *     located by bisection to `tol` only then);
 *  2. from each seed not yet passed, the line is followed both ways by predictor-corrector
 *     continuation: step h along the tangent, then bracket the sign change along the normal
 *     (from a width set by the previous correction, growing x4 up to h; first on the side
 *     the signs point to) and bisect, until the bracket is below `tol` or the midpoint
 *     shows that linear interpolation inside it is good to tol/4; the point is that
 *     interpolation;
 *  3. step control on the chord error: a step that turns by theta over length L departs
 *     from the curve by about L theta / 4 (the sagitta of the arc), or L^2 kappa / 8 with
 *     kappa the curvature of the circle through the last three points, whichever is
 *     larger; it is rejected above tol and the next h is scaled by 0.9 sqrt(tol/(2 error))
 *     (at most x1.6, at most half the seed spacing); a step that finds no bracket or turns
 *     by more than 45 degrees is halved;
 *     below 4 tol the line ends (the function no longer changes sign there, or is
 *     undefined: f = null, the followed phase does not exist);
 *  4. a line ends at the boundary of the square (its last point corrected along the
 *     boundary) or closes on its start.
 *
 * A point whose final bracket still has |f| > 0.1 at both ends marks a jump of f (a
 * first-order change of the followed solution), not a soft line. Lines shorter than the
 * seed spacing that cross no seed-grid edge are not found.
 */

export interface Sampled<P> {
  value: number | null;
  payload: P;
}

export interface LinePoint<P> {
  u: number;
  v: number;
  /** Payload of the evaluation nearest the line. */
  payload: P;
  jump: boolean;
}

export interface ZeroLine<P> {
  points: LinePoint<P>[];
  closed: boolean;
}

export interface TraceOptions {
  /** Seed grid nodes per axis (>= 2). */
  seed: number;
  /** Accuracy in units of the square's side. */
  tol: number;
  /** Stop after this many evaluations (default 200000). */
  maxEvaluations?: number;
}

type P2 = [number, number];

/** Sign classes: a zero counts as positive, so a node exactly on a line brackets once. */
const pos = (x: number) => x >= 0;

/** A seed-grid edge with a sign change; `guess` is the linear interpolation of its end values (no evaluation). */
interface Seed<P> { a: P2; b: P2; fa: Sampled<P>; fb: Sampled<P>; guess: P2; visited: boolean }

/** Trace every zero line of f found from the seed grid. */
export function traceZeroLines<P>(f: (u: number, v: number) => Sampled<P>, o: TraceOptions): { lines: ZeroLine<P>[]; evaluations: number } {
  const n = Math.max(2, Math.round(o.seed)), tol = o.tol, maxEval = o.maxEvaluations ?? 200000;
  const dx = 1 / (n - 1);
  let evaluations = 0;
  const ev = (p: P2): Sampled<P> => { evaluations++; return f(p[0], p[1]); };
  const grid: Sampled<P>[] = [];
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) grid.push(ev([i * dx, j * dx]));
  const seeds: Seed<P>[] = [];
  const edge = (i0: number, j0: number, i1: number, j1: number) => {
    const fa = grid[j0 * n + i0], fb = grid[j1 * n + i1];
    if (fa.value === null || fb.value === null || pos(fa.value) === pos(fb.value)) return;
    const a: P2 = [i0 * dx, j0 * dx], b: P2 = [i1 * dx, j1 * dx];
    const t = (fa.value as number) / ((fa.value as number) - (fb.value as number));
    seeds.push({ a, b, fa, fb, guess: [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])], visited: false });
  };
  const inside = (p: P2) => p[0] >= -1e-12 && p[0] <= 1 + 1e-12 && p[1] >= -1e-12 && p[1] <= 1 + 1e-12;

  /** Bisection between opposite signs to tol; the point by linear interpolation. */
  function bisect(a: P2, fa: Sampled<P>, b: P2, fb: Sampled<P>): LinePoint<P> {
    let w = Math.hypot(b[0] - a[0], b[1] - a[1]);
    while (w > tol && evaluations < maxEval) {
      const m: P2 = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
      const fm = ev(m);
      if (fm.value === null) break;
      // The midpoint's departure from the chord measures the error of linear interpolation
      // over [a, b] (f'' w^2 / 8 against f' w); over the half bracket it is a quarter of that.
      const va = fa.value as number, vb = fb.value as number;
      const err = (Math.abs(fm.value - (va + vb) / 2) / Math.abs(vb - va)) * w / 4;
      if (pos(fm.value) !== pos(va)) { b = m; fb = fm; } else { a = m; fa = fm; }
      w /= 2;
      if (err < tol / 4) break;
    }
    const va = fa.value as number, vb = fb.value as number;
    const t = va === vb ? 0.5 : va / (va - vb);
    return {
      u: a[0] + t * (b[0] - a[0]), v: a[1] + t * (b[1] - a[1]),
      payload: Math.abs(va) <= Math.abs(vb) ? fa.payload : fb.payload,
      jump: Math.min(Math.abs(va), Math.abs(vb)) > 0.1,
    };
  }

  /**
   * Bracket the sign change along d through q and bisect; null if none within h. sigma is
   * the sign of df/dd along the line (fixed by the direction of travel), so the search goes
   * to the side where f has the other sign: widths w0, 4 w0, ... up to h, then the other side.
   */
  function correct(q: P2, d: P2, h: number, sigma: number, w0: number): LinePoint<P> | null {
    const fq = ev(q);
    if (fq.value === null) return null;
    const first = fq.value > 0 ? -sigma : sigma;
    for (const s of [first, -first]) {
      let a = q, fa = fq;
      for (let w = Math.min(w0, h); ; w = Math.min(4 * w, h)) {
        const p: P2 = [q[0] + s * w * d[0], q[1] + s * w * d[1]];
        if (!inside(p)) break;
        const fp = ev(p);
        if (fp.value === null) break;
        if (pos(fp.value) !== pos(fq.value)) return bisect(a, fa, p, fp);
        a = p; fa = fp;
        if (w >= h) break;
      }
    }
    return null;
  }

  function markVisited(p: P2, r: P2): void {
    for (const s of seeds) {
      if (s.visited) continue;
      // passed: the chord crosses the seed's edge, or ends on it (a line ending on the
      // boundary), or runs through its interpolated crossing (a line through a grid node).
      if (segmentsCross(p, r, s.a, s.b) || toSegment(r, s.a, s.b) < 4 * tol || toSegment(p, s.a, s.b) < 4 * tol ||
        toSegment(s.guess, p, r) < 4 * tol) s.visited = true;
    }
  }

  /** Follow the line from p0 along t0; returns the points after p0. */
  function march(p0: P2, t0: P2, sigma: number): { pts: LinePoint<P>[]; closed: boolean } {
    const pts: LinePoint<P>[] = [];
    let prev = p0, t = t0, h = dx / 2, w0 = dx / 8;
    let before: P2 | null = null;
    const hmin = 4 * tol;
    while (evaluations < maxEval) {
      let q: P2 = [prev[0] + h * t[0], prev[1] + h * t[1]];
      let dir: P2 = [-t[1], t[0]];
      let atEdge = false;
      if (!inside(q)) {
        const hb = stepToBoundary(prev, t);
        if (hb < hmin / 4) break;
        h = hb;
        q = [prev[0] + hb * t[0], prev[1] + hb * t[1]];
        dir = Math.abs(q[0]) < 1e-9 || Math.abs(q[0] - 1) < 1e-9 ? [0, 1] : [1, 0];
        atEdge = true;
      }
      // On the boundary the correction runs along the side; sigma there is the sign of df/ds along it.
      const sg = atEdge ? Math.sign(dir[0] * -t[1] + dir[1] * t[0]) * sigma || sigma : sigma;
      const c = correct(q, dir, Math.min(h, dx), sg, w0);
      if (!c) { h /= 2; w0 = Math.min(w0, h / 4); if (h < hmin) break; continue; }
      const d: P2 = [c.u - prev[0], c.v - prev[1]];
      const len = Math.hypot(d[0], d[1]);
      const cosT = len > 0 ? (d[0] * t[0] + d[1] * t[1]) / len : -1;
      const theta = Math.acos(Math.max(-1, Math.min(1, cosT)));
      if (theta > Math.PI / 4 || len < 0.2 * h) { h /= 2; if (h < hmin) break; continue; }
      // Sagitta from the turn against the predicted tangent, and from the curvature of the
      // circle through the last three points (Menger curvature 4 area / (abc)), whichever is larger.
      let err = (len * theta) / 4;
      if (before) err = Math.max(err, (len * len * menger(before, prev, [c.u, c.v])) / 8);
      if (err > tol && atEdge && h > 2 * hmin) { h /= 2; continue; } // step inside first, then to the edge
      if (err > tol && h > hmin && !atEdge) { h = Math.max(hmin, h * Math.max(0.25, 0.8 * Math.sqrt(0.5 * tol / err))); continue; }
      const r: P2 = [c.u, c.v];
      // The next bracket: four times this correction, at least 2 tol.
      w0 = Math.max(2 * tol, 4 * Math.hypot(c.u - q[0], c.v - q[1]));
      markVisited(prev, r);
      pts.push(c);
      // Next tangent: the chord direction turned once more by the same angle.
      const dh: P2 = [d[0] / len, d[1] / len];
      const tn: P2 = [2 * dh[0] - t[0], 2 * dh[1] - t[1]];
      const tl = Math.hypot(tn[0], tn[1]) || 1;
      t = [tn[0] / tl, tn[1] / tl];
      h = Math.min(dx / 2, h * Math.min(1.6, 0.9 * Math.sqrt(0.5 * tol / Math.max(err, 1e-16))));
      if (atEdge) break;
      if (pts.length >= 3 && Math.hypot(r[0] - p0[0], r[1] - p0[1]) < Math.max(h, 4 * tol)) return { pts, closed: true };
      before = prev;
      prev = r;
    }
    return { pts, closed: false };
  }

  for (let j = 0; j < n; j++) for (let i = 0; i + 1 < n; i++) edge(i, j, i + 1, j);
  for (let j = 0; j + 1 < n; j++) for (let i = 0; i < n; i++) edge(i, j, i, j + 1);
  const lines: ZeroLine<P>[] = [];
  for (const s of seeds) {
    if (s.visited || evaluations >= maxEval) continue;
    s.visited = true;
    // Seeds are bisected only when a line starts from them; the others are passed by a march.
    const at = bisect(s.a, s.fa, s.b, s.fb);
    const p0: P2 = [at.u, at.v];
    const t0 = tangentAt(p0, s);
    if (!t0) { lines.push({ points: [at], closed: false }); continue; }
    // t0 = (-g_v, g_u)/|g|: the normal (-t_v, t_u) is -g going forward (f falls along it), +g back.
    const fwd = march(p0, t0, -1);
    if (fwd.closed) { lines.push({ points: [at, ...fwd.pts], closed: true }); continue; }
    const back = march(p0, [-t0[0], -t0[1]], 1);
    lines.push({ points: [...back.pts.reverse(), at, ...fwd.pts], closed: false });
  }
  return { lines, evaluations };

  /** Tangent at a seed from finite differences of f (a quarter grid spacing). */
  function tangentAt(p: P2, s: Seed<P>): P2 | null {
    const e = dx / 4;
    const sgn = (q: P2) => { const r = inside(q) ? ev(q).value : null; return r; };
    const fu = sgn([p[0] + e, p[1]]) ?? (() => { const r = sgn([p[0] - e, p[1]]); return r === null ? null : -r; })();
    const fv = sgn([p[0], p[1] + e]) ?? (() => { const r = sgn([p[0], p[1] - e]); return r === null ? null : -r; })();
    let g: P2;
    if (fu === null || fv === null) g = [s.b[0] - s.a[0], s.b[1] - s.a[1]];
    else g = [fu, fv];
    const gl = Math.hypot(g[0], g[1]);
    return gl > 0 ? [-g[1] / gl, g[0] / gl] : null;
  }
}

/** Largest step along t (unit) from p that stays inside the unit square. */
function stepToBoundary(p: P2, t: P2): number {
  let h = Infinity;
  for (const a of [0, 1] as const) {
    if (t[a] > 0) h = Math.min(h, (1 - p[a]) / t[a]);
    else if (t[a] < 0) h = Math.min(h, -p[a] / t[a]);
  }
  return Math.max(0, h);
}

/** Curvature of the circle through three points. */
function menger(a: P2, b: P2, c: P2): number {
  const area2 = Math.abs((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]));
  const l = Math.hypot(b[0] - a[0], b[1] - a[1]) * Math.hypot(c[0] - b[0], c[1] - b[1]) * Math.hypot(c[0] - a[0], c[1] - a[1]);
  return l > 0 ? (2 * area2) / l : 0;
}

/** Distance from x to the segment pq. */
function toSegment(x: P2, p: P2, q: P2): number {
  const ux = q[0] - p[0], uy = q[1] - p[1], L2 = ux * ux + uy * uy;
  const t = L2 > 0 ? Math.max(0, Math.min(1, ((x[0] - p[0]) * ux + (x[1] - p[1]) * uy) / L2)) : 0;
  return Math.hypot(x[0] - p[0] - t * ux, x[1] - p[1] - t * uy);
}

/** Do segments pq and ab cross? */
function segmentsCross(p: P2, q: P2, a: P2, b: P2): boolean {
  const o = (x: P2, y: P2, z: P2) => (y[0] - x[0]) * (z[1] - x[1]) - (y[1] - x[1]) * (z[0] - x[0]);
  const d1 = o(a, b, p), d2 = o(a, b, q), d3 = o(p, q, a), d4 = o(p, q, b);
  return d1 * d2 < 0 && d3 * d4 < 0;
}
