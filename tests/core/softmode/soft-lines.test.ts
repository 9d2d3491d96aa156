import { describe, it, expect } from 'vitest';
import { traceZeroLines } from '../../../src/core/softmode/zero-line-trace.ts';
import { softLines } from '../../../src/core/softmode/soft-lines.ts';
import { rangeInteraction } from '../../../src/core/softmode/plane.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { SOURCES, expectAbs } from '../../references.ts';

/** Distance from (x, y) to a polyline. */
function distance(p: [number, number], line: [number, number][]): number {
  let d = Infinity;
  for (let i = 1; i < line.length; i++) {
    const [a, b] = [line[i - 1], line[i]];
    const ux = b[0] - a[0], uy = b[1] - a[1], L2 = ux * ux + uy * uy;
    const t = L2 > 0 ? Math.max(0, Math.min(1, ((p[0] - a[0]) * ux + (p[1] - a[1]) * uy) / L2)) : 0;
    d = Math.min(d, Math.hypot(p[0] - a[0] - t * ux, p[1] - a[1] - t * uy));
  }
  return d;
}

describe('zero-line tracing on closed forms (common practice, no source)', () => {
  it('a circle: one closed line, points on it to tol, chords within 2 tol', () => {
    const tol = 1e-4;
    const r = traceZeroLines((u, v) => ({ value: Math.hypot(u - 0.5, v - 0.45) - 0.3, payload: 0 }), { seed: 9, tol });
    expect(r.lines).toHaveLength(1);
    expect(r.lines[0].closed).toBe(true);
    const pts = r.lines[0].points;
    for (let i = 0; i < pts.length; i++) {
      expect(Math.abs(Math.hypot(pts[i].u - 0.5, pts[i].v - 0.45) - 0.3)).toBeLessThan(tol);
      const q = pts[(i + 1) % pts.length];
      // chord midpoint: the step control keeps the sagitta near tol (2 tol allowed, plus tol for the ends)
      expect(Math.abs(Math.hypot((pts[i].u + q.u) / 2 - 0.5, (pts[i].v + q.v) / 2 - 0.45) - 0.3)).toBeLessThan(3 * tol);
    }
  });

  it('two open lines across the square: both found, ends on the boundary, undefined regions end lines', () => {
    const tol = 1e-4;
    const f = (u: number, v: number) => ({ value: u > 0.8 ? null : Math.sin(2 * Math.PI * (v - 0.3 * u - 0.1)), payload: 0 });
    const r = traceZeroLines(f, { seed: 9, tol });
    // zeros at v = 0.3u + 0.1 + j/2 for u <= 0.8: j = 0 from (0, 0.1), j = 1 from (0, 0.6)
    const longLines = r.lines.filter((L) => L.points.length > 3);
    expect(longLines.length).toBe(2);
    for (const L of longLines) {
      for (const p of L.points) expect(Math.abs(Math.sin(2 * Math.PI * (p.v - 0.3 * p.u - 0.1)))).toBeLessThan(2 * Math.PI * 2 * tol);
      const us = L.points.map((p) => p.u);
      expect(Math.min(...us)).toBeLessThan(1e-9);
      // the line stops where f becomes undefined, within the bracket of the last step
      expect(Math.max(...us)).toBeGreaterThan(0.79);
      expect(Math.max(...us)).toBeLessThanOrEqual(0.8);
    }
  });
});

describe('soft-mode lines of the model', () => {
  it(`normal state, (mu, T) plane, no interaction: the superradiant line on (delta - mu) = tanh(|mu|/2T)/|mu| (${SOURCES.heppLieb})`, () => {
    const delta = 1, tol = 1e-3;
    const res = softLines({
      base: { lattice: 'chain', interaction: { shape: 'nn', V1: 0 }, mu: 0, delta, T: 0 },
      x: { name: 'mu', start: -1.5, stop: -0.05, count: 7 }, y: { name: 'temperature', start: 0, stop: 1, count: 7 },
      range: 'nn', phase: 'normal', tol,
    });
    expect(res.lines).toHaveLength(1);
    // the exact line, sampled by bisection in mu at 400 temperatures (and T = 0: the lower polariton)
    const exact: [number, number][] = [];
    for (let i = 0; i <= 400; i++) {
      const T = i / 400;
      let lo = -1.5, hi = -0.05;
      const F = (mu: number) => (T === 0 ? (delta - mu) * -mu - 1 : (delta - mu) - Math.tanh(-mu / (2 * T)) / -mu);
      if (F(lo) * F(hi) > 0) continue;
      for (let k = 0; k < 60; k++) { const m = (lo + hi) / 2; if (F(m) * F(lo) > 0) lo = m; else hi = m; }
      exact.push([(lo + 1.5) / 1.45, T]);
    }
    expectAbs(exact[0][0] * 1.45 - 1.5, delta / 2 - Math.sqrt(delta * delta / 4 + 1), 1e-12);
    for (const p of res.lines[0].points) {
      // distance in units of the axis spans; the exact polyline's own chord error is < 1e-5
      expect(distance([(p.x + 1.5) / 1.45, p.y], exact)).toBeLessThan(2 * tol);
      expect(p.k).toBe(0);
      expect(p.kind).toBe('photon');
    }
  });

  it('uniform condensate, (mu, V1) plane, nn chain: the density-wave line 1 = 2 V1 alpha^2/(4E^3) with k* = pi', () => {
    const delta = 1, tol = 1e-3;
    const res = softLines({
      base: { lattice: 'chain', interaction: { shape: 'nn', V1: 1 }, mu: 0, delta, T: 0 },
      x: { name: 'mu', start: -0.5, stop: 0.6, count: 7 }, y: { name: 'v1', start: 0.5, stop: 3, count: 7 },
      range: 'nn', phase: 'condensate', tol,
    });
    expect(res.lines.length).toBeGreaterThanOrEqual(1);
    // closed form of the margin (stability test): 1 + V(pi) alpha^2/(4E^3), V(pi) = -2 V1
    const margin = (mu: number, V1: number) => {
      const E = 1 / (2 * (delta - mu)), V0 = 2 * V1;
      const xi = (V0 / 2 - mu) / (1 + V0 / (4 * E));
      return 1 - (2 * V1 * (E * E - xi * xi / 4)) / (4 * E ** 3);
    };
    let n = 0;
    for (const L of res.lines) for (const p of L.points) {
      let lo = 0.5, hi = 3;
      for (let k = 0; k < 60; k++) { const m = (lo + hi) / 2; if (margin(p.x, m) > 0) lo = m; else hi = m; }
      // tol in units of the span, both axes: the V1 error is at most tol / (slope of the line) in span units; 3 tol allows slopes down to 1/3 and chord rounding
      expect(Math.abs(p.y - lo) / 2.5).toBeLessThan(3 * tol);
      expectAbs(p.k as number, Math.PI, 1e-12);
      expect(p.kind).toBe('density');
      n++;
    }
    expect(n).toBeGreaterThan(5);
  });

  it('ranges: nn and vdw:1 give the same line; the full vdw sum moves it', () => {
    const req = {
      base: { lattice: 'chain' as const, interaction: { shape: 'vdw' as const, Rb: 1 }, mu: 0, delta: 1, T: 0 },
      x: { name: 'mu' as const, start: -0.5, stop: 0.6, count: 5 }, y: { name: 'rb' as const, start: 0.9, stop: 1.3, count: 5 },
      phase: 'condensate' as const, tol: 1e-3,
    };
    const nn = softLines({ ...req, range: 'nn' }), v1 = softLines({ ...req, range: 'vdw:1' }), vinf = softLines({ ...req, range: 'vdw:inf' });
    const pts = (r: typeof nn) => r.lines.flatMap((L) => L.points);
    expect(pts(nn).length).toBeGreaterThan(3);
    expect(pts(v1).length).toBe(pts(nn).length);
    pts(nn).forEach((p, i) => { expectAbs(p.x, pts(v1)[i].x, 1e-12); expectAbs(p.y, pts(v1)[i].y, 1e-12); });
    // the longer-range tail adds repulsion at the next-nearest distance, which stabilises the
    // k = pi order less: the full sum's line lies at a different rb (by more than the tolerance)
    const yAt = (r: typeof nn) => pts(r).reduce((a, p) => a + p.y, 0) / pts(r).length;
    expect(Math.abs(yAt(vinf) - yAt(nn))).toBeGreaterThan(1e-3);
  });

  it('refuses unknown range tokens and equal axes', () => {
    expect(() => rangeInteraction('yukawa', { shape: 'vdw', Rb: 1 })).toThrow(InputError);
    expect(() => rangeInteraction('vdw:-1', { shape: 'vdw', Rb: 1 })).toThrow(InputError);
    expect(() => softLines({
      base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1 }, mu: 0, delta: 1, T: 0 },
      x: { name: 'mu', start: 0, stop: 1, count: 5 }, y: { name: 'mu', start: 0, stop: 1, count: 5 }, range: 'vdw', phase: 'condensate',
    })).toThrow(InputError);
    expect(rangeInteraction('nn', { shape: 'vdw', Rb: 1.1 })).toEqual({ shape: 'nn', V1: 2 * 1.1 ** 6, V2: undefined });
  });
});
