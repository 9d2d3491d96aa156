/**
 * How the CLI's `map` is computed: the adaptive map (workers/scans/adaptive-map-scan.ts,
 * docs/certified-maps.md) as one scan over whole rows from the first row not yet written
 * (it delivers a band of rows at a time in point order, so the writer streams it), or the
 * dense scan in windows of segments (map-stream.ts) when asked (--dense) or for a plan at
 * fixed density. A shard is adaptive too: it refines only the rectangles holding its own
 * segments and delivers only its pixels (no boundary lines; the scan's note says so). A plan the argument does not certify (T > 0, a temperature axis)
 * is refined without certification (the scan's note says so). The reasons are notes for
 * stderr and the JSON summary (map-summary.ts).
 */
import { certificationBlocker } from '../core/scan/affine-axes.ts';
import { uniformNote } from '../core/scan/refinement.ts';
import type { ScanPlan, ScanPoint } from '../core/scan/grid.ts';
import type { Shard } from '../core/scan/shards.ts';
import type { Engine } from '../../workers/engine.ts';
import type { WorkerPool } from '../../workers/pool.ts';
import type { MapScanResult } from '../../workers/protocol.ts';
import { runScan } from '../../workers/scan-driver.ts';
import { SHARD_NOTE } from '../../workers/scans/adaptive-map-scan.ts';
import type { MapSummary } from './map-summary.ts';


/** The note of --dense. */
export const DENSE_NOTE = 'solved densely on request (--dense): every pixel solved, no boundary lines';

/** How a map run goes: adaptive or dense, and why not adaptive. */
export interface MapMode {
  adaptive: boolean;
  /** Why the map is dense (empty when adaptive). */
  notes: string[];
}

/** The mode of a map: adaptive unless --dense (a shard too). */
export function mapMode(plan: ScanPlan, shard: Shard | undefined, dense: boolean): MapMode {
  if (dense) return { adaptive: false, notes: [DENSE_NOTE] };
  const blocker = certificationBlocker(plan);
  const part = shard ? [SHARD_NOTE] : [];
  if (!blocker) return { adaptive: true, notes: part };
  // a plan that cannot be certified is refined without certification
  return { adaptive: true, notes: [uniformNote(blocker), ...part] };
}

/**
 * Run the adaptive map (or a shard's pixels of it) from row fromRow on, points to onItem
 * in point order (keepPoints false).
 */
export function runAdaptiveRows(
  pool: WorkerPool<Engine>, plan: ScanPlan, fromRow: number, continuation: boolean,
  o: { signal: AbortSignal; pointBudgetMs?: number; onItem: (pt: ScanPoint) => void }, shard?: Shard,
): Promise<MapScanResult> {
  return runScan(pool, { kind: 'map', plan, fromRow, continuation, ...(shard ? { shard } : {}) }, { ...o, keepPoints: false });
}

/**
 * The summary of a run: the adaptive scan's figures and lines, or (dense) every computed
 * point solved and no lines. `fromRow` > 0: a resumed map, whose figures and lines cover
 * only the rows computed after resuming (a note says so).
 */
export function mapSummary(mode: MapMode, result: MapScanResult | null, computed: number, fromRow: number): MapSummary {
  const notes = [...new Set([...mode.notes, ...(result?.notes ?? [])])];
  if (fromRow > 0) notes.push(`resumed at row ${fromRow}: solves and boundary lines count only the rows computed after resuming`);
  if (!mode.adaptive || !result) {
    return { solves: { total: computed, pixels: computed, boundaries: 0 }, notes, boundaries: null };
  }
  const total = result.solves ?? computed, b = result.boundarySolves ?? 0;
  const inCell = result.cellSolves !== undefined ? { inCell: result.cellSolves } : {};
  return { solves: { total, pixels: total - b, boundaries: b, ...inCell }, notes, boundaries: result.boundaries ?? [] };
}
