/**
 * Quantum Monte Carlo on the worker pool: drives the core's batch generator (qmcBatches in
 * src/core/qmc/quantum-monte-carlo.ts), each batch's chains run in parallel as one pool
 * task a chain (remote.qmc.qmcChain). The pool hands results back in task order and every
 * chain is fixed by its seed and index, so the result is bit for bit the in-thread
 * quantumMonteCarlo's for the same seed and chain count, whatever the worker count.
 *
 * A run is started (startQmc: the request is resolved and checked, the geometry built and
 * the first batch drawn, all in this thread, so bad input is refused before any work) and
 * then driven (driveQmc). Several runs may be driven at once on one pool (qmc-scan.ts):
 * their chains share the pool's queue.
 */
import type { QmcBatch } from '../src/core/qmc/quantum-monte-carlo.ts';
import { qmcBatches } from '../src/core/qmc/quantum-monte-carlo.ts';
import { qmcGeometry, type QmcGeometry } from '../src/core/qmc/qmc-geometry.ts';
import type { QmcRequest, QmcResult } from '../src/core/qmc/quantum-monte-carlo.ts';
import type { SseChainResult } from '../src/core/qmc/sse-chain.ts';
import type { Engine } from './engine.ts';
import type { QmcProgress } from './protocol.ts';
import { abortError, type WorkerPool } from './pool.ts';

/** A run started in this thread: its generator and the batch it waits on (or its result). */
export interface QmcRun {
  gen: Generator<QmcBatch, QmcResult, SseChainResult[]>;
  next: IteratorResult<QmcBatch, QmcResult>;
}

export interface QmcPoolHooks {
  signal?: AbortSignal;
  /** After each finished chain: chains done of the chains handed out so far, and the stage. */
  onProgress?: (p: QmcProgress) => void;
  /** A geometry already built for req.cluster (saves rebuilding it; a scan shares one per size). */
  geometry?: QmcGeometry;
}

/** Resolve and check the request, build its geometry (unless given) and draw the first batch. */
export function startQmc(req: QmcRequest, geometry?: QmcGeometry): QmcRun {
  const gen = qmcBatches(req, geometry ?? qmcGeometry(req.cluster));
  return { gen, next: gen.next() };
}

/** Run the batches of a started run on the pool; `signal` cancels (AbortError). */
export async function driveQmc(run: QmcRun, pool: WorkerPool<Engine>, hooks: QmcPoolHooks = {}): Promise<QmcResult> {
  const { signal, onProgress } = hooks;
  let { next } = run;
  let before = 0;
  while (!next.done) {
    const b = next.value;
    if (signal?.aborted) throw abortError(signal);
    const total = before + b.requests.length;
    const report = (done: number) => onProgress?.({ done: before + done, total, stage: b.stage, beta: b.beta });
    report(0);
    const results = await pool.run(b.requests, (remote, r) => remote.qmc.qmcChain(r), { signal, onProgress: report });
    before = total;
    next = run.gen.next(results);
  }
  return next.value;
}

/** One quantum Monte Carlo run on the pool (the same result as quantumMonteCarlo in this thread). */
export async function quantumMonteCarloOnPool(req: QmcRequest, pool: WorkerPool<Engine>, hooks: QmcPoolHooks = {}): Promise<QmcResult> {
  return driveQmc(startQmc(req, hooks.geometry), pool, hooks);
}
