/**
 * Correlated-method group of the engine worker: exact diagonalisation of a cluster, and
 * one segment of one variational Monte Carlo Markov chain (see src/core/vmc/segment.ts).
 * A segment carries its chain's state in and out, so any worker may run any chain's next
 * segment and the seed with the chain count fixes the result. The cluster, ansatz and
 * Fourier tables of the last problem seen are kept, so the steps of one run build them once.
 */
import { buildCluster, type ClusterSpec } from '../../src/core/cluster/spec.ts';
import { exactDiagonalisation, type EdRequest, type EdResult } from '../../src/core/ed/exact-diagonalisation.ts';
import { runSegment, type SegmentRequest, type SegmentResult, type VmcSystem } from '../../src/core/vmc/segment.ts';
import { cachedSystem } from '../../src/core/vmc/variational-monte-carlo.ts';

const systems = new Map<string, VmcSystem>();

export const correlatedApi = {
  /** The sites of a cluster (N and positions, units of a), built here: its Ewald sums stay off the page's thread. */
  clusterSites(spec: ClusterSpec): { N: number; positions: number[] } {
    const c = buildCluster(spec);
    return { N: c.N, positions: Array.from(c.positions) };
  },

  /** Ground state and observables of H(alpha) on a cluster, fixed or self-consistent alpha. */
  ed(req: EdRequest): EdResult {
    return exactDiagonalisation(req);
  },

  /** One segment of one Markov chain: optimisation sums or binned observables, and the chain state. */
  vmcSegment(req: SegmentRequest): SegmentResult {
    return runSegment(cachedSystem(systems, req.problem), req);
  },
};
