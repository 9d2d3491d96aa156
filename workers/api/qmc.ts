/**
 * Quantum Monte Carlo group of the engine worker: one Markov chain of stochastic series
 * expansion (src/core/qmc/sse-chain.ts) per call. The chain is fixed by its request (seed,
 * chain index), so any worker may run any chain and the run's result depends on the seed and
 * the chain count only (workers/qmc-run.ts drives the batches).
 *
 * The geometry of a cluster (couplings, alias tables, momenta, Fourier tables) costs about a
 * second for a 64 x 64 torus, so the last few are kept, keyed by the cluster spec's JSON.
 * The result's bin tables go back as transferred buffers (no copy).
 */
import { transfer } from 'comlink';
import { qmcGeometry, type QmcGeometry } from '../../src/core/qmc/qmc-geometry.ts';
import { densityFourier, type DensityFourier } from '../../src/core/qmc/density-fourier.ts';
import { runSseChain, type SseChainRequest, type SseChainResult } from '../../src/core/qmc/sse-chain.ts';
import type { ClusterSpec } from '../../src/core/cluster/spec.ts';

/** Geometries kept per worker (a scan over sizes or interaction strengths cycles through a few). */
const KEEP = 6;

interface Built {
  g: QmcGeometry;
  fourier: DensityFourier;
}

const built = new Map<string, Built>();

/** The geometry of a cluster spec, built once per worker (least recently used dropped). */
function geometryOf(spec: ClusterSpec): Built {
  const key = JSON.stringify(spec);
  let b = built.get(key);
  if (b) {
    built.delete(key);
  } else {
    const g = qmcGeometry(spec);
    b = { g, fourier: densityFourier(g) };
    if (built.size >= KEEP) built.delete(built.keys().next().value as string);
  }
  built.set(key, b);
  return b;
}

/** The buffers of a chain result, to transfer rather than copy. */
function buffers(r: SseChainResult): ArrayBuffer[] {
  const arrays = [r.scalars, r.squares, r.nkRe, r.nkIm, r.nk2, r.nk4, r.sites, r.shellSums];
  return arrays.filter((a): a is Float64Array => a !== null).map((a) => a.buffer as ArrayBuffer);
}

export const qmcApi = {
  /** One SSE chain of H(alpha) at inverse temperature beta: its binned measurements. */
  qmcChain(req: SseChainRequest): SseChainResult {
    const { g, fourier } = geometryOf(req.cluster);
    const r = runSseChain(req, g, {}, fourier);
    return transfer(r, buffers(r));
  },
};
