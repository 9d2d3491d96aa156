/**
 * Where a streaming command writes: an output file grown row by row, or stdout.
 *
 * A file is written to `<out>.partial` beside it and renamed over `<out>` when the run
 * ends (finished, or stopped by Ctrl-C / SIGTERM with its finished part), so an existing
 * file is never destroyed by a failed run; a run killed outright (SIGKILL) leaves the
 * `.partial` file, which `--resume` continues. With --resume the file to continue is the
 * `.partial` one if there is one, else `<out>` itself (appended to in place), else none
 * (a fresh run). Writes are buffered (64 KiB, or a second's worth) and go to the file with
 * plain synchronous writes, so what a killed process had flushed is on disk.
 *
 * Backpressure: stdout may be a pipe read more slowly than the scan computes. Its writes
 * are queued by Node without limit, so a producer that can pause (map-stream.ts before
 * each window, merge every few hundred rows) awaits `ready()` first: it resolves at once
 * for a file, and for stdout once what was queued has drained ('drain').
 */
import { chmodSync, closeSync, existsSync, ftruncateSync, openSync, realpathSync, renameSync, rmSync, statSync, writeSync } from 'node:fs';
import { InputError } from '../core/input-error.ts';
import { fileLineReader, textLineReader, type LineReader } from './line-reader.ts';

/** A streaming command's output. */
export interface OutputTarget {
  /** What to write it to, for messages. */
  name: string;
  /** The lines already there (only when resuming an existing part), else null. */
  existing(): LineReader | null;
  /** Keep the first `bytes` bytes of the existing content and write after them (drops a torn tail). */
  keep(bytes: number): void;
  /** Append text (buffered). */
  write(text: string): void;
  /** Push buffered text out. */
  flush(): void;
  /** Resolves when the output can take more without queueing in memory (stdout: after 'drain'). */
  ready(): Promise<void>;
  /** The run ended (finished or interrupted): make what was written the output. */
  commit(): void;
  /** The run failed: drop what this run started (a file being resumed keeps its rows). */
  abandon(): void;
}

/** Suffix of the file a run writes before it is renamed over its place. */
export const PARTIAL_SUFFIX = '.partial';
/** Buffer size before a write to disk. */
const FLUSH_BYTES = 1 << 16;
/** Longest time buffered text waits (ms): what a killed run can lose. */
const FLUSH_MS = 1000;

function writeError(path: string, e: unknown): InputError {
  return new InputError(`cannot write ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`, 'out');
}

/** Stream to a file on disk (see the module comment for the .partial file and --resume). */
export function fileOutput(path: string, resume: boolean): OutputTarget {
  const target = existsSync(path) ? realpathSync(path) : path;
  const partial = target + PARTIAL_SUFFIX;
  const file = resume && !existsSync(partial) && existsSync(target) ? target : partial;
  const resuming = resume && existsSync(file);
  let fd: number;
  try {
    fd = openSync(file, resuming ? 'r+' : 'w');
  } catch (e) {
    throw writeError(path, e);
  }
  let position = resuming ? statSync(file).size : 0;
  let chunks: string[] = [];
  let size = 0;
  let last = Date.now();
  let open = true;
  const flush = () => {
    if (!chunks.length) return;
    const buf = Buffer.from(chunks.join(''));
    chunks = [];
    size = 0;
    let off = 0;
    for (let tries = 0; off < buf.length && tries < 1e6; tries++) off += writeSync(fd, buf, off, buf.length - off, position + off);
    position += buf.length;
    last = Date.now();
  };
  const close = () => {
    if (open) closeSync(fd);
    open = false;
  };
  return {
    name: path,
    existing: () => (resuming ? fileLineReader(file) : null),
    keep(bytes) {
      ftruncateSync(fd, bytes);
      position = bytes;
    },
    write(text) {
      chunks.push(text);
      size += text.length;
      if (size >= FLUSH_BYTES || Date.now() - last >= FLUSH_MS) flush();
    },
    flush,
    ready: () => Promise.resolve(),
    commit() {
      try {
        flush();
        close();
        if (file === partial) {
          const old = statSync(target, { throwIfNoEntry: false });
          if (old) chmodSync(partial, old.mode & 0o7777); // the replacement keeps the file's permissions
          renameSync(partial, target);
        }
      } catch (e) {
        throw writeError(path, e);
      }
    },
    abandon() {
      try {
        flush();
      } catch {
        // the failure may be this very write (no space): nothing more to save
      }
      close();
      if (file === partial && !resuming) rmSync(partial, { force: true });
    },
  };
}

/**
 * Stream to stdout (nothing to resume). `drained` resolves once stdout has passed on what
 * was queued (absent: stdout never pushes back, as in tests).
 */
export function stdoutOutput(stdout: (text: string) => void, drained?: () => Promise<void>): OutputTarget {
  let chunks: string[] = [];
  let size = 0;
  const flush = () => {
    if (chunks.length) stdout(chunks.join(''));
    chunks = [];
    size = 0;
  };
  return {
    name: 'stdout',
    existing: () => null,
    keep: () => undefined,
    write(text) {
      chunks.push(text);
      size += text.length;
      if (size >= FLUSH_BYTES) flush();
    },
    flush,
    ready: () => (drained ? drained() : Promise.resolve()),
    commit: flush,
    abandon: flush,
  };
}

/**
 * A file kept in memory through read and write callbacks (tests): the same contract, the
 * text written whole at commit.
 */
export function memoryOutput(path: string, resume: boolean, read: (path: string) => string | undefined, write: (path: string, text: string) => void): OutputTarget {
  const before = resume ? read(path) : undefined;
  let text = before ?? '';
  return {
    name: path,
    existing: () => (before === undefined ? null : textLineReader(before)),
    keep(bytes) {
      text = Buffer.from(text).subarray(0, bytes).toString('utf8');
    },
    write(t) {
      text += t;
    },
    flush: () => undefined,
    ready: () => Promise.resolve(),
    commit: () => write(path, text),
    abandon: () => undefined,
  };
}

/** The output of a command: --out (through io.openOutput, else in memory through io's files) or stdout. */
export function outputFor(
  io: {
    stdout(t: string): void; stdoutDrained?(): Promise<void>; readText(p: string): string; writeText(p: string, t: string): void;
    openOutput?(p: string, resume: boolean): OutputTarget;
  },
  path: string | undefined, resume: boolean,
): OutputTarget {
  if (!path) return stdoutOutput((t) => io.stdout(t), io.stdoutDrained ? () => (io.stdoutDrained as () => Promise<void>)() : undefined);
  if (io.openOutput) return io.openOutput(path, resume);
  const read = (p: string) => {
    try {
      return io.readText(p);
    } catch {
      return undefined;
    }
  };
  return memoryOutput(path, resume, read, (p, t) => io.writeText(p, t));
}
