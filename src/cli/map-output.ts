/**
 * The files `map` writes and `merge` reads back.
 *
 * CSV: a header naming every column, one row a point (ix, iy, the axis values, then the
 * state); lists (sublattice densities, coherences) are space-separated inside one field.
 * A shard's file starts with one comment line `# blockade-atlas map shard=k/n scan=<hex>
 * nx=.. ny=..` that merge reads and drops (pandas: read_csv(..., comment='#')).
 * JSON: { shard, complete, x, y, params, points: [{ix, iy, <axis>: value, ...state}] }.
 */
import { InputError } from '../core/input-error.ts';
import type { ModelParams } from '../core/model.ts';
import type { Axis } from '../core/scan/axes.ts';
import type { ShardMeta, ShardPart } from '../core/scan/merge.ts';
import type { SolveResult } from '../core/meanfield/ground-state.ts';
import type { ScanPointResult } from '../../workers/protocol.ts';
import { paramsJson } from './state-format.ts';

export interface MapHeader {
  x: Axis;
  y?: Axis;
  params: ModelParams;
  shard: ShardMeta | null;
  /** The plan fixes the density (a density axis or --density): coexistence columns. */
  fixedDensity: boolean;
}

const SHARD_TAG = '# blockade-atlas map';

type Column = [name: string, value: (s: SolveResult) => string];

const num = (x: number) => String(x);
const list = (xs: number[]) => xs.map(num).join(' ');

function stateColumns(h: MapHeader): Column[] {
  const cols: Column[] = [
    ['phase', (s) => s.phase], ['fraction', (s) => s.fraction ?? ''], ['cellSize', (s) => num(s.cellSize)],
    ['cell', (s) => `${s.cell.a} ${s.cell.b} ${s.cell.c}`], ['alpha', (s) => num(s.alpha)],
    ['photonDensity', (s) => num(s.photonDensity)], ['emitterDensity', (s) => num(s.emitterDensity)],
    ['excitationDensity', (s) => num(s.excitationDensity)], ['grandPotential', (s) => num(s.grandPotential)],
  ];
  // With a mu axis the axis column already holds mu.
  if (h.x.name !== 'mu' && h.y?.name !== 'mu') cols.push(['mu', (s) => num(s.mu)]);
  cols.push(['sublatticeDensities', (s) => list(s.sublatticeDensities)], ['sublatticeCoherences', (s) => list(s.sublatticeCoherences)]);
  if (h.fixedDensity) {
    cols.push(
      ['coexistLowFraction', (s) => (s.coexistence ? num(s.coexistence.fractions[0]) : '')],
      ['coexistLowDensity', (s) => (s.coexistence ? num(s.coexistence.phases[0].excitationDensity) : '')],
      ['coexistHighDensity', (s) => (s.coexistence ? num(s.coexistence.phases[1].excitationDensity) : '')],
    );
  }
  return cols;
}

/** The CSV of a map (or of one shard, or of the finished part of one). */
export function mapCsv(h: MapHeader, points: readonly ScanPointResult[]): string {
  const cols = stateColumns(h);
  const axes = h.y ? [h.x, h.y] : [h.x];
  const head = ['ix', 'iy', ...axes.map((a) => a.name), ...cols.map(([n]) => n)].join(',');
  const lines = points.map((pt) => [
    pt.ix, pt.iy, num(h.x.values[pt.ix]), ...(h.y ? [num(h.y.values[pt.iy])] : []), ...cols.map(([, f]) => f(pt.state)),
  ].join(','));
  const tag = h.shard ? `${SHARD_TAG} shard=${h.shard.k}/${h.shard.n} scan=${h.shard.scan} nx=${h.shard.nx} ny=${h.shard.ny}\n` : '';
  return tag + head + '\n' + lines.map((l) => l + '\n').join('');
}

/** The JSON of a map. */
export function mapJson(h: MapHeader, points: readonly ScanPointResult[], complete: boolean): string {
  const pts = points.map((pt) => ({
    ix: pt.ix, iy: pt.iy, [h.x.name]: h.x.values[pt.ix], ...(h.y ? { [h.y.name]: h.y.values[pt.iy] } : {}), ...pt.state,
  }));
  return JSON.stringify({ shard: h.shard, complete, x: h.x, y: h.y ?? null, params: paramsJson(h.params), points: pts }) + '\n';
}

/** A map file read back for merging: CSV rows stay text, JSON points stay objects. */
export type MapFile =
  | { format: 'csv'; part: ShardPart<string>; header: string }
  | { format: 'json'; part: ShardPart<Record<string, unknown>>; doc: Record<string, unknown> };

/** Parse one shard's output (source names it in messages). */
export function readMapFile(text: string, source: string): MapFile {
  if (text.trimStart().startsWith('{')) return readJson(text, source);
  const lines = text.split(/\r?\n/).filter((l) => l.length > 0);
  const meta = parseTag(lines[0] ?? '', source);
  const header = lines[1];
  if (!header) throw new InputError(`${source} has no header line`, 'merge');
  const names = header.split(',');
  const ixCol = names.indexOf('ix'), iyCol = names.indexOf('iy');
  if (ixCol < 0 || iyCol < 0) throw new InputError(`${source}: the header has no ix, iy columns`, 'merge');
  const rows = lines.slice(2).map((line, i) => {
    const f = line.split(',');
    if (f.length !== names.length) throw new InputError(`${source} line ${i + 3} has ${f.length} fields, the header ${names.length}`, 'merge');
    return { index: pointIndex(Number(f[ixCol]), Number(f[iyCol]), meta, source), row: line };
  });
  return { format: 'csv', header, part: { source, meta, rows } };
}

function readJson(text: string, source: string): MapFile {
  let doc: Record<string, unknown>;
  try {
    doc = JSON.parse(text) as Record<string, unknown>;
  } catch {
    throw new InputError(`${source} is not valid JSON (cut short?)`, 'merge');
  }
  const meta = doc.shard as ShardMeta | null;
  if (!meta || typeof meta.k !== 'number') throw new InputError(`${source} is not the output of a map --shard run`, 'merge');
  const points = Array.isArray(doc.points) ? (doc.points as Record<string, unknown>[]) : [];
  const rows = points.map((p) => ({ index: pointIndex(Number(p.ix), Number(p.iy), meta, source), row: p }));
  return { format: 'json', doc, part: { source, meta, rows } };
}

function parseTag(line: string, source: string): ShardMeta {
  const m = /^# blockade-atlas map shard=(\d+)\/(\d+) scan=([0-9a-f]+) nx=(\d+) ny=(\d+)\s*$/.exec(line);
  if (!m) throw new InputError(`${source} is not the output of a map --shard run (its first line should be '${SHARD_TAG} shard=k/n ...')`, 'merge');
  return { k: Number(m[1]), n: Number(m[2]), scan: m[3], nx: Number(m[4]), ny: Number(m[5]) };
}

function pointIndex(ix: number, iy: number, m: ShardMeta, source: string): number {
  if (!(Number.isInteger(ix) && Number.isInteger(iy) && ix >= 0 && iy >= 0 && ix < m.nx && iy < m.ny)) {
    throw new InputError(`${source} holds a point (ix ${ix}, iy ${iy}) outside the ${m.nx} x ${m.ny} grid`, 'merge');
  }
  return iy * m.nx + ix;
}
