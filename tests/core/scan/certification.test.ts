// The certification argument (docs/certified-maps.md) and its pieces, in-process.
// Exact equality is used where the same code runs on the same inputs (common practice, no
// source); the boundary crossing is checked against a closed form computed in the test.
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import { crystalKey, crystalOf } from '../../../src/core/scan/crystal.ts';
import { affineCrossing, chainBoundaries, crossing, crystalOmega } from '../../../src/core/scan/boundaries.ts';
import { affineCoordinate, certificationBlocker } from '../../../src/core/scan/affine-axes.ts';
import { coarseColumns, coarseRows, refineLevel, segmentCrystal } from '../../../src/core/scan/refinement.ts';
import { parseAxis } from '../../../src/core/scan/axes.ts';
import type { ModelParams } from '../../../src/core/model.ts';

const chain = (mu: number, Rb: number): ModelParams => ({ lattice: 'chain', interaction: { shape: 'vdw', Rb }, delta: 4, T: 0, maxCell: 8, mu });

describe('crystals', () => {
  it('names a pattern by its class: translates are one crystal, other patterns are not', () => {
    expect(crystalKey({ a: 3, b: 0, c: 1 }, [1, 0, 0])).toBe(crystalKey({ a: 3, b: 0, c: 1 }, [0, 0, 1]));
    expect(crystalKey({ a: 3, b: 0, c: 1 }, [1, 1, 0])).not.toBe(crystalKey({ a: 3, b: 0, c: 1 }, [1, 0, 0]));
  });

  it('a solved density wave at T = 0 is a crystal, a condensate and a T > 0 state are not', () => {
    const dw = solveGroundState(chain(1.5, 1.6));
    expect(dw.phase).toBe('density-wave');
    expect(crystalOf(dw)).not.toBeNull();
    expect(crystalOf(solveGroundState(chain(-0.1, 1.6)))).toBeNull(); // superradiant just above mu_c = 2 - sqrt(5)
    expect(crystalOf(solveGroundState({ ...chain(1.5, 1.6), T: 0.05 }))).toBeNull();
  });

  it("the fixed crystal's Omega is the solver's Omega at the point where it wins", () => {
    const s = solveGroundState(chain(1.5, 1.6));
    const c = crystalOf(s)!;
    // same formula, same J: equal to rounding (1e-12 relative, a few ulps of the sums)
    expect(Math.abs(crystalOmega(chain(1.5, 1.6), c) - s.grandPotential)).toBeLessThan(1e-12 * Math.max(1, Math.abs(s.grandPotential)));
  });

  it('Omega of a fixed crystal is affine in mu and in Rb^6 (the premise of the argument)', () => {
    const c = crystalOf(solveGroundState(chain(1.5, 1.6)))!;
    const f = (mu: number, u: number) => crystalOmega(chain(mu, u ** (1 / 6)), c);
    // second differences vanish to rounding (1e-9: Rb^(1/6) round trips and lattice sums)
    expect(Math.abs(f(0.5, 20) - 2 * f(1.5, 20) + f(2.5, 20))).toBeLessThan(1e-9);
    expect(Math.abs(f(1.5, 10) - 2 * f(1.5, 20) + f(1.5, 30))).toBeLessThan(1e-9);
  });
});

describe('the certification argument, checked by solving', () => {
  it('a crystal found at the four corners of a rectangle is the minimum at random points inside', () => {
    // corners chosen inside the 1/2 plateau of the vdw chain (delta 4)
    const xs = [1.2, 1.8], ys = [1.25, 1.35];
    const keys = xs.flatMap((mu) => ys.map((rb) => crystalOf(solveGroundState(chain(mu, rb)))?.key));
    expect(keys[0]).toBeDefined();
    expect(new Set(keys).size).toBe(1);
    const rng = seedrandom('certified-rectangle');
    for (let k = 0; k < 12; k++) {
      const mu = xs[0] + (xs[1] - xs[0]) * rng(), rb = ys[0] + (ys[1] - ys[0]) * rng();
      expect(crystalOf(solveGroundState(chain(mu, rb), { seed: k + 1 }))?.key).toBe(keys[0]);
    }
  });

  it('says why a plan cannot be certified', () => {
    const base = chain(1, 1.5);
    expect(certificationBlocker({ base, x: parseAxis('mu=0:1:3', 'x'), y: parseAxis('rb=1:2:3', 'y'), seed: 1 })).toBeNull();
    expect(certificationBlocker({ base, x: parseAxis('mu=0:1:3', 'x'), y: parseAxis('temperature=0:1:3', 'y'), seed: 1 })).toMatch(/temperature/);
    expect(certificationBlocker({ base: { ...base, T: 0.1 }, x: parseAxis('mu=0:1:3', 'x'), seed: 1 })).toMatch(/T > 0/);
    expect(affineCoordinate('rb', 2, base)).toBe(64); // u = Rb^6 for vdw
  });
});

describe('refinement and boundaries', () => {
  it('coarse columns are the segment starts and the last column; coarse rows every 16', () => {
    expect(coarseColumns(40)).toEqual([0, 14, 27, 39]); // rowCuts(40) = 14, 13, 13
    expect(coarseRows(40)).toEqual([0, 16, 32, 39]);
  });

  it('certifies a rectangle of one crystal and splits one whose corners differ', () => {
    const a = solveGroundState(chain(1.5, 1.3)), b = solveGroundState(chain(-0.8, 1.3)); // 1/2 wave, empty
    const lvl = refineLevel([{ x0: 0, x1: 4, y0: 0, y1: 4 }, { x0: 4, x1: 8, y0: 0, y1: 4 }], (x) => crystalOf(x <= 4 ? a : b));
    expect(lvl.certified.map((c) => c.rect)).toEqual([{ x0: 0, x1: 4, y0: 0, y1: 4 }]);
    expect(lvl.children).toHaveLength(4);
  });

  it('the segment argument: a point between two pixels of one crystal on a line is that crystal, and solving agrees', () => {
    // on the row Rb = 1.3 the 1/2 wave holds at mu = 1.2 and 1.8 (solved): every mu between is
    // the 1/2 wave (solved again here at three points); empty at -0.8 beside it settles nothing
    const half = crystalOf(solveGroundState(chain(1.2, 1.3))), again = crystalOf(solveGroundState(chain(1.8, 1.3)));
    const empty = crystalOf(solveGroundState(chain(-0.8, 1.3)));
    expect(half && again && empty).toBeTruthy();
    expect(again?.key).toBe(half?.key);
    const mu = (x: number) => 1.2 + 0.1 * (x - 2); // pixels 2..8 span mu 1.2..1.8
    const row = (x: number, y: number) => (y !== 0 ? undefined : x === 2 ? half : x === 8 ? again : x === 0 ? empty : undefined);
    for (const x of [3, 5, 7]) {
      expect(segmentCrystal(x, 0, row, 10, 0, 0)?.key).toBe(half?.key);
      expect(crystalOf(solveGroundState(chain(mu(x), 1.3)))?.key).toBe(half?.key);
    }
    // between empty (x = 0) and the wave (x = 2): different crystals, nothing settled
    expect(segmentCrystal(1, 0, row, 10, 0, 0)).toBeNull();
    // past the last classified pixel on the row: no right end
    expect(segmentCrystal(9, 0, row, 10, 0, 0)).toBeNull();
    // a column: the same crystal below and above (rows 0..4)
    const col = (x: number, y: number) => (x !== 3 ? undefined : y === 0 || y === 4 ? half : undefined);
    expect(segmentCrystal(3, 2, col, 10, 0, 4)?.key).toBe(half?.key);
    // a known non-crystal end (null) settles nothing
    expect(segmentCrystal(3, 2, (x, y) => (x !== 3 ? undefined : y === 0 ? half : y === 4 ? null : undefined), 10, 0, 4)).toBeNull();
  });

  it('the affine crossing is the closed-form zero of a linear function', () => {
    // f(t) = 3 - 7 t vanishes at t = 3/7
    expect(affineCrossing(3, -4)).toBeCloseTo(3 / 7, 15);
    expect(affineCrossing(1, 2)).toBeNull();
  });

  it('chains crossings of one pair across 2 x 2 blocks into one polyline', () => {
    // a vertical boundary between columns 0 and 1 of a 2 x 3 map: crossings on h0, h2, h4
    const cs = [0, 1, 2].map((iy) => crossing(`h${iy * 2}`, 'A', 'B', [0.5, iy], true, 0, 1));
    const b = chainBoundaries(cs, 2, 3, (ix, iy) => [ix + 0.5, iy + 0.5]);
    expect(b).toHaveLength(1);
    expect(b[0].points.map((p) => p[1]).sort()).toEqual([0, 1, 2]);
    expect(b[0]).toMatchObject({ phases: ['A', 'B'], firstOrder: true, densityJump: 1 });
  });
});
