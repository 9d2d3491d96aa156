/**
 * Reading a big text file a line at a time in bounded memory (a part of a 2000 x 2000 map
 * is hundreds of megabytes): `resume` reads back what a run wrote, `merge` reads its parts.
 * Each line comes with its length in bytes and whether it ended with a line end, so a torn
 * last line (a process killed mid-write) is recognised and can be cut off exactly.
 */
import { closeSync, openSync, readSync } from 'node:fs';

/** One line: its text (without the line end), its size in bytes with the line end, and whether it had one. */
export interface Line {
  text: string;
  bytes: number;
  ended: boolean;
}

/** Lines in order; null after the last. */
export interface LineReader {
  next(): Line | null;
  close(): void;
}

/** Bytes read from a file at a time. */
const CHUNK = 1 << 16;
/** Longest line accepted: far beyond any row (a JSON head holds two axes' values). */
const MAX_LINE = 1 << 28;

/** The lines of a file on disk, read in chunks of 64 KiB (memory: one chunk and the longest line). */
export function fileLineReader(path: string): LineReader {
  const fd = openSync(path, 'r');
  const chunk = Buffer.allocUnsafe(CHUNK);
  let pending: Buffer[] = [];
  let pendingBytes = 0;
  let buf = Buffer.alloc(0);
  let eof = false;
  let closed = false;
  const take = (end: number, ended: boolean): Line => {
    const part = buf.subarray(0, end);
    const whole = pending.length ? Buffer.concat([...pending, part]) : part;
    pending = [];
    pendingBytes = 0;
    buf = buf.subarray(ended ? end + 1 : end);
    return { text: whole.toString('utf8').replace(/\r$/, ''), bytes: whole.length + (ended ? 1 : 0), ended };
  };
  return {
    next() {
      for (;;) {
        const nl = buf.indexOf(0x0a);
        if (nl >= 0) return take(nl, true);
        if (eof) return buf.length || pendingBytes ? take(buf.length, false) : null;
        if (buf.length) {
          pending.push(Buffer.from(buf));
          pendingBytes += buf.length;
          if (pendingBytes > MAX_LINE) throw new Error(`${path}: a line longer than ${MAX_LINE} bytes`);
        }
        const n = readSync(fd, chunk, 0, CHUNK, null);
        if (n === 0) eof = true;
        buf = chunk.subarray(0, n);
      }
    },
    close() {
      if (!closed) closeSync(fd);
      closed = true;
    },
  };
}

/** The lines of a text held in memory (tests, small files). */
export function textLineReader(text: string): LineReader {
  let at = 0;
  return {
    next() {
      if (at >= text.length) return null;
      const nl = text.indexOf('\n', at);
      const end = nl < 0 ? text.length : nl;
      const line = text.slice(at, end);
      at = nl < 0 ? text.length : nl + 1;
      return { text: line.replace(/\r$/, ''), bytes: Buffer.byteLength(line) + (nl < 0 ? 0 : 1), ended: nl >= 0 };
    },
    close() {},
  };
}
