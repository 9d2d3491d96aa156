/**
 * What a command may touch of the outside world, passed in so the commands run the same
 * in the real process (nodeIo, used by main.ts) and in tests (captured output, a shared
 * pool). Ctrl-C arrives as the `interrupt` signal; a command that can stop cleanly and
 * write its finished part says so with catchInterrupts(true), otherwise Ctrl-C ends the
 * process at once.
 */
import { chmodSync, closeSync, existsSync, openSync, readFileSync, realpathSync, renameSync, rmSync, statfsSync, statSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { InputError } from '../core/input-error.ts';
import type { Engine } from '../../workers/engine.ts';
import type { WorkerPool } from '../../workers/pool.ts';
import { defaultWorkerCount, nodeEnginePool } from '../../workers/node-spawn.ts';
import { fileLineReader, type LineReader } from './line-reader.ts';
import { fileOutput, type OutputTarget } from './stream-writer.ts';

export interface CliIo {
  stdout(text: string): void;
  /**
   * Resolves once stdout has passed on what was queued ('drain'; at once when nothing is
   * queued, or stdout closed). Absent: stdout never pushes back.
   */
  stdoutDrained?(): Promise<void>;
  stderr(text: string): void;
  /** Is stderr a terminal (progress bar) and how wide. */
  stderrIsTTY: boolean;
  stderrColumns: number;
  /** When stderr is not a terminal: seconds between plain progress lines (undefined: none). */
  progressEvery?: number;
  readText(path: string): string;
  writeText(path: string, text: string): void;
  /**
   * Refuse an --out path that cannot be written (missing folder, read-only, no space) with
   * an InputError, before any work starts (runCli calls it). Absent: no check (files in memory).
   */
  checkOutput?(path: string): void;
  /**
   * Open a file for streaming output (stream-writer.ts), continuing the part there when
   * `resume`. Absent: the file is kept in memory through readText and writeText.
   */
  openOutput?(path: string, resume: boolean): OutputTarget;
  /** Read a file a line at a time (merge of big parts). Absent: through readText. */
  openLines?(path: string): LineReader;
  /** A worker pool of `size` engines; the command closes it with release(). */
  pool(size: number): { pool: WorkerPool<Engine>; release(): void };
  /** Default --workers. */
  defaultWorkers: number;
  /** Aborted on Ctrl-C. */
  interrupt: AbortSignal;
  catchInterrupts(on: boolean): void;
  /** Monotonic milliseconds. */
  now(): number;
}

/**
 * Run `work` on a pool of `size` engines that Ctrl-C stops cleanly: `complete` is false when
 * it was interrupted (what `work` delivered before then is final). The pool is released
 * and Ctrl-C handling restored either way; errors other than the interruption propagate.
 */
export async function interruptible<T>(
  io: CliIo, size: number, work: (pool: WorkerPool<Engine>, signal: AbortSignal) => Promise<T>,
): Promise<{ complete: true; value: T } | { complete: false; value?: undefined }> {
  const { pool, release } = io.pool(size);
  io.catchInterrupts(true);
  try {
    return { complete: true, value: await work(pool, io.interrupt) };
  } catch (e) {
    if (e instanceof Error && e.name === 'AbortError') return { complete: false };
    throw e;
  } finally {
    release();
    io.catchInterrupts(false);
  }
}

/** Read a text file, refusing a missing or unreadable one with an InputError. */
export function readTextFile(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError(`cannot read ${path}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`, 'file');
  }
}

/** Free space an output folder must have before a run starts: a little, not a forecast of the file's size. */
export const MIN_FREE_BYTES = 1 << 20;

/** The file a write to `path` goes through: beside it (same file system, so the rename is atomic). */
function tempBeside(path: string): string {
  return `${path}.${process.pid}.tmp`;
}

/** Write to the file a symlink points at, not over the link. */
function realTarget(path: string): string {
  return existsSync(path) ? realpathSync(path) : path;
}

function cannotWrite(path: string, e: unknown): InputError {
  const code = (e as NodeJS.ErrnoException).code;
  const why = code === 'ENOENT' ? `cannot create a file in ${dirname(path)}`
    : code === 'ENOTDIR' ? `${dirname(path)} is not a folder`
    : code === 'EISDIR' ? 'it is a folder'
    : code === 'EACCES' || code === 'EPERM' || code === 'EROFS' ? `it is read-only (${code})`
    : code === 'ENOSPC' || code === 'EDQUOT' ? `no space left (${code})`
    : code ?? (e as Error).message;
  return new InputError(`cannot write ${path}: ${why}`, 'out');
}

function refuse(path: string, why: string): InputError {
  return new InputError(`cannot write ${path}: ${why}`, 'out');
}

/**
 * Check that `path` can be written before the work that fills it: its folder exists, a file
 * can be created beside it (so the final rename will work), an existing file there is not
 * read-only, and the folder has at least MIN_FREE_BYTES free. InputError otherwise.
 */
export function checkOutputPath(path: string): void {
  const target = realTarget(path);
  const folder = dirname(target);
  let folderStat;
  try {
    folderStat = statSync(folder, { throwIfNoEntry: false });
  } catch (e) {
    throw cannotWrite(path, e); // ENOTDIR: a file on the way, EACCES: a folder we may not enter
  }
  if (!folderStat) throw refuse(path, `the folder ${dirname(path)} does not exist`);
  if (!folderStat.isDirectory()) throw refuse(path, `${dirname(path)} is not a folder`);
  if (statSync(target, { throwIfNoEntry: false })?.isDirectory()) throw refuse(path, 'it is a folder');
  const probe = tempBeside(target);
  try {
    if (existsSync(target)) closeSync(openSync(target, 'r+')); // opened for writing, not changed
    closeSync(openSync(probe, 'wx'));
  } catch (e) {
    throw cannotWrite(path, e);
  } finally {
    rmSync(probe, { force: true });
  }
  const fs = statfsSync(folder);
  if (fs.bavail * fs.bsize < MIN_FREE_BYTES) throw refuse(path, `less than ${MIN_FREE_BYTES >> 20} MiB free in ${dirname(path)}`);
}

/**
 * Write a text file through a temporary file beside it renamed over it at the end, so a
 * failed write (no space, a killed process) never destroys an existing file; an unwritable
 * path is refused with an InputError.
 */
export function writeTextFile(path: string, text: string): void {
  const target = realTarget(path);
  const tmp = tempBeside(target);
  try {
    writeFileSync(tmp, text);
    const old = statSync(target, { throwIfNoEntry: false });
    if (old) chmodSync(tmp, old.mode & 0o7777); // the replacement keeps the file's permissions
    renameSync(tmp, target);
  } catch (e) {
    rmSync(tmp, { force: true });
    throw cannotWrite(path, e);
  }
}

/** ATLAS_PROGRESS=<seconds>: plain progress lines for logs (batch jobs); unset or bad: none. */
function progressInterval(v: string | undefined): number | undefined {
  const s = v === undefined ? NaN : Number(v);
  return Number.isFinite(s) && s >= 0 ? s : undefined;
}

/** Resolves when `stream` has no queued writes beyond its high-water mark (or is closed or broken). */
export function drained(stream: NodeJS.WritableStream & { writableNeedDrain?: boolean; destroyed?: boolean }): Promise<void> {
  if (!stream.writableNeedDrain || stream.destroyed) return Promise.resolve();
  return new Promise((resolve) => {
    const done = () => {
      stream.off('drain', done);
      stream.off('close', done);
      stream.off('error', done);
      resolve();
    };
    stream.on('drain', done);
    stream.on('close', done);
    stream.on('error', done);
  });
}

/** The real process: stdout, stderr, files, worker threads, SIGINT. */
export function nodeIo(interrupt: AbortSignal, catchInterrupts: (on: boolean) => void): CliIo {
  return {
    stdout: (t) => void process.stdout.write(t),
    stdoutDrained: () => drained(process.stdout),
    stderr: (t) => void process.stderr.write(t),
    stderrIsTTY: Boolean(process.stderr.isTTY),
    stderrColumns: process.stderr.columns || 80,
    progressEvery: progressInterval(process.env.ATLAS_PROGRESS),
    readText: readTextFile,
    writeText: writeTextFile,
    checkOutput: checkOutputPath,
    openOutput: fileOutput,
    openLines(path) {
      try {
        return fileLineReader(path);
      } catch (e) {
        throw new InputError(`cannot read ${path}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`, 'file');
      }
    },
    pool(size) {
      const pool = nodeEnginePool(size);
      return { pool, release: () => pool.close() };
    },
    defaultWorkers: defaultWorkerCount(),
    interrupt,
    catchInterrupts,
    now: () => performance.now(),
  };
}
