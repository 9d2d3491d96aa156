/**
 * `merge` as a stream: the parts of `map --shard k/n` are read a line at a time, side by
 * side, and the joined map is written in point order as it goes (segment s of the grid
 * comes from part (s mod n) + 1), so memory holds one buffered chunk a part, whatever the
 * size of the map. Before any row: every part 1..n present once, of one format, from the
 * same scan (fingerprint, grid, columns). Then every row: the grid point it must be, its
 * values numbers where numbers belong (row-check.ts), whole (a line end, all fields); a
 * part that ends early, or a JSON part not closed as complete, is incomplete. Each
 * refusal names the part and, for a row, its line.
 */
import { InputError } from '../core/input-error.ts';
import { parseCsvLine } from '../formats/csv.ts';
import type { ShardMeta } from '../core/scan/merge.ts';
import { SHARD_TAG } from '../formats/map-columns.ts';
import type { Line, LineReader } from './line-reader.ts';
import { jsonHead, jsonTail, type MapFormat } from './map-layout.ts';
import { csvRowProblem, jsonRowProblem } from './row-check.ts';
import { ShardSegments } from './shard-cursor.ts';
import type { OutputTarget } from './stream-writer.ts';

/** One part open for reading. */
interface Part {
  source: string;
  format: MapFormat;
  meta: ShardMeta;
  lines: LineReader;
  lineNo: number;
  rows: number;
  /** CSV: the column header line; JSON: the head's fields. */
  header: string;
  columns: string[];
  doc: Record<string, unknown>;
  axes: string[];
  /** JSON: the closing line was read. */
  closed: boolean;
}

function refuse(message: string): InputError {
  return new InputError(message, 'merge');
}

function read(p: Part): Line | null {
  const l = p.lines.next();
  if (l) p.lineNo++;
  return l;
}

function parseTag(line: string, source: string): ShardMeta {
  const m = /^# blockade-atlas map shard=(\d+)\/(\d+) scan=([0-9a-f]+) nx=(\d+) ny=(\d+)\s*$/.exec(line);
  if (!m) throw refuse(`${source} is not the output of a map --shard run (its first line should be '${SHARD_TAG} shard=k/n ...')`);
  return { k: Number(m[1]), n: Number(m[2]), scan: m[3], nx: Number(m[4]), ny: Number(m[5]) };
}

/** Open a part and read its head (format, shard, columns). */
export function openPart(lines: LineReader, source: string): Part {
  const p: Part = { source, format: 'csv', meta: { k: 0, n: 0, scan: '', nx: 0, ny: 0 }, lines, lineNo: 0, rows: 0, header: '', columns: [], doc: {}, axes: [], closed: false };
  try {
    const first = read(p);
    if (!first) throw refuse(`${source} is empty`);
    if (first.text.startsWith('{')) {
      p.format = 'json';
      if (!first.ended || !first.text.endsWith(',"points":[')) throw refuse(`${source} is not a streamed map --shard --json part (its first line should end with "points":[)`);
      let doc: Record<string, unknown>;
      try {
        doc = JSON.parse(first.text + ']}') as Record<string, unknown>;
      } catch {
        throw refuse(`${source} line 1 is not valid JSON`);
      }
      const meta = doc.shard as ShardMeta | null;
      if (!meta || typeof meta.k !== 'number') throw refuse(`${source} is not the output of a map --shard run`);
      p.meta = meta;
      p.doc = doc;
      p.axes = [(doc.x as { name: string }).name, ...(doc.y ? [(doc.y as { name: string }).name] : [])];
      return p;
    }
    p.meta = parseTag(first.text, source);
    const head = read(p);
    if (!head || !head.ended) throw refuse(`${source} has no header line`);
    p.header = head.text;
    p.columns = parseCsvLine(head.text) ?? [];
    if (p.columns[0] !== 'ix' || p.columns[1] !== 'iy') throw refuse(`${source}: the header has no ix, iy columns`);
    return p;
  } catch (e) {
    lines.close();
    throw e;
  }
}

/** The checks on the set of parts (as mergeShards in src/core/scan/merge.ts makes them). */
function checkSet(parts: Part[]): Map<number, Part> {
  const first = parts[0];
  const { n, scan, nx, ny } = first.meta;
  const byK = new Map<number, Part>();
  for (const part of parts) {
    const m = part.meta;
    if (part.format !== first.format) throw refuse(`${part.source} is ${part.format}, ${first.source} is ${first.format}: merge parts of one format`);
    if (m.n !== n) throw refuse(`${part.source} is part of a ${m.n}-part scan, ${first.source} of a ${n}-part scan`);
    if (m.scan !== scan || m.nx !== nx || m.ny !== ny) throw refuse(`${part.source} belongs to a different scan than ${first.source} (fingerprint ${m.scan} vs ${scan})`);
    if (part.header !== first.header) throw refuse(`${part.source} has other columns than ${first.source}`);
    const twin = byK.get(m.k);
    if (twin) throw refuse(`shard ${m.k}/${n} is given twice (${twin.source} and ${part.source})`);
    byK.set(m.k, part);
  }
  const missing: number[] = [];
  for (let k = 1; k <= n && missing.length <= 10; k++) if (!byK.has(k)) missing.push(k);
  if (missing.length > 0) {
    const names = missing.slice(0, 10).map((k) => `${k}/${n}`).join(', ') + (missing.length > 10 ? ', ...' : '');
    throw refuse(missing.length === 1 ? `shard ${names} is missing` : `${n - byK.size} shards are missing: ${names}`);
  }
  return byK;
}

function incomplete(p: Part): InputError {
  const expected = new ShardSegments(p.meta.nx, p.meta.ny, p.meta).points;
  return refuse(`shard ${p.meta.k}/${p.meta.n} (${p.source}) is incomplete: ${p.rows} of ${expected} points (continue it with map ... --resume)`);
}

/** The next row of a part, checked to be point (ix, iy); its text as the merged file holds it. */
function nextRow(p: Part, ix: number, iy: number): string {
  const l = read(p);
  const at = `${p.source} line ${p.lineNo}`;
  if (!l || (p.format === 'json' && l.text.startsWith(']'))) {
    if (l && l.text !== jsonTail(true).trimEnd()) throw refuse(`shard ${p.meta.k}/${p.meta.n} (${p.source}) is incomplete: ${p.rows} points, closed as not complete (continue it with map ... --resume)`);
    throw incomplete(p);
  }
  if (!l.ended) throw refuse(`${at} is cut short (no line end): the part is truncated`);
  let gotIx: unknown, gotIy: unknown, text = l.text;
  if (p.format === 'csv') {
    const f = parseCsvLine(l.text);
    const problem = csvRowProblem(p.columns, f);
    if (problem) throw refuse(`${at}: ${problem}`);
    [gotIx, gotIy] = [Number((f as string[])[0]), Number((f as string[])[1])];
  } else {
    const sep = p.rows > 0 ? ',' : '';
    if (!text.startsWith(sep + '{')) throw refuse(`${at}: not a point line`);
    text = text.slice(sep.length);
    let o: unknown;
    try {
      o = JSON.parse(text);
    } catch {
      throw refuse(`${at} is not valid JSON (cut short?)`);
    }
    const problem = jsonRowProblem(o, p.axes);
    if (problem) throw refuse(`${at}: ${problem}`);
    ({ ix: gotIx, iy: gotIy } = o as { ix: number; iy: number });
  }
  if (gotIx !== ix || gotIy !== iy) {
    throw refuse(`${at} holds point (ix ${String(gotIx)}, iy ${String(gotIy)}) where shard ${p.meta.k}/${p.meta.n} has (ix ${ix}, iy ${iy}): a point missing, repeated or not part of this shard`);
  }
  p.rows++;
  return text;
}

/** After its last row a part must end (JSON: closed as complete). */
function expectEnd(p: Part): void {
  const l = read(p);
  if (p.format === 'json') {
    if (!l || !l.text.startsWith(']')) throw refuse(`${p.source} line ${p.lineNo}: ${l ? `more points than shard ${p.meta.k}/${p.meta.n} has` : 'the closing line is missing (the part is truncated)'}`);
    if (l.text !== jsonTail(true).trimEnd()) throw refuse(`shard ${p.meta.k}/${p.meta.n} (${p.source}) is closed as not complete (continue it with map ... --resume)`);
    const more = read(p);
    if (more && more.text.trim() !== '') throw refuse(`${p.source} line ${p.lineNo}: text after the closing line`);
  } else if (l && l.text.trim() !== '') {
    throw refuse(`${p.source} line ${p.lineNo} holds more points than shard ${p.meta.k}/${p.meta.n} has`);
  }
}

/** Rows written between two waits for the output (stdout drained): what may queue in memory. */
const ROWS_PER_WAIT = 512;

/**
 * Join the parts (their line readers, named by source) into `target`; every
 * ROWS_PER_WAIT rows it waits until the output is ready, so a slow reader of stdout
 * slows the merge instead of queueing the map in memory.
 */
export async function mergeParts(inputs: { source: string; open: () => LineReader }[], target: OutputTarget): Promise<{ rows: number }> {
  if (inputs.length === 0) throw refuse('merge needs the output files of the shards');
  const parts: Part[] = [];
  try {
    for (const i of inputs) parts.push(openPart(i.open(), i.source));
    const byK = checkSet(parts);
    const { nx, ny } = parts[0].meta;
    const d = parts[0].doc;
    target.write(parts[0].format === 'csv' ? parts[0].header + '\n' : jsonHead({ shard: null, x: d.x, y: d.y ?? null, params: d.params }));
    const grid = new ShardSegments(nx, ny);
    const n = parts[0].meta.n;
    let rows = 0;
    for (let j = 0; j < grid.count; j++) {
      const seg = grid.at(j);
      const part = byK.get((seg.id % n) + 1) as Part;
      for (let i = 0; i < seg.length; i++) {
        const text = nextRow(part, seg.ix0 + i, seg.iy);
        target.write((parts[0].format === 'json' && rows > 0 ? ',' : '') + text + '\n');
        rows++;
        if (rows % ROWS_PER_WAIT === 0) await target.ready();
      }
    }
    for (const p of parts) expectEnd(p);
    if (parts[0].format === 'json') target.write(jsonTail(true));
    return { rows };
  } finally {
    for (const p of parts) p.lines.close();
  }
}
