/**
 * The one table of a map's output columns as plain strings and numbers, for every writer
 * of a map (the CLI's files and the page's exports, so two writers of one map give the
 * same bytes). An output format, not physics: it lives outside the core and builds text
 * only; the writing is the caller's:
 *
 *   ix, iy, <x axis>, [<y axis>], phase, fraction, cellSize, atSearchLimit, lockedFilling, cell, alpha, photonDensity,
 *   emitterDensity, excitationDensity, grandPotential, [mu], sublatticeDensities,
 *   sublatticeCoherences, [coexistLowFraction, coexistLowDensity, coexistHighDensity], error
 *
 * mu appears only when no axis holds it; the coexistence columns only for fixed density.
 * `fraction` is the pattern's (occupied sublattices over M, DESIGN.md "Phase labels"): a
 * period, not a filling, wherever the density is not locked (a supersolid, a density wave
 * at T > 0). `lockedFilling` is the filling p/q only where the density is locked to it
 * (plateauFraction: no condensate, every sublattice empty or full, the density equal to p/q
 * within the saturation tolerance); empty elsewhere. JSON points carry it too.
 * `atSearchLimit` is true where the winning pattern's cell is the largest searched
 * (cellSize = Mmax): such a point may be an artefact of the limit, and a larger Mmax can
 * replace it by a longer period (a thin 1/12 region on a 2D map, say).
 * Lists (sublattice densities, coherences, the cell's Hermite normal form a b c) are
 * space-separated inside one field. A point that could not be solved has empty state
 * fields and its reason in `error`; a solved point has an empty `error`.
 */
import type { ModelParams } from '../core/model.ts';
import type { SolveResult } from '../core/meanfield/ground-state.ts';
import type { Axis } from '../core/scan/axes.ts';
import type { ScanPlan, ScanPoint } from '../core/scan/grid.ts';
import type { ShardMeta } from '../core/scan/merge.ts';
import { toCSV, type Cell, type Table } from './csv.ts';
import { atSearchLimit, plateauFraction } from '../core/meanfield/plateaus.ts';

/** What fixes a map's columns and its file header. */
export interface MapHeader {
  x: Axis;
  y?: Axis;
  params: ModelParams;
  /** Set for one shard's output: the file then starts with the shard tag line. */
  shard: ShardMeta | null;
  /** The plan fixes the density (a density axis or rho in the base): coexistence columns. */
  fixedDensity: boolean;
}

/** The header of a plan's map (or of one shard of it). */
export function mapHeader(plan: ScanPlan, shard: ShardMeta | null = null): MapHeader {
  const fixedDensity = plan.base.rho !== undefined || plan.x.name === 'density' || plan.y?.name === 'density';
  return { x: plan.x, y: plan.y, params: plan.base, shard, fixedDensity };
}

/** First words of a shard's tag line (merge reads it back). */
export const SHARD_TAG = '# blockade-atlas map';

type Column = [name: string, value: (s: SolveResult) => Cell];

const list = (xs: number[]) => xs.map(String).join(' ');

/** The state columns of a map, in order. */
function stateColumns(h: MapHeader): Column[] {
  const cols: Column[] = [
    ['phase', (s) => s.phase], ['fraction', (s) => s.fraction ?? ''], ['cellSize', (s) => s.cellSize],
    ['atSearchLimit', (s) => String(atSearchLimit(s, h.params.maxCell))],
    ['lockedFilling', (s) => plateauFraction(s, h.params.maxCell) ?? ''],
    ['cell', (s) => `${s.cell.a} ${s.cell.b} ${s.cell.c}`], ['alpha', (s) => s.alpha],
    ['photonDensity', (s) => s.photonDensity], ['emitterDensity', (s) => s.emitterDensity],
    ['excitationDensity', (s) => s.excitationDensity], ['grandPotential', (s) => s.grandPotential],
  ];
  // with a mu axis the axis column already holds mu
  if (h.x.name !== 'mu' && h.y?.name !== 'mu') cols.push(['mu', (s) => s.mu]);
  cols.push(['sublatticeDensities', (s) => list(s.sublatticeDensities)], ['sublatticeCoherences', (s) => list(s.sublatticeCoherences)]);
  if (h.fixedDensity) {
    cols.push(
      ['coexistLowFraction', (s) => s.coexistence?.fractions[0] ?? ''],
      ['coexistLowDensity', (s) => s.coexistence?.phases[0].excitationDensity ?? ''],
      ['coexistHighDensity', (s) => s.coexistence?.phases[1].excitationDensity ?? ''],
    );
  }
  return cols;
}

/** The column names of a map, in order. */
export function mapColumns(h: MapHeader): string[] {
  return ['ix', 'iy', h.x.name, ...(h.y ? [h.y.name] : []), ...stateColumns(h).map(([n]) => n), 'error'];
}

/** The points (in the order given) as a table with the map's columns. */
export function mapTable(h: MapHeader, points: readonly ScanPoint[]): Table {
  const cols = stateColumns(h);
  const rows = points.map((pt): Cell[] => [
    pt.ix, pt.iy, h.x.values[pt.ix], ...(h.y ? [h.y.values[pt.iy]] : []),
    ...cols.map(([, f]) => (pt.state ? f(pt.state) : '')), pt.error ?? '',
  ]);
  return { columns: mapColumns(h), rows };
}

/** The shard tag line (with its line end), or '' outside a shard. */
export function shardTag(m: ShardMeta | null): string {
  return m ? `${SHARD_TAG} shard=${m.k}/${m.n} scan=${m.scan} nx=${m.nx} ny=${m.ny}\n` : '';
}

/** The CSV of a map (or of one shard, or of the finished part of one). */
export function mapCsv(h: MapHeader, points: readonly ScanPoint[]): string {
  return shardTag(h.shard) + toCSV(mapTable(h, points));
}

/** The model parameters as JSON-safe data (an infinite range is left out). */
export function paramsJson(p: ModelParams): ModelParams {
  const interaction = { ...p.interaction };
  if (interaction.rmax === Infinity) delete interaction.rmax;
  return { ...p, interaction };
}

/** One point as a JSON object: ix, iy, the axis values, then the state's fields or its error. */
export function mapJsonPoint(h: MapHeader, pt: ScanPoint): Record<string, unknown> {
  return {
    ix: pt.ix, iy: pt.iy, [h.x.name]: h.x.values[pt.ix], ...(h.y ? { [h.y.name]: h.y.values[pt.iy] } : {}),
    ...(pt.state ?? {}),
    ...(pt.state ? { atSearchLimit: atSearchLimit(pt.state, h.params.maxCell), lockedFilling: plateauFraction(pt.state, h.params.maxCell) } : {}),
    ...(pt.error !== undefined ? { error: pt.error } : {}),
  };
}

/** The JSON document of a map: { shard, complete, x, y, params, points }. */
export function mapJson(h: MapHeader, points: readonly ScanPoint[], complete: boolean): string {
  const pts = points.map((pt) => mapJsonPoint(h, pt));
  return JSON.stringify({ shard: h.shard, complete, x: h.x, y: h.y ?? null, params: paramsJson(h.params), points: pts }) + '\n';
}
