/**
 * A reactive controller for one quantum Monte Carlo run of the correlated check, on the
 * scan workers through workers/qmc-run.ts (quantumMonteCarloOnPool), the path the CLI's
 * `qmc` takes, so the page's numbers are the command's for the same seed and chains.
 *
 * It is the EngineTask pattern (a new request aborts the stale run through its
 * AbortSignal; only the latest run may change the state; the last good result stays shown
 * while a new one runs) plus the run's progress: the stage (alpha grid, refinement around
 * the minimum of f(alpha), measurement), its beta, and the chains done of those handed out.
 */
import type { ReactiveControllerHost } from 'lit';
import { quantumMonteCarloOnPool } from '../../../workers/qmc-run.ts';
import type { QmcProgress, QmcRequest, QmcResult } from '../../../workers/protocol.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { PoolJob } from './pool-job.ts';

/** Redraws for progress at most this often (ms). */
const PROGRESS_THROTTLE = 150;

export class QmcTask extends PoolJob<QmcResult> {
  /** Progress of the pending run, null before its first report. */
  progress: QmcProgress | null = null;
  /** The request the shown value belongs to. */
  request: QmcRequest | null = null;
  private pendingRequest: QmcRequest | null = null;

  constructor(host: ReactiveControllerHost, engine: () => EngineClient | undefined) {
    super(host, engine, PROGRESS_THROTTLE);
  }

  /** Run `req` unless it is the run already pending or shown (the key is the request's JSON). */
  run(req: QmcRequest): void {
    const engine = this.engine();
    if (!engine) return;
    void this.task.run(JSON.stringify(req), (signal) => {
      this.progress = null;
      this.pendingRequest = req;
      return quantumMonteCarloOnPool(req, engine.scanPool, { signal, onProgress: (p) => this.report(p, signal) }).then((r) => {
        if (!signal.aborted) this.request = req;
        return r;
      });
    });
  }

  /** The request of the pending run, or null. */
  get pending(): QmcRequest | null { return this.task.status === 'pending' ? this.pendingRequest : null; }

  private report(p: QmcProgress, signal: AbortSignal) {
    if (signal.aborted) return;
    this.progress = p;
    this.later();
  }
}

/** The progress as words: "alpha grid, beta = 10: 5 of 16 chains". */
export function qmcProgressText(p: QmcProgress | null): string {
  if (!p) return 'starting the chains\u2026';
  const stage = p.stage === 'grid' ? '\u03b1 grid' : p.stage === 'refine' ? 'refining around the minimum of f(\u03b1)' : 'measuring';
  return `${stage}, \u03b2 = ${Number(p.beta.toPrecision(4))}: ${p.done} of ${p.total} chains`;
}
