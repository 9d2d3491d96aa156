/**
 * A reactive controller for the phase atlas's "check this boundary": the QMC line scan on
 * the scan workers through workers/qmc-scan.ts (qmcScanOnPool, the CLI's qmc-scan path),
 * then the Binder crossings of consecutive sizes (scanCrossings). The EngineTask pattern:
 * a new request aborts the stale scan; only the latest may change the state. Finished
 * runs stream in (`points`) so the Binder figure fills while the scan runs; progress is
 * runs done of the total.
 */
import type { ReactiveControllerHost } from 'lit';
import { qmcScanOnPool, scanCrossings } from '../../../workers/qmc-scan.ts';
import type { QmcScanPoint, QmcScanRequest } from '../../../workers/protocol.ts';
import type { BinderCrossing } from '../../core/qmc/binder-crossing.ts';
import type { EngineClient } from '../engine/engine-client.ts';
import { PoolJob } from './pool-job.ts';

export interface BoundaryCheckResult {
  request: QmcScanRequest;
  /** Every run, in index order (size-major). */
  points: QmcScanPoint[];
  crossings: BinderCrossing[];
}

/** Redraws for streamed runs at most this often (ms). */
const THROTTLE = 200;

export class BoundaryCheckController extends PoolJob<BoundaryCheckResult> {
  /** Runs finished so far of the pending scan (completion order). */
  points: QmcScanPoint[] = [];
  done = 0;
  total = 0;
  /** The request of the pending (or last) scan. */
  request: QmcScanRequest | null = null;

  constructor(host: ReactiveControllerHost, engine: () => EngineClient | undefined) {
    super(host, engine, THROTTLE);
  }

  /** Run the scan unless it is the one already pending or shown. */
  run(req: QmcScanRequest): void {
    const engine = this.engine();
    if (!engine) return;
    void this.task.run(JSON.stringify(req), async (signal) => {
      this.request = req;
      this.points = [];
      this.done = 0;
      this.total = 0;
      const points = await qmcScanOnPool(req, engine.scanPool, {
        signal,
        onPoint: (p) => { if (!signal.aborted) { this.points = [...this.points, p]; this.later(); } },
        onProgress: (d, t) => { if (!signal.aborted) { this.done = d; this.total = t; this.later(); } },
      });
      return { request: req, points, crossings: scanCrossings(points) };
    });
  }
}
