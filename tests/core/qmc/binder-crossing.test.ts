// Binder crossings on synthetic curves whose crossing is known in closed form.
// - Straight lines U_1 = a_1 + b_1 x, U_2 = a_2 + b_2 x cross at x* = (a_1 - a_2)/(b_2 - b_1)
//   (closed form, computed here); linear interpolation of their difference is exact, so the
//   tolerance is rounding, 1e-12.
// - The error: (1) closed form of the symmetric case, d = -c and +c at the two bracketing
//   points with equal errors s on each cumulant: x* moves by -h (dd_i + dd_(i+1)) / (4c) to
//   first order, so sigma = h sqrt(2 s^2 + 2 s^2) / (4c) = h s / (2c); (2) the spread of the
//   crossings of 4000 replicas with Gaussian noise of the stated errors (seedrandom, seeded),
//   which must match the reported error within 6 % (the sample standard deviation of 4000
//   draws has a relative error of 1/sqrt(2 * 4000) = 1.1 %: 4 sigma is 4.5 %, plus the
//   second-order bias of a nonlinear x*, below 1 % at this noise level).
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { binderCrossings, crossingsOf, type BinderCurve } from '../../../src/core/qmc/binder-crossing.ts';

const xs = [0, 0.3, 0.6, 0.9, 1.2];
const line = (size: number, a: number, b: number, err = 0.001): BinderCurve => ({ size, x: xs, binder: xs.map((x) => ({ value: a + b * x, error: err })) });

describe('Binder crossings', () => {
  it('two straight lines cross where a_1 + b_1 x = a_2 + b_2 x', () => {
    const [a1, b1, a2, b2] = [0.2, 0.1, 0.1, 0.3];
    const c = crossingsOf(line(8, a1, b1), line(16, a2, b2));
    expect(c).toHaveLength(1);
    expect(c[0].sizes).toEqual([8, 16]);
    expect(Math.abs(c[0].at - (a1 - a2) / (b2 - b1))).toBeLessThan(1e-12); // 0.5
    expect(c[0].between).toEqual([0.3, 0.6]);
  });

  it('the error of a crossing midway between two points is h s / (2c)', () => {
    // d = U_2 - U_1 = -0.04 at x = 0.3 and +0.04 at 0.6: crossing at 0.45, c = 0.04, h = 0.3
    const s = 0.002;
    const c = crossingsOf(line(8, 0.5, 0, s), { size: 16, x: xs, binder: xs.map((x) => ({ value: 0.5 + (x - 0.45) * (0.04 / 0.15), error: s })) });
    expect(c).toHaveLength(1);
    expect(Math.abs(c[0].at - 0.45)).toBeLessThan(1e-12);
    expect(Math.abs(c[0].error - (0.3 * s) / (2 * 0.04))).toBeLessThan(1e-12);
  });

  it('the propagated error matches the scatter of noisy replicas', () => {
    const s = 0.002, rng = seedrandom('binder-crossing');
    const gauss = () => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
    const A = line(8, 0.2, 0.1, s), B = line(16, 0.1, 0.3, s);
    const reported = crossingsOf(A, B)[0].error;
    const noisy = (c: BinderCurve): BinderCurve => ({ ...c, binder: c.binder.map((u) => ({ value: u!.value + s * gauss(), error: s })) });
    const at: number[] = [];
    for (let r = 0; r < 4000; r++) {
      const c = crossingsOf(noisy(A), noisy(B));
      expect(c).toHaveLength(1);
      at.push(c[0].at);
    }
    const mean = at.reduce((p, q) => p + q, 0) / at.length;
    const sd = Math.sqrt(at.reduce((p, q) => p + (q - mean) ** 2, 0) / (at.length - 1));
    expect(Math.abs(sd / reported - 1)).toBeLessThan(0.06);
  });

  it('consecutive sizes pair up; curves that do not cross give nothing; missing cumulants are skipped', () => {
    // three lines through (0.5, 0.25): every pair crosses at 0.5 (closed form)
    const curves = [line(32, 0.25 - 0.5 * 0.9, 0.9), line(8, 0.25 - 0.5 * 0.1, 0.1), line(16, 0.25 - 0.5 * 0.4, 0.4)];
    const c = binderCrossings(curves);
    expect(c.map((x) => x.sizes)).toEqual([[8, 16], [16, 32]]);
    for (const x of c) expect(Math.abs(x.at - 0.5)).toBeLessThan(1e-12);
    expect(crossingsOf(line(8, 0.1, 0.1), line(16, 0.2, 0.1))).toEqual([]);
    const gappy: BinderCurve = { size: 16, x: xs, binder: xs.map((x, i) => (i === 2 ? null : { value: 0.1 + 0.3 * x, error: 0.001 })) };
    const g = crossingsOf(line(8, 0.2, 0.1), gappy);
    expect(g).toHaveLength(1);
    expect(g[0].between).toEqual([0.3, 0.9]); // x = 0.6 has no cumulant; still exact for lines
    expect(Math.abs(g[0].at - 0.5)).toBeLessThan(1e-12);
  });
});

describe('sign changes at a common limit', () => {
  // Fact of the trade (Binder, Z. Phys. B 43, 119 (1981)): deep in the ordered phase every
  // size has U = 2/3, so curves that both sit there cross by noise alone.
  it('a sign change where both sizes sit at U = 2/3 is not a crossing; one across the curves is', () => {
    const x = [0, 1, 2, 3];
    const e = (value: number) => ({ value, error: 0.0005 });
    const small = { size: 4, x, binder: [e(0.6668), e(0.6663), e(0.55), e(0.3)] };
    const large = { size: 8, x, binder: [e(0.6664), e(0.6667), e(0.62), e(0.1)] };
    const c = crossingsOf(small, large);
    expect(c.length).toBe(1);
    expect(c[0].between).toEqual([2, 3]);
  });
});
