import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { realEigenDecomposition } from '../../../src/core/numerics/real-eigen.ts';
import { ConvergenceError } from '../../../src/core/convergence-error.ts';
import { SOURCES, expectAbs } from '../../references.ts';

/** max over columns of |A v - lambda v| / |v| for the decomposition (complex pairs included). */
function residual(n: number, A: Float64Array, ev: ReturnType<typeof realEigenDecomposition>): number {
  let worst = 0;
  for (let j = 0; j < n; j++) {
    const lr = ev.re[j], li = ev.im[j];
    const p = li === 0 ? -1 : li > 0 ? j : j - 1, sign = li >= 0 ? 1 : -1;
    const vr = Array.from({ length: n }, (_, i) => (li === 0 ? ev.V.get(i, j) : ev.V.get(i, p)));
    const vi = Array.from({ length: n }, (_, i) => (li === 0 ? 0 : sign * ev.V.get(i, p + 1)));
    let num = 0, den = 0;
    for (let i = 0; i < n; i++) {
      let ar = 0, ai = 0;
      for (let k = 0; k < n; k++) { ar += A[i * n + k] * vr[k]; ai += A[i * n + k] * vi[k]; }
      num += (ar - (lr * vr[i] - li * vi[i])) ** 2 + (ai - (lr * vi[i] + li * vr[i])) ** 2;
      den += vr[i] ** 2 + vi[i] ** 2;
    }
    worst = Math.max(worst, Math.sqrt(num / den));
  }
  return worst;
}

describe(`real eigensolver with a capped QR iteration (${SOURCES.wilkinsonReinsch})`, () => {
  it('the zero-trace Hopfield matrix of the empty state (delta 2, mu -1.5), on which the uncapped hqr2 spins for ever', () => {
    // Linear map of the fluctuations about the empty state at k = 0, layout [da, db, u, v]
    // (spectrum/linearised.ts). Eigenvalues +- i omega with omega = delta/2 - mu +- sqrt(delta^2/4 + 1)
    // (SOURCES.hopfield); tolerance 1e-12, exact arithmetic on a 4 x 4 problem.
    const A = Float64Array.from([0, 3.5, -0.5, 0, -3.5, 0, 0, -0.5, 2, 0, 0, 1.5, 0, 2, -1.5, 0]);
    const ev = realEigenDecomposition(4, A);
    const omegas = Array.from(ev.im).filter((x) => x > 0).sort((a, b) => a - b);
    expectAbs(omegas[0], 2.5 - Math.SQRT2, 1e-12);
    expectAbs(omegas[1], 2.5 + Math.SQRT2, 1e-12);
    ev.re.forEach((x) => expectAbs(x, 0, 1e-12));
    expect(residual(4, A, ev)).toBeLessThan(1e-12);
  });

  it('the thermal normal state (delta -1, mu -3.2146, T 10), on which the QR sweep with exceptional shifts still stalls', () => {
    // A realified 2 x 2 complex problem (layout [da, db, u, v]): its frequencies are the
    // eigenvalues of the block [[delta - mu, 1/2], [c, -mu]] with c = 0.31872 (the spin-photon
    // entry, r/2 for the Bloch vector length r = tanh(E/T)), w = (delta - 2 mu)/2 +- sqrt(delta^2/4 + c/2),
    // closed form computed below; tolerance 1e-12 (a 4 x 4 problem), and A v = lambda v.
    const A = Float64Array.from([0, 2.2145963542921314, -0.5, 0, -2.2145963542921314, 0, 0, -0.5,
      0.3187197409693236, 0, 0, 3.2145963542921314, 0, 0.3187197409693236, -3.2145963542921314, 0]);
    const ev = realEigenDecomposition(4, A);
    expect(residual(4, A, ev)).toBeLessThan(1e-12);
    const dmu = 2.2145963542921314, mu = -3.2145963542921314, c = 0.5 * 0.3187197409693236;
    const disc = Math.sqrt(((dmu + mu) / 2) ** 2 + c);
    const want = [Math.abs((dmu - mu) / 2 - disc), Math.abs((dmu - mu) / 2 + disc)].sort((a, b) => a - b);
    const omegas = Array.from(ev.im).filter((x) => x > 0).sort((a, b) => a - b);
    omegas.forEach((w, i) => expectAbs(w, want[i], 1e-12));
  });

  it('A v = lambda v for seeded random matrices and for skew (purely oscillating) ones', () => {
    // Invariant check; 1e-10 relative: backward-stable QR on matrices of order <= 12 with entries O(1).
    const rng = seedrandom('real-eigen');
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + (trial % 11);
      const A = Float64Array.from({ length: n * n }, () => rng() - 0.5);
      if (trial % 2 === 1) for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) { A[i * n + j] = i === j ? 0 : -A[j * n + i]; }
      const ev = realEigenDecomposition(n, A);
      expect(residual(n, A, ev)).toBeLessThan(1e-10);
      // The trace is the sum of the eigenvalues.
      let tr = 0, sum = 0;
      for (let i = 0; i < n; i++) { tr += A[i * n + i]; sum += ev.re[i]; }
      expectAbs(sum, tr, 1e-10);
    }
  });

  it('a non-finite entry is a ConvergenceError, not a hang', () => {
    expect(() => realEigenDecomposition(2, Float64Array.from([0, Infinity, 1, 0]))).toThrow(ConvergenceError);
  });
});
