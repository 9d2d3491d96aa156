/**
 * Invariants of the Metropolis chain: incremental fields equal a recomputation, the flip
 * ratios are psi(n^i)/psi(n) of the Jastrow form, and the weighted estimator of the guided
 * chain reproduces the exact variational energy <psi|H|psi>/<psi|psi> enumerated over all
 * 2^N configurations (the variational principle needs nothing less).
 */
import { describe, it, expect } from 'vitest';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { buildAnsatz } from '../../../src/core/vmc/ansatz.ts';
import { JastrowChain } from '../../../src/core/vmc/markov-chain.ts';
import { chainStream } from '../../../src/core/vmc/random-stream.ts';
import { runSegment, vmcSystem, type VmcProblem } from '../../../src/core/vmc/segment.ts';
import { measuredObservables } from '../../../src/core/vmc/measured-observables.ts';
import { expectAbs } from '../../references.ts';

const problem: VmcProblem = {
  cluster: { kind: 'periodic', lattice: 'chain', size: [6], interaction: { shape: 'vdw', Rb: 1.2 } }, mu: 1.2, ansatz: { oneBody: 'site' },
};
const theta = Float64Array.from([0.3, -0.2, 0.5, 0.1, 0.0, 0.4, -1.5, 0.2, -0.1]); // 6 one-body + 3 shells

/** ln psi(n) directly from the definition. */
function logPsi(n: ArrayLike<number>): number {
  const c = buildCluster(problem.cluster), N = c.N;
  let s = 0;
  for (let i = 0; i < N; i++) {
    s += theta[i] * n[i];
    for (let j = 0; j < i; j++) s += theta[6 + c.shellOf[i * N + j]] * n[i] * n[j];
  }
  return s;
}

describe('Jastrow Metropolis chain', () => {
  it('incremental fields, energy and counts equal a fresh recomputation after 500 sweeps', () => {
    const c = buildCluster(problem.cluster), A = buildAnsatz(c, { oneBody: 'site' });
    expect(A.P).toBe(9);
    const ch = new JastrowChain(A, problem.mu, theta, new Uint8Array(6));
    const rng = chainStream(11, 0).next;
    for (let t = 0; t < 500; t++) ch.sweep(rng, 0.5); // flips and nearest-neighbour exchanges
    const fresh = new JastrowChain(A, problem.mu, theta, ch.n);
    // tolerance 1e-10: 500 sweeps of O(1) additions accumulate rounding ~1e-13.
    expectAbs(ch.eDiag, fresh.eDiag, 1e-10);
    expectAbs(ch.Q, fresh.Q, 1e-10);
    for (let i = 0; i < 6; i++) { expectAbs(ch.G[i], fresh.G[i], 1e-10); expectAbs(ch.h[i], fresh.h[i], 1e-10); }
    expect(Array.from(ch.shellCount)).toEqual(Array.from(fresh.shellCount));
    // t_i = psi(n^i)/psi(n) from the definition (exact to rounding).
    for (let i = 0; i < 6; i++) {
      const m = Array.from(ch.n); m[i] ^= 1;
      expectAbs(Math.log(ch.t[i]), logPsi(m) - logPsi(ch.n), 1e-12);
    }
    expect(ch.accepted).toBeGreaterThan(0);
  });

  it.each([[0], [0.5]])('weighted estimates equal the exact <psi|H|psi>/<psi|psi> and <n>, enumerated (within 4 sigma), exchange fraction %s', (exchange) => {
    const sys = vmcSystem(problem), c = sys.cluster, N = 6, alpha = 0.4;
    let Z = 0, Hpsi = 0, rho = 0;
    for (let s = 0; s < 1 << N; s++) {
      const n = Array.from({ length: N }, (_, i) => (s >> i) & 1), p = Math.exp(logPsi(n));
      let ed = 0;
      for (let i = 0; i < N; i++) if (n[i]) { ed -= problem.mu; for (let j = 0; j < i; j++) if (n[j]) ed += c.V[i * N + j]; }
      let off = 0;
      for (let i = 0; i < N; i++) { const m = [...n]; m[i] ^= 1; off += Math.exp(logPsi(m)); }
      Z += p * p; Hpsi += p * (ed * p - alpha * off); rho += (p * p * n.reduce((a, b) => a + b, 0)) / N;
    }
    const seg = runSegment(sys, { problem, seed: 5, chain: 0, state: null, theta, alpha, discard: 200, sweeps: 32768, mode: 'measure', bins: 64, exchange });
    const obs = measuredObservables(c, [seg.measure!]);
    // 4 sigma: a failure rate of 6e-5 for a correct sampler (common practice for MC checks).
    expect(Math.abs(obs.energyPerSite.value - Hpsi / Z / N)).toBeLessThan(4 * obs.energyPerSite.error);
    expect(Math.abs(obs.density.value - rho / Z)).toBeLessThan(4 * obs.density.error);
    expect(obs.energyPerSite.error).toBeLessThan(2e-3);
  });
});
