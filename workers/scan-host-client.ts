/**
 * The page's end of the scan host (scan-host.ts): runScan's contract (a request, options
 * with signal, onItem and onProgress, a promise of the result) over a channel to the
 * coordinating worker. Each block that arrives is unpacked once and its items handed to
 * onItem in one go; the result's point list (left out on the wire) is rebuilt from the
 * items, ordered by index as the driver orders it. Aborting rejects at once with an
 * AbortError and tells the host to stop (the host aborts the driver, which drops queued
 * work and stops busy workers).
 */
import type { ScanItem, ScanKind, ScanKinds, ScanOptions, ScanPoint, ScanResult } from './protocol.ts';
import { abortError } from './pool.ts';
import { blockBuffers, packPoints, unpackPoints } from './point-blocks.ts';
import type { HostMessage, HostPort, HostRequest } from './scan-host.ts';

/** runScan's options, and the host's preview of a map (grid points solved cold before their rows are delivered: scan-host.ts). */
export type HostScanOptions<Item> = ScanOptions<Item> & {
  onPreview?: (points: ScanPoint[]) => void;
  /** A map's grid points the page already has (a zoom's kept points): their cold solves are answered from these. */
  known?: ScanPoint[];
};

interface Pending {
  onMessage(m: HostMessage): void;
}

export class ScanHostClient {
  private next = 1;
  private pending = new Map<number, Pending>();

  constructor(private readonly port: HostPort & { terminate?(): void }) {
    port.addEventListener('message', (e: MessageEvent) => {
      const m = e.data as HostMessage;
      this.pending.get(m.id)?.onMessage(m);
    });
    port.start?.();
  }

  private send(m: HostRequest): void {
    this.port.postMessage(m);
  }

  /** Start the host's engine workers and wait until each answers. */
  warm(): Promise<void> {
    const id = this.next++;
    return new Promise((resolve, reject) => {
      this.pending.set(id, {
        onMessage: (m) => {
          this.pending.delete(id);
          if (m.type === 'failed') reject(new Error(m.message)); else resolve();
        },
      });
      this.send({ type: 'warm', id });
    });
  }

  /** One scan in the host (see runScan in scan-driver.ts). */
  scan<K extends ScanKind>(req: ScanKinds[K]['request'] & { kind: K }, o: HostScanOptions<ScanItem<K>> = {}): Promise<ScanResult<K>> {
    const signal = o.signal;
    if (signal?.aborted) return Promise.reject(abortError(signal));
    const id = this.next++;
    const keep = o.keepPoints !== false;
    const got: ScanPoint[] = [];
    return new Promise<ScanResult<K>>((resolve, reject) => {
      const onAbort = () => {
        this.pending.delete(id);
        this.send({ type: 'cancel', id });
        reject(abortError(signal));
      };
      const end = () => { this.pending.delete(id); signal?.removeEventListener('abort', onAbort); };
      signal?.addEventListener('abort', onAbort, { once: true });
      this.pending.set(id, {
        onMessage: (m) => {
          if (m.type === 'items') {
            if (m.preview && o.onPreview) o.onPreview(unpackPoints(m.preview));
            if (m.block) {
              const pts = unpackPoints(m.block);
              if (keep) for (const p of pts) got.push(p);
              if (o.onItem) for (const p of pts) (o.onItem as (p: ScanPoint) => void)(p);
            }
            if (m.items && o.onItem) for (const it of m.items) (o.onItem as (x: unknown) => void)(it);
            if (m.progress) o.onProgress?.(m.progress[0], m.progress[1]);
          } else if (m.type === 'done') {
            end();
            const r = m.result as Record<string, unknown>;
            if (Array.isArray(r.points)) r.points = keep ? got.sort((a, b) => a.index - b.index) : [];
            resolve(r as unknown as ScanResult<K>);
          } else {
            end();
            const e = new Error(m.message);
            e.name = m.name;
            reject(e);
          }
        },
      });
      const known = o.known?.length ? packPoints(o.known) : undefined;
      this.port.postMessage({
        type: 'scan', id, req, ...(o.pointBudgetMs !== undefined ? { pointBudgetMs: o.pointBudgetMs } : {}), ...(known ? { known } : {}),
      } satisfies HostRequest, known ? blockBuffers(known) : []);
    });
  }

  /** The host died (its worker failed to load or crashed): every open call rejects with this reason. */
  fail(reason: string): void {
    const m = { type: 'failed', name: 'Error', message: reason } as const;
    for (const [id, p] of [...this.pending]) p.onMessage({ ...m, id });
  }

  /** Stop the host and its workers. */
  close(): void {
    for (const [id] of this.pending) this.send({ type: 'cancel', id });
    this.pending.clear();
    this.port.terminate?.();
  }
}
