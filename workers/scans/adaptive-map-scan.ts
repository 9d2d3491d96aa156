/**
 * The map scan: the adaptive map by default, the dense one (map-scan.ts) on request.
 *
 * Adaptive (docs/certified-maps.md): the map is worked in bands of rows (refinement.ts).
 * In each band the coarse grid's corners are solved cold, rectangles whose corners are one
 * crystal are certified, the others split until every pixel is certified or solved; then
 * each row segment is filled point by point exactly as the dense scan would give it
 * (certified-fill.ts, on the workers), and the band's rows are delivered in order, so a
 * writer can stream row by row (memory: one band of states, the coarse rows' corners and the
 * boundary crossings). Boundaries between crystals are located exactly on the affine axes
 * (boundaries.ts) with one confirming solve each. A plan that cannot be certified (T > 0,
 * fixed density, a temperature or density axis), a shard, or a window of segments that
 * are not whole rows is solved densely (same pixels), with a note saying so.
 * Progress counts full solves against the budget: solves so far plus the pixels of the
 * bands not yet finished.
 */
import { gridPoint, gridShape, pointSeed, rowCuts, spreadRows, type ScanPlan, type ScanPoint } from '../../src/core/scan/grid.ts';
import { applyAxis, type Axis } from '../../src/core/scan/axes.ts';
import { affineCoordinate, axisValue, certificationBlocker } from '../../src/core/scan/affine-axes.ts';
import { crystalOf, type Crystal } from '../../src/core/scan/crystal.ts';
import { bandRects, coarseColumns, coarseRows, corners, refineLevel, refineUniformLevel, segmentCrystal, subdivide, uniformNote, UNIFORM_STEP, type RegionCell } from '../../src/core/scan/refinement.ts';
import {
  affineCrossing, chainBoundaries, crossing, crystalOmega, phaseName, type Crossing,
} from '../../src/core/scan/boundaries.ts';
import type { ColdPoint } from '../../src/core/scan/certified-fill.ts';
import { packSegment } from '../../src/core/scan/segment-pixels.ts';
import { transfer } from 'comlink';
import {
  AffineFrame, BoundaryLines, CrystalModels, MAX_KNOWN_CRYSTALS, confirmFloor, lineKey, lowerCrystal, probes,
} from '../../src/core/scan/boundary-lines.ts';
import type { SolveResult } from '../../src/core/meanfield/ground-state.ts';
import type { ModelParams } from '../../src/core/model.ts';
import type { Engine } from '../engine.ts';
import type { WorkerPool } from '../pool.ts';
import type { ColdOutcome, MapScanRequest, MapScanResult, ScanOptions } from '../protocol.ts';
import { DEFAULT_POINT_BUDGET_MS, runMapScan } from './map-scan.ts';
import { shardSegments } from '../../src/core/scan/shards.ts';
import { lowest, rectPolygon, region, tied } from '../../src/core/scan/tie-rects.ts';
import type { Rect } from '../../src/core/scan/refinement.ts';

/** Least cold points per worker task (tasks stay small: a refinement level ends when its slowest task does). */
const COLD_TASK = 2;

/**
 * Segments per fill task. Most pixels of a map are certified and cost little to fill, so
 * a task of one 16-pixel segment spent about as long waiting on its round trip through
 * the scan's thread as computing (1D 200 x 200: 2,600 tasks).
 */
const FILL_RUN = 4;

/** Run a map: adaptive unless req.dense (or a case the adaptive map does not cover; see notes). */
export async function runMap(pool: WorkerPool<Engine>, req: MapScanRequest, o: ScanOptions<ScanPoint> = {}): Promise<MapScanResult> {
  const { nx, ny } = gridShape(req.plan);
  const dense = async (note?: string): Promise<MapScanResult> => {
    const from = req.fromRow;
    const q = from !== undefined && !req.segments ? { ...req, segments: shardSegments(nx, ny, req.shard).filter((s) => s.iy >= from) } : req;
    const r = await runMapScan(pool, q, o);
    const solved = q.segments ? q.segments.reduce((a, s) => a + s.length, 0) : req.shard ? r.points.length : nx * ny;
    return { ...r, solves: solved, ...(note ? { notes: [note] } : {}) };
  };
  if (req.dense) return dense();
  let rows: number[] | undefined;
  if (req.shard) {
    // a shard: the rows holding its segments (from fromRow on); only its own pixels are refined and filled
    const from = req.fromRow ?? 0;
    rows = [...new Set(shardSegments(nx, ny, req.shard).filter((s) => s.iy >= from).map((s) => s.iy))].sort((a, b) => a - b);
  } else if (req.segments) {
    const count = new Map<number, number>();
    for (const s of req.segments) count.set(s.iy, (count.get(s.iy) ?? 0) + s.length);
    if ([...count.values()].some((c) => c !== nx)) return dense('the segments asked for are not whole rows: solved densely (same pixels)');
    rows = [...count.keys()].sort((a, b) => a - b);
  } else if (req.fromRow !== undefined) {
    const from = Math.max(0, Math.min(ny, req.fromRow));
    rows = Array.from({ length: ny - from }, (_, i) => from + i);
  }
  const blocker = certificationBlocker(req.plan);
  const all = rows ?? Array.from({ length: ny }, (_, i) => i);
  if (blocker) {
    const r = await runAdaptive(pool, req, o, all, 'uniform');
    return { ...r, notes: [uniformNote(blocker), ...(r.notes ?? [])] };
  }
  return runAdaptive(pool, req, o, all, 'certify');
}


interface Band { y0: number; y1: number; rows: number[] }

/**
 * The banded adaptive map. mode 'certify': crystal rectangles are certified (exact);
 * 'uniform': rectangles whose corners share phase and cell are solved in that cell only
 * (refinement.ts refineUniformLevel; not certified, see uniformNote).
 */
async function runAdaptive(pool: WorkerPool<Engine>, req: MapScanRequest, o: ScanOptions<ScanPoint>, wanted: number[], mode: 'certify' | 'uniform'): Promise<MapScanResult> {
  const { plan } = req;
  const { nx, ny } = gridShape(plan);
  const continuation = req.continuation ?? true;
  const pointBudget = o.pointBudgetMs ?? DEFAULT_POINT_BUDGET_MS;
  const want = new Set(wanted);
  // a shard's own segments by row (undefined: every pixel of the wanted rows is produced)
  const own = req.shard ? ownSegments(nx, ny, req.shard, want) : undefined;
  const needed = (r: Rect) => !own || own.hits(r);
  const cols = coarseColumns(nx), crows = coarseRows(ny);
  let bands: Band[] = [];
  for (let j = 0; j < crows.length; j++) {
    const y0 = crows[j], y1 = crows[j + 1] ?? crows[j];
    const last = j + 2 >= crows.length; // the last band also produces its closing row
    const produced: number[] = [];
    for (let y = y0; y < y1 || (last && y === y1); y++) if (want.has(y)) produced.push(y);
    if (produced.length) bands.push({ y0, y1, rows: produced });
    if (last) break;
  }
  if (req.order === 'spread') {
    const rank = spreadRows(bands.length);
    bands = rank.map((r) => bands[r]);
  }
  const known = new Map<number, ColdOutcome>();
  // the crystal of each cold outcome, computed once
  const knownCrystal = new WeakMap<ColdOutcome, Crystal | null>();
  const points: ScanPoint[] = [];
  const crossings: Crossing[] = [];
  const edgeRows = new Map<number, Array<SolveResult | undefined>>();
  const located = locateState(plan);
  let solves = 0, cellSolves = 0, boundarySolves = 0, remaining = own ? own.pixels : bands.reduce((a, b) => a + b.rows.length * nx, 0);
  const progress = () => o.onProgress?.(solves, solves + remaining);

  // one signal for both branches of the band pipeline below: the caller's, or a failure of either
  const stop = new AbortController();
  const onAbort = () => stop.abort(o.signal?.reason);
  if (o.signal?.aborted) onAbort(); else o.signal?.addEventListener('abort', onAbort, { once: true });
  const detach = () => o.signal?.removeEventListener('abort', onAbort);
  const signal = stop.signal;

  // cold solves (corners, tie points, boundary confirmations) go ahead of the fill's
  // segments in the pool's queue: the band pipeline's chain waits on them
  const solveCold = async (pts: Array<{ p: ModelParams; seed: number; what: string }>, boundary = false): Promise<ColdOutcome[]> => {
    const tasks: Array<typeof pts> = [];
    // at least COLD_TASK points a task, and about four tasks a worker (fewer round trips)
    const size = Math.max(COLD_TASK, Math.ceil(pts.length / (4 * pool.size)));
    for (let i = 0; i < pts.length; i += size) tasks.push(pts.slice(i, i + size));
    const res = await pool.run(tasks, async (remote, t) => {
      const r = await remote.meanfield.solveColdRun({ points: t.map((x) => x.p), seeds: t.map((x) => x.seed) });
      solves += t.length;
      if (boundary) boundarySolves += t.length;
      progress();
      return r;
    }, {
      signal,
      priority: 1,
      budgetMs: (t) => t.length * pointBudget,
      describe: (t) => `adaptive map corners ${t.map((x) => x.what).join('; ')}; first point ${JSON.stringify(t[0].p)}`,
      recover: (e, _i, t) => t.map(() => ({ error: e.message.replace(/\s*\n\s*/g, ' ') })),
    });
    return res.flat();
  };
  const at = (ix: number, iy: number) => `(${plan.x.name} = ${plan.x.values[ix]}${plan.y ? `, ${plan.y.name} = ${plan.y.values[iy]}` : ''})`;
  const ties = mode === 'certify' && located ? new TieCertifier(plan, located, solveCold) : null;

  /** A band's refinement: every pixel certified (a crystal), solved cold (known) or given its region's cell. */
  interface Refined { certified: Map<number, Crystal>; uniform: Map<number, RegionCell> }
  const refine = async (band: Band): Promise<Refined> => {
    await o.ready?.(); // a slow reader of the output pauses the scan (backpressure)
    const certified = new Map<number, Crystal>();
    const uniform = new Map<number, RegionCell>();
    let rects = mode === 'uniform' ? subdivide(bandRects(cols, band.y0, band.y1), UNIFORM_STEP) : bandRects(cols, band.y0, band.y1);
    // a pixel's crystal: certified, or that of its cold state (null: not a crystal; undefined: not known)
    const classAt = (x: number, y: number): Crystal | null | undefined => {
      const i = y * nx + x;
      const c = certified.get(i);
      if (c) return c;
      const k = known.get(i);
      if (!k) return undefined;
      let v = knownCrystal.get(k);
      if (v === undefined) knownCrystal.set(k, v = crystalOf(k.cold?.state));
      return v;
    };
    for (let level = 0; rects.length && level < 64; level++) {
      rects = rects.filter(needed);
      const need = new Map<number, [number, number]>();
      for (const r of rects) for (const [x, y] of corners(r)) if (!known.has(y * nx + x) && !certified.has(y * nx + x)) need.set(y * nx + x, [x, y]);
      if (mode === 'certify') {
        // a corner between two pixels of one crystal on its row or column is that crystal: not solved
        for (const [i, [x, y]] of need) {
          const c = segmentCrystal(x, y, classAt, nx, band.y0, band.y1);
          if (c) { certified.set(i, c); need.delete(i); }
        }
      }
      const list = [...need.values()];
      const got = await solveCold(list.map(([x, y]) => ({ p: gridPoint(plan, x, y), seed: pointSeed(plan.seed, y * nx + x), what: at(x, y) })));
      list.forEach(([x, y], i) => known.set(y * nx + x, got[i]));
      const stateAt = (x: number, y: number) => known.get(y * nx + x)?.cold?.state;
      if (mode === 'uniform') {
        const lvl = refineUniformLevel(rects, stateAt);
        for (const { rect, region } of lvl.uniform) {
          for (let y = rect.y0; y <= rect.y1; y++) for (let x = rect.x0; x <= rect.x1; x++) uniform.set(y * nx + x, region);
        }
        rects = lvl.children;
        continue;
      }
      if (ties) rects = await ties.certify(rects, (x, y) => classAt(x, y) ?? null, certified);
      const lvl = refineLevel(rects, (x, y) => classAt(x, y) ?? null);
      for (const { rect, crystal } of lvl.certified) {
        for (let y = rect.y0; y <= rect.y1; y++) for (let x = rect.x0; x <= rect.x1; x++) certified.set(y * nx + x, crystal);
      }
      rects = lvl.children;
    }
    return { certified, uniform };
  };

  /**
   * A band's production: each wanted row's segments, point by point as the dense scan,
   * delivered in point order once the band before has delivered all of its points
   * (`previous`); resolves, at its last point, with the band's edges whose pixels differ.
   */
  const fill = (band: Band, refined: Promise<Refined>, previous: Promise<unknown>): Promise<EdgeJob[]> => new Promise((resolve, reject) => {
    // a task: up to FILL_RUN neighbouring segments of one row (each filled on its own, as
    // the dense scan fills it; one round trip to a worker for all)
    const segs: Array<{ iy: number; ix0: number; length: number; cuts: number[] }> = [];
    for (const iy of band.rows) {
      let ix0 = 0;
      for (const length of rowCuts(nx)) {
        if (!own || own.has(iy, ix0)) {
          const run = segs[segs.length - 1];
          if (run && run.iy === iy && run.ix0 + run.length === ix0 && run.cuts.length < FILL_RUN) {
            run.length += length;
            run.cuts.push(length);
          } else {
            segs.push({ iy, ix0, length, cuts: [length] });
          }
        }
        ix0 += length;
      }
    }
    // Points go out as soon as every segment before theirs is done (segs are in point
    // order), not at the band's end; of their states the band keeps those its boundary
    // edges need (a pixel beside a different one) and its rows kept whole for the next
    // bands (the last; in spread order the first too): memory of a band is its
    // boundaries and one row, not 16 rows of states.
    const rowStates = new Map<number, Array<SolveResult | undefined>>();
    const ids = new Map<Array<SolveResult | undefined>, Array<string | undefined>>();
    const idsOf = (row: Array<SolveResult | undefined>) => {
      let r = ids.get(row);
      if (!r) ids.set(row, r = Array.from(row, (st) => (st ? identity(st) : undefined)));
      return r;
    };
    const first = band.rows[0], last = band.rows[band.rows.length - 1];
    const whole = (iy: number) => iy === last || (req.order === 'spread' && iy === first);
    const rowOf = (iy: number) => {
      let r = rowStates.get(iy);
      if (!r) {
        rowStates.set(iy, r = new Array(nx));
        ids.set(r, new Array(nx));
      }
      return r;
    };
    // below row iy: the band's row iy - 1, or for the first row the last row of the band before
    const below = (iy: number) => rowStates.get(iy - 1) ?? (iy === first ? edgeRows.get(iy - 1) : undefined);
    // drop the state of (ix, iy) once every neighbour is known and none differs from it
    const settle = (ix: number, iy: number) => {
      const row = rowStates.get(iy);
      if (!row || whole(iy) || row[ix] === undefined) return;
      const id = idsOf(row)[ix];
      const around = [idsOf(row)[ix - 1], idsOf(row)[ix + 1]];
      if (plan.y) {
        const up = rowStates.get(iy + 1), down = below(iy);
        around.push(up ? idsOf(up)[ix] : undefined, down ? idsOf(down)[ix] : undefined);
      }
      if (around.every((n) => n === undefined || n === id)) row[ix] = undefined;
    };
    // the band's edges whose pixels differ (locate skips the others), its rows kept for the
    // next bands, and what the band no longer needs dropped: run once, at its last point
    const close = (): EdgeJob[] => {
      const edges: EdgeJob[] = [];
      const differ = (lo: Array<SolveResult | undefined>, hi: Array<SolveResult | undefined>, i: number, j: number) => {
        const a = idsOf(lo)[i], b = idsOf(hi)[j];
        return a !== undefined && b !== undefined && a !== b;
      };
      for (const iy of band.rows) {
        const s = rowStates.get(iy);
        if (!s) continue; // a shard's row without a segment of its own
        for (let ix = 0; ix + 1 < nx; ix++) if (differ(s, s, ix, ix + 1)) edges.push({ edge: `h${iy * nx + ix}`, axis: plan.x, a: s[ix], b: s[ix + 1], pa: gridPoint(plan, ix, iy), pb: gridPoint(plan, ix + 1, iy), va: plan.x.values[ix], vb: plan.x.values[ix + 1], fixed: plan.y ? [plan.y.values[iy]] : [], along: 0 });
        const up = rowStates.get(iy + 1) ?? (iy === last ? edgeRows.get(iy + 1) : undefined);
        const down = iy === first ? edgeRows.get(iy - 1) : undefined;
        const pairs: Array<[number, Array<SolveResult | undefined>, Array<SolveResult | undefined>]> = [];
        if (up && plan.y) pairs.push([iy, s, up]);
        if (down && plan.y) pairs.push([iy - 1, down, s]);
        for (const [y, lo, hi] of pairs) {
          const ya = (plan.y as Axis).values[y], yb = (plan.y as Axis).values[y + 1];
          for (let ix = 0; ix < nx; ix++) if (differ(lo, hi, ix, ix)) edges.push({ edge: `v${y * nx + ix}`, axis: plan.y as Axis, a: lo[ix], b: hi[ix], pa: gridPoint(plan, ix, y), pb: gridPoint(plan, ix, y + 1), va: ya, vb: yb, fixed: [plan.x.values[ix]], along: 1 });
        }
      }
      if (rowStates.has(first)) edgeRows.set(first, rowStates.get(first) as Array<SolveResult | undefined>);
      if (rowStates.has(last)) edgeRows.set(last, rowStates.get(last) as Array<SolveResult | undefined>);
      // in row order only the band's last row meets a later band (memory: one row, not the map's edges)
      if (req.order !== 'spread') for (const k of [...edgeRows.keys()]) if (k !== last) edgeRows.delete(k);
      ids.clear();
      rowStates.clear();
      // corners inside the band are done with; in row order so is every corner above its
      // closing row y1, where the next band starts (memory: one coarse row of corners, not
      // one a band of the map); later bands' refinements only read corners from y1 on
      const spread = req.order === 'spread';
      for (const [index] of known) {
        const iy = Math.floor(index / nx);
        if (spread ? iy > band.y0 && iy < band.y1 : iy < band.y1) known.delete(index);
      }
      return edges;
    };
    const done: Array<ScanPoint[] | undefined> = new Array(segs.length);
    let next = 0, open = false, computed = false, closed = false;
    const flush = () => {
      if (!open || closed) return;
      for (; next < segs.length && done[next]; next++) {
        for (const pt of done[next] as ScanPoint[]) {
          o.onItem?.(pt);
          if ((o as { keepPoints?: boolean }).keepPoints !== false) points.push(pt);
          const row = rowOf(pt.iy);
          row[pt.ix] = pt.state;
          (ids.get(row) as Array<string | undefined>)[pt.ix] = pt.state ? identity(pt.state) : undefined;
          if (rowStates.has(pt.iy - 1)) settle(pt.ix, pt.iy - 1);
        }
        done[next] = undefined;
      }
      if (computed && next === segs.length) {
        closed = true;
        try { resolve(close()); } catch (e) { reject(e); }
      }
    };
    const deliver = (k: number, pts: ScanPoint[]) => {
      done[k] = pts;
      flush();
    };
    previous.then(() => { open = true; flush(); }, reject);
    refined.then(({ certified, uniform }) => pool.run(segs, async (remote, seg, k) => {
      const segment = packSegment(plan, seg.iy, seg.ix0, seg.length, {
        crystal: (index) => certified.get(index), cold: (index) => known.get(index)?.cold, inCell: (index) => uniform.get(index),
      });
      const out = await remote.meanfield.fillSegment(transfer({ segment, cuts: seg.cuts, continuation }, [segment.crystalIndex.buffer]));
      deliver(k, out.map((r, i) => {
        solves += r.solves;
        cellSolves += r.cellSolves ?? 0;
        const ix = seg.ix0 + i;
        return { index: seg.iy * nx + ix, ix, iy: seg.iy, ...(r.state ? { state: r.state } : {}), ...(r.error !== undefined ? { error: r.error } : {}) };
      }));
      remaining -= seg.length;
      progress();
      return out.length;
    }, {
      signal,
      budgetMs: (seg) => seg.length * pointBudget,
      describe: (seg) => `adaptive map points ix ${seg.ix0}..${seg.ix0 + seg.length - 1}, iy ${seg.iy}; first point ${JSON.stringify(gridPoint(plan, seg.ix0, seg.iy))}`,
      recover: (e, k, seg) => {
        const error = e.message.replace(/\s*\n\s*/g, ' ');
        deliver(k, Array.from({ length: seg.length }, (_, i) => ({ index: seg.iy * nx + seg.ix0 + i, ix: seg.ix0 + i, iy: seg.iy, error })));
        remaining -= seg.length;
        return seg.length;
      },
    })).then(() => { computed = true; flush(); }, reject);
  });

  /** A band's boundary crossings (a shard locates none: its rows are cut into other shards' segments). */
  const locateBand = async (edges: EdgeJob[]) => {
    if (!own) crossings.push(...await locate(edges, plan, located, (pts) => solveCold(pts, true)));
  };

  // The bands run as a pipeline whose result does not depend on timing. Everything that
  // reads or writes the state shared across bands (the tie certifier's and the boundary
  // lines' confirmations, the crystals met) runs in one fixed order: refine band 0, refine
  // band 1, locate band 0, refine band 2, locate band 1, ... Filling a band (the bulk of
  // the solves) reads only its own refinement and runs beside that chain, its points held
  // until the band before has delivered its own. So a refinement level's or a locate
  // pass's last few solves no longer leave the other worker idle: it fills meanwhile
  // (the chain's cold solves go ahead in the pool's queue). At most two bands are filled
  // at once (memory: two bands of points in flight).
  let chain: Promise<unknown> = Promise.resolve();
  const step = <R>(f: () => Promise<R>): Promise<R> => {
    const p = chain.then(f);
    chain = p;
    return p;
  };
  let delivered: Promise<unknown> = Promise.resolve();
  let toLocate: Promise<EdgeJob[]> | null = null;
  try {
    for (const band of bands) {
      const edges = fill(band, step(() => refine(band)), delivered);
      delivered = edges;
      if (toLocate) {
        const e = toLocate;
        step(async () => locateBand(await e));
      }
      toLocate = edges;
    }
    if (toLocate) {
      const e = toLocate;
      step(async () => locateBand(await e));
    }
    await Promise.all([chain, delivered]);
  } catch (e) {
    stop.abort(e); // the other branch of the pipeline stops too
    throw e;
  } finally {
    detach();
  }
  const centre = (ix: number, iy: number) => [
    (plan.x.values[ix] + plan.x.values[ix + 1]) / 2, ...(plan.y ? [(plan.y.values[iy] + plan.y.values[iy + 1]) / 2] : []),
  ];
  const boundaries = chainBoundaries(crossings, nx, ny, centre);
  o.onProgress?.(solves, solves);
  return {
    points, solves, boundarySolves, boundaries, ...(mode === 'uniform' ? { cellSolves } : {}),
    ...(own ? { notes: [SHARD_NOTE] } : {}),
  };
}

/** The note of an adaptive shard. */
export const SHARD_NOTE = 'a shard refines only the rectangles that hold its own segments and locates no boundary lines (same pixels); run the map unsharded for the lines';

/** A shard's own pixels: its segments, by row, among the wanted rows. */
function ownSegments(nx: number, ny: number, shard: { k: number; n: number }, want: ReadonlySet<number>) {
  const byRow = new Map<number, Array<[number, number]>>();
  let pixels = 0;
  for (const s of shardSegments(nx, ny, shard)) {
    if (!want.has(s.iy)) continue;
    byRow.set(s.iy, [...(byRow.get(s.iy) ?? []), [s.ix0, s.ix0 + s.length - 1]]);
    pixels += s.length;
  }
  return {
    pixels,
    /** Whether the segment of row iy starting at ix0 is the shard's. */
    has: (iy: number, ix0: number) => (byRow.get(iy) ?? []).some(([a]) => a === ix0),
    /** Whether the closed rectangle holds a pixel of the shard. */
    hits: (r: Rect) => {
      for (let y = r.y0; y <= r.y1; y++) for (const [a, b] of byRow.get(y) ?? []) if (a <= r.x1 && b >= r.x0) return true;
      return false;
    },
  };
}

/** An edge between neighbouring pixels, along one axis. */
interface EdgeJob {
  edge: string;
  axis: Axis;
  a?: SolveResult; b?: SolveResult;
  pa: ModelParams; pb: ModelParams;
  va: number; vb: number;
  /** The other axis's value (the crossing's fixed coordinate). */
  fixed: number[];
  /** 0: the crossing's varying coordinate is x; 1: it is y. */
  along: 0 | 1;
}

/** Seed of an edge's confirming solve: fixed by the edge alone (any band order). */
function edgeSeed(seed: number, edge: string, round: number): number {
  return pointSeed(seed ^ (0x5bd1e995 + round), 2 * Number(edge.slice(1)) + (edge[0] === 'v' ? 1 : 0));
}

const identity = (s: SolveResult | undefined) => crystalOf(s)?.key ?? phaseName(s);

/** Rounds of splitting an edge at a third crystal found at a crossing (the staircase's next fractions). */
const MAX_ROUNDS = 8;

/** What boundary location keeps across the bands of one map (boundary-lines.ts). */
export interface LocateState {
  lines: BoundaryLines;
  models: CrystalModels;
  /** Crystals met so far (pixels beside a boundary, confirming solves), one state each. */
  known: Map<string, { c: Crystal; s: SolveResult }>;
}

/** The locate state of a plan (null: an axis is not affine, every crossing solved on its own). */
export function locateState(plan: ScanPlan): LocateState | null {
  const frame = AffineFrame.of(plan);
  if (!frame) return null;
  const models = new CrystalModels(frame);
  return { lines: new BoundaryLines(models), models, known: new Map() };
}

function remember(st: LocateState | null, s: SolveResult): void {
  const c = crystalOf(s);
  if (st && c && !st.known.has(c.key) && st.known.size < MAX_KNOWN_CRYSTALS) st.known.set(c.key, { c, s });
}

/**
 * The crossings of the edges whose pixels differ (boundaries.ts). Between two crystals A, B
 * the crossing is computed in closed form and confirmed (no state below there), which costs
 * a solve only when neither shortcut of boundary-lines.ts settles it: a crossing inside the
 * confirmed interval of the A|B line is confirmed; one where a crystal R already met lies
 * below is refuted by R. The rest are solved a few at a time (the probes of each line).
 * A refuted crossing splits its edge at the crossing into A|R and R|B, each located the same
 * way, for up to MAX_ROUNDS rounds.
 */
async function locate(
  edges: EdgeJob[], plan: ScanPlan, st: LocateState | null,
  solveCold: (pts: Array<{ p: ModelParams; seed: number; what: string }>) => Promise<ColdOutcome[]>,
): Promise<Crossing[]> {
  const out: Crossing[] = [];
  const put = (e: EdgeJob, v: number, a: string, b: string, exact: boolean, ra?: number, rb?: number) => {
    const point = e.along === 0 ? [v, ...e.fixed] : [...e.fixed, v];
    out.push(crossing(e.edge, a, b, point, exact, ra, rb));
  };
  interface Job { e: EdgeJob; a: SolveResult; b: SolveResult; va: number; vb: number }
  interface Check { j: Job; v: number; p: ModelParams; omega: number; A: Crystal; B: Crystal; line: string; t: number; s: number[] }
  let jobs: Job[] = [];
  for (const e of edges) {
    if (e.a && e.b && identity(e.a) !== identity(e.b)) {
      jobs.push({ e, a: e.a, b: e.b, va: e.va, vb: e.vb });
      remember(st, e.a);
      remember(st, e.b);
    }
  }
  for (let round = 0; jobs.length && round <= MAX_ROUNDS; round++) {
    const checks: Check[] = [];
    for (const j of jobs) {
      const { e } = j;
      const A = crystalOf(j.a), B = crystalOf(j.b);
      const ua = affineCoordinate(e.axis.name, j.va, plan.base), ub = affineCoordinate(e.axis.name, j.vb, plan.base);
      if (A && B && ua !== null && ub !== null && round < MAX_ROUNDS) {
        const pa = applyAxis(e.pa, e.axis.name, j.va), pb = applyAxis(e.pa, e.axis.name, j.vb);
        const t = affineCrossing(crystalOmega(pa, A) - crystalOmega(pa, B), crystalOmega(pb, A) - crystalOmega(pb, B));
        if (t !== null) {
          const v = t === 0 ? j.va : t === 1 ? j.vb : axisValue(e.axis.name, ua + t * (ub - ua), plan.base);
          const p = applyAxis(e.pa, e.axis.name, v);
          const s = st ? st.models.frame.coords(e.along === 0 ? [v, ...e.fixed] : [...e.fixed, v]) : [];
          const line = lineKey(A, B);
          checks.push({ j, v, p, omega: Math.min(crystalOmega(p, A), crystalOmega(p, B)), A, B, line, s, t: st ? st.lines.param(A, B, s) : 0 });
          continue;
        }
      }
      put(e, (j.va + j.vb) / 2, phaseName(j.a), phaseName(j.b), false);
    }
    const next: Job[] = [];
    const confirmed = (c: Check) => put(c.j.e, c.v, phaseName(c.j.a), phaseName(c.j.b), true, c.j.a.excitationDensity, c.j.b.excitationDensity);
    const refuted = (c: Check, s: SolveResult | undefined) => {
      const { j, v } = c;
      if (s && crystalOf(s) && v !== j.va && v !== j.vb) {
        next.push({ e: j.e, a: j.a, b: s, va: j.va, vb: v }, { e: j.e, a: s, b: j.b, va: v, vb: j.vb });
      } else {
        put(j.e, (j.va + v) / 2, phaseName(j.a), phaseName(s), false);
        put(j.e, (v + j.vb) / 2, phaseName(s), phaseName(j.b), false);
      }
    };
    // each pass settles every check it can without a solve, then solves the probes; a
    // pass removes at least one check (its probes), so checks.length + 1 passes suffice
    let pending = checks;
    for (let pass = 0; pending.length && pass <= checks.length; pass++) {
      const open: Check[] = [];
      for (const c of pending) {
        if (st && st.lines.covers(c.line, c.t)) { confirmed(c); continue; }
        const r = st ? lowerCrystal(st.models, [...st.known.values()].map((k) => k.c), c.s, c.omega, [c.A.key, c.B.key]) : null;
        if (r && st) { refuted(c, st.known.get(r.key)?.s); continue; }
        open.push(c);
      }
      let chosen: Check[];
      if (st) {
        const byLine = new Map<string, Check[]>();
        for (const c of open) byLine.set(c.line, [...(byLine.get(c.line) ?? []), c]);
        chosen = [];
        for (const [key, cs] of byLine) for (const i of probes(cs.map((c) => c.t), st.lines.interval(key))) chosen.push(cs[i]);
      } else {
        chosen = open;
      }
      const got = await solveCold(chosen.map((c) => ({ p: c.p, seed: edgeSeed(plan.seed, c.j.e.edge, round), what: `boundary ${c.j.e.axis.name} = ${c.v}` })));
      chosen.forEach((c, i) => {
        const s = got[i].cold?.state;
        if (s && s.grandPotential >= confirmFloor(c.omega)) {
          st?.lines.confirm(c.line, c.t);
          confirmed(c);
        } else {
          if (s) remember(st, s);
          refuted(c, s);
        }
      });
      const done = new Set(chosen);
      pending = open.filter((c) => !done.has(c));
    }
    jobs = next;
  }
  for (const j of jobs) put(j.e, (j.va + j.vb) / 2, phaseName(j.a), phaseName(j.b), false);
  return out;
}

type SolveCold = (pts: Array<{ p: ModelParams; seed: number; what: string }>) => Promise<ColdOutcome[]>;

/** Rounds of confirming solves per refinement level (each solves at most two points a tie line). */
const TIE_PASSES = 6;

/** Relative Omega difference within which crystals count as tied at a polygon vertex (rounding of the vertex). */
const VERTEX_TOL = 1e-11;

/** 32-bit FNV-1a of a string (a confirming solve's seed from its point). */
function hash32(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193) >>> 0;
  return h;
}

/**
 * Refinement rectangles whose corners are two or more crystals, certified polygon by
 * polygon of the crystals' lower envelope (tie-rects.ts) once every vertex of every polygon
 * is confirmed: a corner (solved) carrying that polygon's crystal, or a tie point where a
 * solve's winner is one of the tied crystals, or a point inside a confirmed interval of one
 * of their tie lines (two confirmed points confirm the segment between them,
 * boundary-lines.ts). A winner below the tie that is a crystal joins the envelope (the
 * polygons are recomputed with it); any other refutes the rectangle, which is split as
 * before. A confirmation here also confirms the crossing for the boundary lines (a winner
 * among the tied crystals lies within their tolerance).
 */
class TieCertifier {
  private readonly strict: BoundaryLines;
  private readonly sx: number[];
  private readonly sy: number[];
  private readonly ux: [number, number];
  private readonly uy: [number, number];
  /** Crystals met at refuted tie points: they join every rectangle's envelope. */
  private readonly lower = new Map<string, Crystal>();

  constructor(private readonly plan: ScanPlan, private readonly st: LocateState, private readonly solveCold: SolveCold) {
    this.strict = new BoundaryLines(st.models);
    const frame = st.models.frame;
    const y0 = plan.y ? [plan.y.values[0]] : [];
    this.sx = plan.x.values.map((v) => frame.coords([v, ...y0])[0]);
    this.sy = plan.y ? plan.y.values.map((v) => frame.coords([plan.x.values[0], v])[1]) : [0];
    const range = (a?: Axis): [number, number] => (a
      ? [affineCoordinate(a.name, a.values[0], plan.base) as number, affineCoordinate(a.name, a.values[a.values.length - 1], plan.base) as number]
      : [0, 0]);
    this.ux = range(plan.x);
    this.uy = range(plan.y);
  }

  private sAt = (ix: number, iy: number): number[] => (this.plan.y ? [this.sx[ix], this.sy[iy]] : [this.sx[ix]]);

  /** The parameters at normalised coordinates s. */
  private paramsAt(s: number[]): ModelParams {
    const { plan } = this;
    let p = applyAxis(plan.base, plan.x.name, axisValue(plan.x.name, this.ux[0] + s[0] * (this.ux[1] - this.ux[0]), plan.base));
    if (plan.y) p = applyAxis(p, plan.y.name, axisValue(plan.y.name, this.uy[0] + s[1] * (this.uy[1] - this.uy[0]), plan.base));
    return p;
  }

  /** Certify what it can of rects into certified (pixel index -> crystal); returns the rest. */
  async certify(rects: Rect[], crystalAt: (ix: number, iy: number) => Crystal | null, certified: Map<number, Crystal>): Promise<Rect[]> {
    const { plan } = this;
    const { nx } = gridShape(plan);
    const models = this.st.models;
    interface Job { rect: Rect; corners: Crystal[]; failed: boolean }
    interface Need { s: number[]; tied: Crystal[]; line: string; t: number; jobs: Job[] }
    const jobs: Job[] = [];
    const rest: Rect[] = [];
    for (const r of rects) {
      const cs = r.x1 - r.x0 > 1 || r.y1 - r.y0 > 1 ? corners(r).map(([x, y]) => crystalAt(x, y)) : [];
      const keys = new Set(cs.map((c) => c?.key));
      if (!cs.length || cs.some((c) => !c) || keys.size < 2) { rest.push(r); continue; }
      jobs.push({ rect: r, corners: cs as Crystal[], failed: false });
    }
    const envelope = (job: Job): Crystal[] => {
      const byKey = new Map<string, Crystal>();
      for (const c of [...job.corners, ...this.lower.values()]) byKey.set(c.key, c);
      return [...byKey.values()];
    };
    // the unconfirmed vertices of a job's polygons (null: refuted)
    const open = (job: Job, K: Crystal[]): Need[] | null => {
      const ms = K.map((c) => models.model(c));
      const poly = rectPolygon(job.rect, this.sAt);
      const out: Need[] = [];
      for (let k = 0; k < K.length; k++) {
        for (const v of region(poly, ms, k)) {
          if (v.corner) {
            if (crystalAt(v.corner[0], v.corner[1])?.key !== K[k].key) return null;
            continue;
          }
          const T = tied(ms, v.s, VERTEX_TOL);
          if (T.length < 2 || !T.includes(k)) return null;
          const pairs: Array<[Crystal, Crystal]> = [];
          for (const i of T) for (const j of T) if (i < j) pairs.push([K[i], K[j]]);
          if (pairs.some(([a, b]) => this.strict.covers(lineKey(a, b), this.strict.param(a, b, v.s)))) continue;
          const other = K[T.find((i) => i !== k) as number];
          out.push({ s: v.s, tied: T.map((i) => K[i]), line: lineKey(K[k], other), t: this.strict.param(K[k], other, v.s), jobs: [job] });
        }
      }
      return out;
    };
    for (let pass = 0; pass < TIE_PASSES; pass++) {
      const byLine = new Map<string, Need[]>();
      for (const job of jobs) {
        if (job.failed) continue;
        const needs = open(job, envelope(job));
        if (!needs) { job.failed = true; continue; }
        for (const n of needs) byLine.set(n.line, [...(byLine.get(n.line) ?? []), n]);
      }
      if (!byLine.size) break;
      const chosen: Need[] = [];
      for (const [line, ns] of byLine) for (const i of probes(ns.map((n) => n.t), this.strict.interval(line))) chosen.push(ns[i]);
      const got = await this.solveCold(chosen.map((n) => ({
        p: this.paramsAt(n.s), seed: pointSeed(plan.seed ^ 0x7f4a7c15, hash32(n.s.join(','))), what: `tie point at ${n.s.join(', ')}`,
      })));
      chosen.forEach((n, i) => {
        const w = crystalOf(got[i].cold?.state);
        if (w && n.tied.some((c) => c.key === w.key)) {
          for (const a of n.tied) for (const b of n.tied) {
            if (a.key < b.key) {
              const t = this.strict.param(a, b, n.s);
              this.strict.confirm(lineKey(a, b), t);
              this.st.lines.confirm(lineKey(a, b), t);
            }
          }
        } else if (w && !this.lower.has(w.key) && this.lower.size < MAX_KNOWN_CRYSTALS) {
          this.lower.set(w.key, w);
        } else {
          for (const j of n.jobs) j.failed = true;
        }
      });
    }
    for (const job of jobs) {
      const K = envelope(job);
      const needs = job.failed ? null : open(job, K);
      if (!needs || needs.length) { rest.push(job.rect); continue; }
      const ms = K.map((c) => models.model(c));
      for (let y = job.rect.y0; y <= job.rect.y1; y++) {
        for (let x = job.rect.x0; x <= job.rect.x1; x++) {
          const k = lowest(ms, this.sAt(x, y));
          if (k >= 0) certified.set(y * nx + x, K[k]);
        }
      }
    }
    return rest;
  }
}
