// boundary-lines.ts: the affine model of a crystal's Omega against the direct formula,
// the confirmed interval of a tie line, the probe choice, and the refutation by a known crystal.
import { describe, expect, it } from 'vitest';
import { AffineFrame, BoundaryLines, CrystalModels, lineKey, lowerCrystal, probes } from '../../../src/core/scan/boundary-lines.ts';
import { crystalOmega } from '../../../src/core/scan/boundaries.ts';
import { crystalKey, type Crystal } from '../../../src/core/scan/crystal.ts';
import { applyAxis, parseAxis } from '../../../src/core/scan/axes.ts';
import type { ScanPlan } from '../../../src/core/scan/grid.ts';

const plan: ScanPlan = {
  base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 4, T: 0, maxCell: 6 },
  x: parseAxis('mu=-1:3.9:50', 'x'), y: parseAxis('rb=1:2.5:50', 'y'), seed: 1,
};
const crystal = (a: number, n: number[]): Crystal => ({ cell: { a, b: 0, c: 1 }, n, key: crystalKey({ a, b: 0, c: 1 }, n) });
const half = crystal(2, [1, 0]), third = crystal(3, [1, 0, 0]), quarter = crystal(4, [1, 0, 0, 0]);

describe('boundary lines', () => {
  const frame = AffineFrame.of(plan) as AffineFrame;
  const models = new CrystalModels(frame);

  it('the affine model of Omega equals the direct formula inside the map (Rb read through Rb^6)', () => {
    for (const [mu, rb] of [[0.3, 1.7], [-0.9, 1.05], [3.1, 2.4]]) {
      const p = applyAxis(applyAxis(plan.base, 'mu', mu), 'rb', rb);
      const s = frame.coords([mu, rb]);
      for (const c of [half, third]) expect(models.omega(c, s)).toBeCloseTo(crystalOmega(p, c), 10);
    }
  });

  it('keeps one confirmed interval per line and covers what lies between confirmed points', () => {
    const lines = new BoundaryLines(models);
    const k = lineKey(half, third);
    expect(k).toBe(lineKey(third, half));
    expect(lines.covers(k, 0.3)).toBe(false);
    lines.confirm(k, 0.2);
    lines.confirm(k, 0.6);
    expect(lines.covers(k, 0.35)).toBe(true);
    expect(lines.covers(k, 0.61)).toBe(false);
    expect(lines.interval(k)).toEqual({ lo: 0.2, hi: 0.6 });
    // points of the tie line get parameters in line order
    const a = lines.param(half, third, [0.1, 0.2]), b = lines.param(half, third, [0.1, 0.9]);
    expect(a).not.toBe(b);
  });

  it('probes: the median without an interval, the farthest on each side with one', () => {
    expect(probes([0.5, 0.1, 0.9, 0.3], undefined)).toEqual([0]);
    expect(probes([0.5, 0.1, 0.9, 0.3], { lo: 0.4, hi: 0.6 })).toEqual([1, 2]);
    expect(probes([0.7, 0.9], { lo: 0.4, hi: 0.6 })).toEqual([1]);
    expect(probes([], undefined)).toEqual([]);
  });

  it('a known crystal below a tie refutes it; one above does not', () => {
    // where 1/2 and 1/4 tie, 1/3 (between them on the staircase) lies below both
    // (the interaction energy of the vdw staircase is strictly convex in the density)
    const f = (sx: number) => models.omega(half, [sx, 0.5]) - models.omega(quarter, [sx, 0.5]);
    const sx = f(0) / (f(0) - f(1));
    const s = [sx, 0.5];
    const w = Math.min(models.omega(half, s), models.omega(quarter, s));
    expect(Math.abs(f(sx))).toBeLessThan(1e-9);
    expect(models.omega(third, s)).toBeLessThan(w - 1e-6);
    expect(lowerCrystal(models, [half, third, quarter], s, w, [half.key, quarter.key])?.key).toBe(third.key);
    // not where 1/3 itself is the minimum by far: at the 1/2|1/3 tie nothing known lies below
    expect(lowerCrystal(models, [half, third], s, models.omega(third, s), [half.key, third.key])).toBeNull();
    // the tie's own crystals never refute it
    expect(lowerCrystal(models, [half, quarter], s, w, [half.key, quarter.key])).toBeNull();
  });
});
