/**
 * Variational Monte Carlo on the worker pool: drives the core's batch generator
 * (vmcBatches), sending each chain's segment of a lockstep batch to the pool as one task
 * (one Markov chain a worker when the chain count equals the pool size). Results do not
 * depend on which worker ran which chain: the chain state travels with the segment.
 *
 * Cancellation: `signal` is checked before every batch (an optimisation step is short) and
 * handed to the pool only for the long measurement batch, so a run of hundreds of steps
 * does not pile abort listeners onto one signal.
 */
import { reportBatch, vmcBatches, type VmcHooks, type VmcRequest } from '../src/core/vmc/variational-monte-carlo.ts';
import type { VmcResult } from '../src/core/vmc/vmc-result.ts';
import type { Engine } from './engine.ts';
import { abortError, type WorkerPool } from './pool.ts';

/** Optimise and measure on the pool; `signal` cancels the run (AbortError). */
export async function variationalMonteCarloOnPool(
  req: VmcRequest, pool: WorkerPool<Engine>, hooks: VmcHooks & { signal?: AbortSignal } = {},
): Promise<VmcResult> {
  const { signal } = hooks;
  const gen = vmcBatches(req);
  let next = gen.next();
  let total = 1;
  while (!next.done) {
    const b = next.value;
    reportBatch(b, hooks);
    total = b.total;
    if (signal?.aborted) throw abortError(signal);
    const long = b.requests.some((r) => r.mode === 'measure');
    next = gen.next(await pool.run(b.requests, (remote, r) => remote.correlated.vmcSegment(r), long ? { signal } : {}));
  }
  hooks.onProgress?.(total, total);
  return next.value;
}
