/**
 * The scan host: the one scan driver (scan-driver.ts) run where the page's main thread does
 * not pay for it, in a coordinating worker that owns the pool of engine workers
 * (scan-coordinator.ts). The page sends a ScanRequest and gets back blocks of finished
 * items and the result: the driver's refinement, bookkeeping and boundary location, and
 * every worker reply, stay off the main thread.
 *
 * Streamed points are collected for BLOCK_MS after the first one arrives and sent as one
 * block of typed arrays (point-blocks.ts) whose buffers are transferred; an adaptive map's
 * band (its rows delivered together) is thus one message. Other items (soft-mode traces)
 * go as a plain array. The result goes without its point list: the page already has every
 * point and rebuilds the list (scan-host-client.ts). The host is environment-agnostic (a
 * Web Worker's scope or a MessagePort), so Node tests run it over a MessageChannel.
 */
import type { Engine } from './engine.ts';
import type { WorkerPool } from './pool.ts';
import type { ScanKind, ScanPoint, ScanRequest } from './protocol.ts';
import { runScan } from './scan-driver.ts';
import { blockBuffers, packPoints, type PointBlock } from './point-blocks.ts';

/** Collect streamed items this long (ms) before sending them as one block. */
export const BLOCK_MS = 40;

/** Kinds whose streamed items are ScanPoints (packed into typed-array blocks). */
export const POINT_KINDS: readonly ScanKind[] = ['map', 'staircase'];

/** Page to host. */
export type HostRequest =
  | { type: 'scan'; id: number; req: ScanRequest; pointBudgetMs?: number }
  | { type: 'cancel'; id: number }
  | { type: 'warm'; id: number };

/** Host to page. */
export type HostMessage =
  | { type: 'items'; id: number; block?: PointBlock; items?: unknown[]; progress?: [number, number] }
  | { type: 'done'; id: number; result: unknown }
  | { type: 'failed'; id: number; name: string; message: string };

/** What the host needs of its end of the channel (a worker's self, a MessagePort). */
export interface HostPort {
  postMessage(message: unknown, transfer?: Transferable[]): void;
  addEventListener(type: 'message', listener: (e: MessageEvent) => void): void;
  start?(): void;
}

/** Answer scan requests arriving on port with the driver on pool. */
export function serveScans(port: HostPort, pool: WorkerPool<Engine>): void {
  const runs = new Map<number, AbortController>();
  port.addEventListener('message', (e: MessageEvent) => {
    const m = e.data as HostRequest;
    if (m.type === 'cancel') { runs.get(m.id)?.abort(); runs.delete(m.id); return; }
    if (m.type === 'warm') {
      pool.warm((r) => r.info()).then(() => port.postMessage({ type: 'done', id: m.id, result: null } satisfies HostMessage),
        (err: unknown) => port.postMessage(failure(m.id, err)));
      return;
    }
    const ctrl = new AbortController();
    runs.set(m.id, ctrl);
    const points = POINT_KINDS.includes(m.req.kind);
    let buffer: unknown[] = [];
    let progress: [number, number] | undefined;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const flush = () => {
      if (timer !== null) { clearTimeout(timer); timer = null; }
      if (ctrl.signal.aborted || (buffer.length === 0 && !progress)) return;
      const msg: HostMessage = { type: 'items', id: m.id, ...(progress ? { progress } : {}) };
      let transfer: Transferable[] = [];
      if (buffer.length && points) {
        msg.block = packPoints(buffer as ScanPoint[]);
        transfer = blockBuffers(msg.block);
      } else if (buffer.length) {
        msg.items = buffer;
      }
      buffer = [];
      progress = undefined;
      port.postMessage(msg, transfer);
    };
    const later = () => { if (timer === null) timer = setTimeout(flush, BLOCK_MS); };
    runScan(pool, m.req as ScanRequest & { kind: ScanKind }, {
      signal: ctrl.signal,
      pointBudgetMs: m.pointBudgetMs,
      // a map's driver need not keep its points (the page has them); the staircase reads its own
      keepPoints: m.req.kind !== 'map',
      onItem: (item: unknown) => { buffer.push(item); later(); },
      onProgress: (done: number, total: number) => { progress = [done, total]; later(); },
    }).then((result) => {
      flush();
      runs.delete(m.id);
      const r = result as unknown as Record<string, unknown>;
      port.postMessage({ type: 'done', id: m.id, result: 'points' in r ? { ...r, points: [] } : r } satisfies HostMessage);
    }, (err: unknown) => {
      if (timer !== null) clearTimeout(timer);
      runs.delete(m.id);
      port.postMessage(failure(m.id, err));
    });
  });
  port.start?.();
}

function failure(id: number, err: unknown): HostMessage {
  const e = err instanceof Error ? err : new Error(String(err));
  return { type: 'failed', id, name: e.name, message: e.message };
}
