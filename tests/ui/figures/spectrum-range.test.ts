/**
 * The branch figure's frequency range and its honesty about what it leaves out (issue 11,
 * item 19): coincident branches found and named together, the low-branch range stops at a
 * large gap, and the figure says what lies outside. Checked on hand-made branches whose
 * answer follows by inspection (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { GAP_FACTOR, branchesFigure, coincidentBranches, lowBranches } from '../../../src/ui/figures/spectrum-figure.ts';
import type { StateSpectrum } from '../../../src/core/spectrum/state-spectrum.ts';

const flat = (w: number, n = 5) => new Array<number>(n).fill(w);

describe('coincident branches', () => {
  it('groups branches equal at every path point and only those', () => {
    // two flat bands of equal sublattices (0.8 g twice), one that touches them at one point only, one far above
    const touch = [0.8, 0.9, 1.0, 1.1, 1.2];
    expect(coincidentBranches([flat(0.8), flat(0.8), touch, flat(22)])).toEqual([[0, 1], [2], [3]]);
  });
});

describe('low branches', () => {
  it('stop at a branch whose minimum lies far above the range so far', () => {
    // top so far 1.2 g: a branch from 2 g joins (2 < 3 x 1.2 + 0.5), one at 22 g does not
    expect(GAP_FACTOR * 1.2 + 0.5).toBeGreaterThan(2);
    const low = lowBranches([flat(22), [0.8, 0.9, 1.0, 1.1, 1.2], flat(2)]);
    expect(low.map((l) => l[0])).toEqual([0.8, 2]);
  });
});

describe('branches figure', () => {
  /** A hand-made 1D spectrum: branches at each of five path points, the photon at k = 0 only. */
  function spectrum(omega: number[][]): StateSpectrum {
    const s = [0, Math.PI / 4, Math.PI / 2, (3 * Math.PI) / 4, Math.PI];
    return {
      branches: s.map((x, i) => ({ k: x, s: x, omega: omega.map((b) => b[i]), growth: 0 })),
      ticks: [{ s: 0, label: 'Gamma' }, { s: Math.PI, label: 'pi' }],
      zoneCentre: { omega: omega.map((b) => b[0]), photonWeight: omega.map(() => 0) },
      margins: s.map(() => 1), softMode: { k: 0, margin: 1, kind: 'emitter', stable: true },
    } as unknown as StateSpectrum;
  }

  it('names every branch, coincident ones together, and counts what the low range leaves out', () => {
    const sp = spectrum([flat(0.8), flat(0.8), flat(22)]);
    const low = branchesFigure(sp, 900, 400, 'test');
    expect(low.svg).toContain('branches 1 = 2 (2-fold)');
    expect(low.svg).toContain('branch 3');
    expect(low.svg).toContain('outside the range: 1 branch (up to \u03c9 = 22 g)');
    // the y domain of the low range ends well below the far branch
    expect(Math.max(...low.frame.y.domain)).toBeLessThan(2);
    // a photon-like mode at k = 0 near the low branches joins their range
    const withPhoton = spectrum([flat(0.8), flat(22)]);
    withPhoton.branches[0].omega.push(1.9);
    withPhoton.zoneCentre = { omega: [0.8, 1.9, 22], photonWeight: [0, 0.9, 0] };
    const near = branchesFigure(withPhoton, 900, 400, 'test');
    expect(Math.max(...near.frame.y.domain)).toBeGreaterThan(1.9);
    expect(Math.max(...near.frame.y.domain)).toBeLessThan(22);
    const all = branchesFigure(sp, 900, 400, 'test', 'all');
    expect(Math.max(...all.frame.y.domain)).toBeGreaterThan(22);
    expect(all.svg).not.toContain('outside the range');
  });

  it('keeps the legend below the axis on a narrow figure, the plot area over half its width', () => {
    const f = branchesFigure(spectrum([flat(0.8), flat(1.5)]), 380, 260, 'test');
    expect(f.frame.inner.x1 - f.frame.inner.x0).toBeGreaterThan(380 / 2);
    expect(f.frame.height).toBeGreaterThan(260);
  });
});
