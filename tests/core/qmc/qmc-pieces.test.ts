/**
 * The QMC modules not covered by the invariant and reference tests, checked directly:
 * the separable torus transform against the direct double sum (common practice, no source:
 * a discrete Fourier sum), the torus builder against the dense cluster on a ring, the
 * request's refusals (DESIGN.md: mu >= delta refused; T > 0 or the ground-state mode),
 * the phase label's rules, the estimates of hand-made bins (binning mean, Flyvbjerg and
 * Petersen 1989), and one chain's bookkeeping.
 */
import { describe, expect, it } from 'vitest';
import { torusCorrelation } from '../../../src/core/qmc/torus-transform.ts';
import { torus } from '../../../src/core/qmc/torus.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { resolveQmcRequest } from '../../../src/core/qmc/qmc-request.ts';
import { qmcPhase } from '../../../src/core/qmc/qmc-result.ts';
import { qmcGeometry } from '../../../src/core/qmc/qmc-geometry.ts';
import { runSseChain } from '../../../src/core/qmc/sse-chain.ts';
import { chainEstimates } from '../../../src/core/qmc/qmc-estimates.ts';
import { sampleConfig } from '../../../src/core/qmc/sse-sample.ts';

const EXACT = 1e-10;

describe('torus pieces', () => {
  it('the separable transform equals the direct sum (1/N^2) sum_k P(k) cos(k . r_d)', () => {
    const Lx = 5, Ly = 3, N = Lx * Ly;
    const P = Float64Array.from({ length: N }, (_, q) => Math.sin(q + 1) + 2);
    const G = torusCorrelation(Lx, Ly, P);
    for (let d = 0; d < N; d++) {
      let s = 0;
      for (let q = 0; q < N; q++) s += P[q] * Math.cos(2 * Math.PI * (((q % Lx) * (d % Lx)) / Lx + (Math.floor(q / Lx) * Math.floor(d / Lx)) / Ly));
      expect(Math.abs(G[d] - s / (N * N))).toBeLessThan(EXACT);
    }
  });
  it('a ring built by displacement has the dense cluster V_0j', () => {
    const interaction = { shape: 'vdw' as const, Rb: 1.5 };
    const t = torus('chain', 9, 1, interaction), c = buildCluster({ kind: 'periodic', lattice: 'chain', size: [9], interaction });
    for (let j = 1; j < 9; j++) expect(Math.abs(t.Vd[j] - c.V[j])).toBeLessThan(EXACT * c.V[1]);
    expect(t.distance[4]).toBeCloseTo(4, 12);
    expect(t.distance[5]).toBeCloseTo(4, 12); // minimum image on a ring of 9
  });
});

describe('request and label', () => {
  const cluster = { kind: 'periodic' as const, lattice: 'chain' as const, size: [6], interaction: { shape: 'nn' as const, V1: 1 } };
  it('refuses T <= 0 without the ground mode, mu >= delta, and no photon entry', () => {
    expect(() => resolveQmcRequest({ cluster, mu: 0, alpha: 0.1, temperature: 0 })).toThrow(/temperature/);
    expect(() => resolveQmcRequest({ cluster, mu: 1, delta: 1, temperature: 0.1 })).toThrow(/unbounded/);
    expect(() => resolveQmcRequest({ cluster, mu: 0, temperature: 0.1 })).toThrow(/alpha/);
    expect(resolveQmcRequest({ cluster, mu: 0, alpha: 0.1, ground: true }).temperature).toBeNull();
  });
  it('labels: condensate from alpha^2 >= 1e-8, order from the Binder midpoint', () => {
    const ordered = { value: 0.6, error: 0.01 }, disordered = { value: 0.1, error: 0.01 };
    expect(qmcPhase(0.3, 0.4, ordered, true)).toBe('supersolid');
    expect(qmcPhase(0.3, 0.4, disordered, true)).toBe('superradiant');
    expect(qmcPhase(0, 0.5, ordered, true)).toBe('density-wave');
    expect(qmcPhase(0, 0.5, { value: 0.4, error: 0.01 }, false)).toBe('normal'); // complex order: midpoint 1/2
    expect(qmcPhase(0, 1e-4, null, true)).toBe('empty');
    expect(qmcPhase(0, 1 - 1e-4, null, true)).toBe('filled');
  });
});

describe('a chain and its estimates', () => {
  it('bins of hand-made values give their mean; one chain fills its bins and counts', () => {
    const spec = { kind: 'periodic' as const, lattice: 'chain' as const, size: [4], interaction: { shape: 'nn' as const, V1: 1 } };
    const g = qmcGeometry(spec);
    const r = runSseChain({ cluster: spec, mu: 0.5, alpha: 0.3, beta: 2, thermalization: 50, sweeps: 400, bins: 8, seed: 2, chain: 0 }, g);
    expect(r.bins).toBe(8);
    expect(r.binSize).toBe(50);
    expect(r.scalars.length).toBe(8 * 5);
    // density bins lie in [0, 1]; the k = 0 component of n is the excitation number (Im = 0)
    for (let b = 0; b < 8; b++) {
      expect(r.scalars[b * 5 + 1]).toBeGreaterThanOrEqual(0);
      expect(r.scalars[b * 5 + 1]).toBeLessThanOrEqual(1);
      expect(Math.abs(r.nkIm[b * g.N])).toBeLessThan(EXACT);
    }
    // replace the energy column by known values: the estimate is their mean
    const known = [1, 2, 3, 4, 5, 6, 7, 8];
    known.forEach((x, b) => { r.scalars[b * 5] = x; });
    const est = chainEstimates(g, 2, [r]);
    expect(est.energyPerSite.value).toBeCloseTo(4.5, 12);
    expect(est.energyPerSite.error).toBeCloseTo(Math.sqrt(42 / (8 * 7)), 12);
  });
  it('sample estimators from counts: sigma^x = n_flip / (beta alpha N), density = (1/n) sum_p N(p) / N', () => {
    const s = sampleConfig({ operators: 10, flips: 4, start: 2, sum: 25, sum2: 70 }, 5, 2, 0.5);
    expect(s.sigmaX).toBeCloseTo(4 / (2 * 0.5 * 5), 14);
    expect(s.density).toBeCloseTo(25 / 10 / 5, 14);
    expect(s.kubo).toBeCloseTo((2 * (25 * 25 + 70)) / (10 * 11), 12);
  });
});
