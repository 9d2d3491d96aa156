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
 *
 * Preview: a map's workers solve grid points cold before the map's rows are delivered (the
 * adaptive map's refinement corners, coarse grid first). The host watches those calls (it
 * changes none) and sends each grid point's cold state as a preview block, so the page can
 * paint a coarse picture at once and sharpen it level by level; the rows' own points
 * replace the preview as they arrive.
 *
 * Known points: a map may come with points the page already has at its grid points (a zoom
 * into a kept map, map-cache.ts shared). A cold solve the driver asks of such a point is
 * answered with the known state instead of a worker (its winning search cell unknown, so
 * the row fill solves the point again only where it has a guess and no certificate), and
 * the result's solves and notes say how many.
 */
import type { Engine } from './engine.ts';
import type { WorkerPool } from './pool.ts';
import type { ScanKind, ScanPoint, ScanRequest } from './protocol.ts';
import { runScan } from './scan-driver.ts';
import { blockBuffers, packPoints, unpackPoints, type PointBlock } from './point-blocks.ts';
import type { SolveResult } from '../src/core/meanfield/ground-state.ts';
import { gridPoint, gridShape, pointSeed, type ScanPlan } from '../src/core/scan/grid.ts';
import type { ColdOutcome, ColdRunRequest } from './protocol.ts';

/** Collect streamed items this long (ms) before sending them as one block. */
export const BLOCK_MS = 40;

/** Kinds whose streamed items are ScanPoints (packed into typed-array blocks). */
export const POINT_KINDS: readonly ScanKind[] = ['map', 'staircase'];

/** Page to host. */
export type HostRequest =
  | { type: 'scan'; id: number; req: ScanRequest; pointBudgetMs?: number; known?: PointBlock }
  | { type: 'cancel'; id: number }
  | { type: 'warm'; id: number };

/** Host to page. */
export type HostMessage =
  | { type: 'items'; id: number; block?: PointBlock; items?: unknown[]; progress?: [number, number]; preview?: PointBlock }
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
    let preview: ScanPoint[] = [];
    let progress: [number, number] | undefined;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const flush = () => {
      if (timer !== null) { clearTimeout(timer); timer = null; }
      if (ctrl.signal.aborted || (buffer.length === 0 && preview.length === 0 && !progress)) return;
      const msg: HostMessage = { type: 'items', id: m.id, ...(progress ? { progress } : {}) };
      let transfer: Transferable[] = [];
      if (preview.length) {
        msg.preview = packPoints(preview);
        transfer = blockBuffers(msg.preview);
        preview = [];
      }
      if (buffer.length && points) {
        msg.block = packPoints(buffer as ScanPoint[]);
        transfer = [...transfer, ...blockBuffers(msg.block)];
      } else if (buffer.length) {
        msg.items = buffer;
      }
      buffer = [];
      progress = undefined;
      port.postMessage(msg, transfer);
    };
    const later = () => { if (timer === null) timer = setTimeout(flush, BLOCK_MS); };
    const known = new Map<number, SolveResult>();
    if (m.known) for (const p of unpackPoints(m.known)) if (p.state) known.set(p.index, p.state);
    let reused = 0;
    const watched = m.req.kind === 'map' && !m.req.dense
      ? watchColdSolves(pool, m.req.plan, (pts) => { if (!ctrl.signal.aborted) { preview.push(...pts); later(); } }, known, (n) => { reused += n; })
      : pool;
    runScan(watched, m.req as ScanRequest & { kind: ScanKind }, {
      signal: ctrl.signal,
      pointBudgetMs: m.pointBudgetMs,
      // a map's driver need not keep its points (the page has them); the staircase reads its own
      keepPoints: m.req.kind !== 'map',
      onItem: (item: unknown) => { buffer.push(item); later(); },
      onProgress: (done: number, total: number) => { progress = [done, total]; later(); },
    }).then((result) => {
      flush();
      runs.delete(m.id);
      const r = { ...(result as unknown as Record<string, unknown>) };
      if ('points' in r) r.points = [];
      if (reused && typeof r.solves === 'number') {
        // the driver counted the known corners as solved
        r.solves -= reused;
        r.notes = [...(r.notes as string[] | undefined ?? []), `${reused} corner points taken from the map this one was zoomed from, not solved again`];
      }
      port.postMessage({ type: 'done', id: m.id, result: r } satisfies HostMessage);
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

/**
 * The pool as the driver sees it, with every cold run (meanfield.solveColdRun) watched: the
 * points of the run that are grid points of the plan (the seed the driver gives a grid point,
 * pointSeed(plan.seed, index), and the same parameters) are reported with their states.
 * Grid points in `known` are answered with the known state (searchCell null) instead of
 * being sent to a worker (reuse(n) counts them); every other call and answer is unchanged.
 */
export function watchColdSolves(
  pool: WorkerPool<Engine>, plan: ScanPlan, report: (points: ScanPoint[]) => void,
  known: ReadonlyMap<number, SolveResult> = new Map(), reuse: (n: number) => void = () => undefined,
): WorkerPool<Engine> {
  const { nx, ny } = gridShape(plan);
  const bySeed = new Map<number, number>();
  for (let i = 0; i < nx * ny; i++) bySeed.set(pointSeed(plan.seed, i), i);
  /** The grid index of point k of a cold run (null: not a grid point: a boundary probe). */
  const gridIndex = (req: ColdRunRequest, k: number): number | null => {
    const index = bySeed.get(req.seeds[k]);
    if (index === undefined) return null;
    const same = JSON.stringify(req.points[k]) === JSON.stringify(gridPoint(plan, index % nx, Math.floor(index / nx)));
    return same ? index : null;
  };
  type Meanfield = { solveColdRun(req: ColdRunRequest): Promise<ColdOutcome[]> };
  const coldRun = async (mf: Meanfield, req: ColdRunRequest): Promise<ColdOutcome[]> => {
    const at = req.points.map((_, k) => gridIndex(req, k));
    const ask = at.map((index, k) => (index !== null && known.has(index) ? -1 : k)).filter((k) => k >= 0);
    const solved = ask.length ? await mf.solveColdRun({ points: ask.map((k) => req.points[k]), seeds: ask.map((k) => req.seeds[k]) }) : [];
    const out: ColdOutcome[] = at.map((index) => (index !== null && known.has(index) ? { cold: { state: known.get(index) as SolveResult, searchCell: null } } : {}));
    ask.forEach((k, j) => { out[k] = solved[j]; });
    if (ask.length < req.points.length) reuse(req.points.length - ask.length);
    const pts: ScanPoint[] = [];
    ask.forEach((k, j) => {
      const index = at[k], o = solved[j];
      if (index !== null && o.cold) pts.push({ index, ix: index % nx, iy: Math.floor(index / nx), state: o.cold.state });
    });
    if (pts.length) report(pts);
    return out;
  };
  const watch = (remote: object) => new Proxy(remote, {
    get(target, key) {
      const value = Reflect.get(target, key) as unknown;
      if (key !== 'meanfield') return value;
      const mf = value as Meanfield;
      return new Proxy(mf, {
        get(t, k) {
          return k === 'solveColdRun' ? (req: ColdRunRequest) => coldRun(t, req) : Reflect.get(t, k) as unknown;
        },
      });
    },
  });
  const watched = Object.create(pool) as WorkerPool<Engine>;
  watched.run = (tasks, exec, opts) => pool.run(tasks, (remote, task, i, slot) => exec(watch(remote) as typeof remote, task, i, slot), opts);
  return watched;
}
