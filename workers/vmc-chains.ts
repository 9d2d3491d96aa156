/**
 * Variational Monte Carlo on the worker pool: a SegmentRunner that sends each chain's
 * segment of a lockstep batch to the pool as one task (one Markov chain a worker when the
 * chain count equals the pool size) and returns the results in chain order. Results do not
 * depend on which worker ran which chain: the chain state travels with the segment.
 *
 * Cancellation: `signal` is checked before every batch (an optimisation step is short) and
 * handed to the pool only for the long measurement batch, so a run of hundreds of steps
 * does not pile abort listeners onto one signal.
 */
import type { SegmentRunner } from '../src/core/vmc/variational-monte-carlo.ts';
import type { Engine } from './engine.ts';
import { abortError, type WorkerPool } from './pool.ts';

/** Segments of a batch as pool tasks; `signal` cancels the run. */
export function poolSegmentRunner(pool: WorkerPool<Engine>, signal?: AbortSignal): SegmentRunner {
  return async (reqs) => {
    if (signal?.aborted) throw abortError(signal);
    const long = reqs.some((r) => r.mode === 'measure');
    return pool.run(reqs, (remote, req) => remote.correlated.vmcSegment(req), long ? { signal } : {});
  };
}
