/**
 * One emitter in its mean field, h = xi n + alpha sigma^x (DESIGN.md, "Sublattice mean-field
 * at temperature T"), checked against the thermal averages of the 2x2 Hamiltonian
 * diagonalised in the test (ml-matrix EigenvalueDecomposition; SOURCES.fullSpectrumEd):
 *   m = <n>, <sigma^x>, and -T ln Z = xi/2 + levelFreeEnergy(E, T).
 * Basis (|g>, |e>): n = diag(0, 1), sigma^x = [[0, 1], [1, 0]].
 */
import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { gOf, levelFreeEnergy, occupation, photonDensity, qOf } from '../../../src/core/meanfield/emitter.ts';
import { expectAbs, expectRel } from '../../references.ts'; // citations: SOURCES in tests/references.ts

/** Thermal <n>, <sigma^x>, -T ln Z of the 2x2 h (T = 0: ground state), by diagonalisation. */
function exact2x2(xi: number, alpha: number, T: number): { m: number; sx: number; F: number } {
  const ed = new EigenvalueDecomposition(new Matrix([[0, alpha], [alpha, xi]]), { assumeSymmetric: true });
  const lam = ed.realEigenvalues, V = ed.eigenvectorMatrix;
  const e0 = Math.min(...lam);
  const w = lam.map((l) => (T === 0 ? (l === e0 ? 1 : 0) : Math.exp(-(l - e0) / T)));
  const Z = w.reduce((a, b) => a + b, 0);
  let m = 0, sx = 0;
  for (let k = 0; k < 2; k++) {
    const g = V.get(0, k), e = V.get(1, k);
    m += (w[k] / Z) * e * e;
    sx += (w[k] / Z) * 2 * g * e;
  }
  return { m, sx, F: T === 0 ? e0 : e0 - T * Math.log(Z) };
}

const cases: [number, number, number][] = [
  // xi, alpha, T
  [-1.3, 0.4, 0.25], [0.7, 0.9, 0.5], [2.5, 0.3, 0.1], [-0.2, 1.1, 2], [0.9, 0.6, 0], [-1.7, 0.25, 0], [0.4, 0, 0.3],
];

describe('emitter in a field against the 2x2 diagonalisation', () => {
  for (const [xi, alpha, T] of cases) {
    it(`xi=${xi} alpha=${alpha} T=${T}`, () => {
      const E = Math.sqrt(xi * xi / 4 + alpha * alpha), g = gOf(E, T);
      const ex = exact2x2(xi, alpha, T);
      // 1e-12: a 2x2 diagonalisation and a tanh are exact to rounding (O(1) values).
      expectAbs(occupation(xi, alpha * alpha, E, g, T), ex.m, 1e-12);
      // <sigma^x> = -2 alpha g (module note) = -alpha tanh(E/T)/E (DESIGN); the overall sign
      // of sigma^x is a gauge, the ground state of +alpha sigma^x has <sigma^x> <= 0.
      expectAbs(-2 * alpha * g, ex.sx, 1e-12);
      expectAbs(xi / 2 + levelFreeEnergy(E, T), ex.F, 1e-12);
    });
  }

  it('nearly empty emitter: m ~ alpha^2/xi^2 kept to full relative precision', () => {
    // Second-order perturbation theory (common practice, no source): m = alpha^2/xi^2 (1 + O(alpha^2/xi^2)).
    const xi = 1e4, alpha = 1e-2, E = Math.sqrt(xi * xi / 4 + alpha * alpha);
    const m = occupation(xi, alpha * alpha, E, gOf(E, 0), 0);
    // exact: m = (1 - xi/(2E))/2 = alpha^2 / (E (2E + xi)), written without cancellation in the test.
    expectRel(m, (alpha * alpha) / (E * (2 * E + xi)), 1e-14);
    expectRel(m, (alpha * alpha) / (xi * xi), 1e-11);
  });
});

describe('g = tanh(E/T)/(2E) and q = (dg/dE)/E', () => {
  it('series branch (E/T < 1e-2) matches tanh(x)/(2E) and joins the direct branch', () => {
    const T = 0.3;
    for (const x of [1e-5, 1e-3, 9.9e-3, 1.01e-2]) {
      const E = x * T;
      // 1e-12 relative: the series' omitted term is ~x^6 < 1e-12 (module note); tanh is exact to rounding.
      expectRel(gOf(E, T), Math.tanh(x) / (2 * E), 1e-12);
    }
    // g(0) = 1/(2T) (the limit of tanh(x)/x = 1; common practice, no source).
    expectRel(gOf(0, T), 1 / (2 * T), 1e-15);
    // q(0) = -1/(3 T^3) (module note; limit of the Taylor series tanh x = x - x^3/3).
    expectRel(qOf(0, T), -1 / (3 * T ** 3), 1e-15);
  });

  it('q is the derivative of g over E (central difference)', () => {
    for (const [E, T] of [[0.37, 0.2], [1.3, 0.9], [0.002, 0.1], [0.8, 0], [25, 0.5]] as const) {
      const h = 1e-5 * E;
      const fd = (gOf(E + h, T) - gOf(E - h, T)) / (2 * h) / E;
      // 1e-8 relative: central-difference truncation ~(h/E)^2 = 1e-10 plus rounding eps/h ~ 1e-11/|g'|.
      expectRel(qOf(E, T), fd, 1e-8);
    }
  });
});

describe('photon self-consistency in a = alpha^2', () => {
  it('root satisfies (delta - mu) = mean_s tanh(E_s/T)/(2E_s) (DESIGN)', () => {
    const xi = Float64Array.of(-0.8, 0.3, 1.7), dmu = 0.6;
    for (const T of [0, 0.2, 0.7]) {
      const a = photonDensity(xi, dmu, T);
      expect(a).toBeGreaterThan(0);
      let G = 0;
      for (const x of xi) { const E = Math.sqrt(x * x / 4 + a); G += (T === 0 ? 1 : Math.tanh(E / T)) / (2 * E) / xi.length; }
      // 1e-12: the root is converged to 1e-15 relative and G has slope O(1) in a.
      expectAbs(G, dmu, 1e-12);
    }
  });

  it('single emitter at T = 0: alpha^2 = 1/(4 (delta-mu)^2) - xi^2/4 (DESIGN: (delta-mu) = 1/(2E))', () => {
    const xi = Float64Array.of(0.5), dmu = 0.75;
    expectRel(photonDensity(xi, dmu, 0), 1 / (4 * dmu * dmu) - 0.25 / 4, 1e-13);
  });

  it('no root when (delta - mu) >= mean g at a = 0: the normal state', () => {
    // Hepp and Lieb (SOURCES.heppLieb): the normal state is stable while (delta-mu) > tanh(|xi|/(2T))/|xi|.
    const xi = 0.8, T = 0.3, crit = Math.tanh(xi / (2 * T)) / xi;
    expect(photonDensity(Float64Array.of(xi), crit * 1.001, T)).toBe(0);
    expect(photonDensity(Float64Array.of(xi), crit * 0.999, T)).toBeGreaterThan(0);
  });
});
