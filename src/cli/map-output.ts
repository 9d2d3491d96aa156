/**
 * The files `map` writes and `merge` reads back. The columns and both formats are the
 * project's one map table (src/formats/map-columns.ts, which the page's export uses too):
 *
 * CSV: a header naming every column, one row a point (ix, iy, the axis values, then the
 * state, then `error`, empty for a solved point); lists are space-separated inside one
 * field; quoting by the one CSV writer (src/formats/csv.ts). A shard's file starts with
 * one comment line `# blockade-atlas map shard=k/n scan=<hex> nx=.. ny=..` that merge
 * reads and drops (pandas: read_csv(..., comment='#')).
 * JSON: { shard, complete, x, y, params, points: [{ix, iy, <axis>: value, ...state | error}] }.
 */
import { InputError } from '../core/input-error.ts';
import type { ShardMeta, ShardPart } from '../core/scan/merge.ts';
import { parseCsvLine } from '../formats/csv.ts';
import { SHARD_TAG } from '../formats/map-columns.ts';

export { mapCsv, mapJson, mapHeader, type MapHeader } from '../formats/map-columns.ts';

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
  const names = parseCsvLine(header) ?? [];
  const ixCol = names.indexOf('ix'), iyCol = names.indexOf('iy');
  if (ixCol < 0 || iyCol < 0) throw new InputError(`${source}: the header has no ix, iy columns`, 'merge');
  const rows = lines.slice(2).map((line, i) => {
    const f = parseCsvLine(line);
    if (!f) throw new InputError(`${source} line ${i + 3} has an unclosed quote (cut short?)`, 'merge');
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
