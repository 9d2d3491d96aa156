/**
 * Reproducibility: the seed and the chain count fix every number bit for bit, whichever
 * worker runs which segment; different seeds agree within errors. Plus the structure-factor
 * sum rule, exact for the estimators on a periodic cluster: sum over the N cluster momenta
 * sum_k S(k) = sum_i (<n_i> - <n_i>^2) (Parseval, since n_i^2 = n_i).
 */
import { describe, it, expect } from 'vitest';
import { variationalMonteCarlo, cachedSystem, type VmcRequest } from '../../../src/core/vmc/variational-monte-carlo.ts';
import { runSegment, type SegmentRequest, type SegmentResult, type VmcSystem } from '../../../src/core/vmc/segment.ts';
import { expectAbs } from '../../references.ts';

const base: VmcRequest = {
  cluster: { kind: 'periodic', lattice: 'chain', size: [10], interaction: { shape: 'vdw', Rb: 1.3 } },
  mu: 1, alpha: 0.4, seed: 7, chains: 3, steps: 40, sweeps: 3072, bins: 16,
};

/** A runner that executes the batch in reverse order and returns it shuffled, as a pool might. */
const reversedRunner = (): ((reqs: SegmentRequest[]) => SegmentResult[]) => {
  const cache = new Map<string, VmcSystem>();
  return (reqs) => {
    const out = [...reqs].reverse().map((r) => runSegment(cachedSystem(cache, r.problem), r));
    return [out[1], ...out.slice(2), out[0]].filter(Boolean);
  };
};

describe('VMC determinism', () => {
  it('same seed and chain count: identical results, whatever order the segments run in', async () => {
    const a = variationalMonteCarlo(base);
    const b = variationalMonteCarlo(base);
    const c = variationalMonteCarlo(base, { run: reversedRunner() });
    expect(b).toEqual(a);
    expect(c).toEqual(a);
  });

  it('different seeds: a fixed wavefunction (no optimisation) gives energies equal within 4 sigma', async () => {
    const fixed = { ...base, steps: 0, sweeps: 8192 };
    const r = [1, 2, 3].map((seed) => variationalMonteCarlo({ ...fixed, seed }));
    for (let i = 0; i < r.length; i++) for (let j = 0; j < i; j++) {
      const d = Math.abs(r[i].energyPerSite.value - r[j].energyPerSite.value);
      // 4 sigma of the difference of independent estimates (false-alarm rate 6e-5).
      expect(d).toBeLessThan(4 * Math.hypot(r[i].energyPerSite.error, r[j].energyPerSite.error));
    }
    expect(r[0].energyPerSite.value).not.toBe(r[1].energyPerSite.value);
  });

  it('sum rule sum_k S(k) = sum_i rho_i (1 - rho_i) holds for the estimators (to rounding)', async () => {
    const r = variationalMonteCarlo(base);
    const lhs = r.structureFactor.reduce((s, p) => s + p.value, 0);
    const rhs = r.siteDensities.reduce((s, d) => s + d.value * (1 - d.value), 0);
    expectAbs(lhs, rhs, 1e-10);
    expect(r.structureFactor).toHaveLength(10);
    expect(r.acceptance).toBeGreaterThan(0);
    expect(r.tauInt).toBeGreaterThan(0);
  });
});
