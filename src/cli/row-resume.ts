/**
 * `--resume` of a task scan written through row-stream.ts (staircase points, softlines
 * results): read back the part on disk, as resume.ts does for a map. The file must start
 * with exactly the head this run writes; each row after it is handed to `check`, which
 * turns it into what the run keeps of it or refuses it (foreign) when it is not the row
 * expected there. A torn last line (no line end: the process died mid-write) is dropped,
 * as is the closing line of a JSON document (`],...`), written again at the end.
 */
import { foreign } from './resume.ts';
import type { LineReader } from './line-reader.ts';

/** The rows read back, and after each one the bytes of the file up to its end. */
export interface RowsBack<T> {
  items: T[];
  /** ends[i]: bytes from the start of the file to the end of row i (the head included). */
  ends: number[];
  /** Bytes of the head (0: no whole head on disk, nothing to keep). */
  headBytes: number;
}

/**
 * Read back rows after `head`. JSON rows (`json`) are parsed, the comma before every row
 * after the first stripped; CSV rows are passed as their text. `check(row, rank, lineNo)`
 * returns the row's item or throws foreign(...). At most `max` rows are accepted.
 */
export function readBackRows<T>(
  lines: LineReader, head: string, json: boolean, max: number, name: string,
  check: (row: unknown, rank: number, lineNo: number) => T,
): RowsBack<T> {
  const out: RowsBack<T> = { items: [], ends: [], headBytes: 0 };
  const headLines = head.split('\n').length - 1;
  try {
    let text = '', bytes = 0;
    for (let i = 0; i < headLines; i++) {
      const l = lines.next();
      if (!l || !l.ended) return out; // torn inside the head: nothing was done
      text += l.text + '\n';
      bytes += l.bytes;
    }
    if (text !== head) {
      const mine = head.split('\n'), theirs = text.split('\n');
      const d = theirs.findIndex((t, i) => t !== mine[i]);
      throw foreign(name, d + 1, `its header differs from this scan's: '${theirs[d].slice(0, 100)}' against '${mine[d].slice(0, 100)}'`);
    }
    out.headBytes = bytes;
    for (let lineNo = headLines + 1; ; lineNo++) {
      const l = lines.next();
      if (!l || !l.ended) return out; // the end, or a torn last line: dropped
      if (json && l.text.startsWith(']')) return out; // the closing line: written again at the end
      const rank = out.items.length;
      if (rank >= max) throw foreign(name, lineNo, `the scan has ${max} rows, the file more`);
      let row: unknown = l.text;
      if (json) {
        const comma = rank > 0 ? ',' : '';
        if (!l.text.startsWith(comma + '{')) throw foreign(name, lineNo, 'not a row of this document');
        try {
          row = JSON.parse(l.text.slice(comma.length));
        } catch {
          throw foreign(name, lineNo, 'not valid JSON');
        }
      }
      out.items.push(check(row, rank, lineNo));
      bytes += l.bytes;
      out.ends.push(bytes);
    }
  } finally {
    lines.close();
  }
}
