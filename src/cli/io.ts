/**
 * What a command may touch of the outside world, passed in so the commands run the same
 * in the real process (nodeIo, used by main.ts) and in tests (captured output, a shared
 * pool). Ctrl-C arrives as the `interrupt` signal; a command that can stop cleanly and
 * write its finished part says so with catchInterrupts(true), otherwise Ctrl-C ends the
 * process at once.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { InputError } from '../core/input-error.ts';
import type { Engine } from '../../workers/engine.ts';
import type { WorkerPool } from '../../workers/pool.ts';
import { defaultWorkerCount, nodeEnginePool } from '../../workers/node-spawn.ts';

export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /** Is stderr a terminal (progress bar) and how wide. */
  stderrIsTTY: boolean;
  stderrColumns: number;
  /** When stderr is not a terminal: seconds between plain progress lines (undefined: none). */
  progressEvery?: number;
  readText(path: string): string;
  writeText(path: string, text: string): void;
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

/** Write a text file, refusing an unwritable path with an InputError. */
export function writeTextFile(path: string, text: string): void {
  try {
    writeFileSync(path, text);
  } catch (e) {
    throw new InputError(`cannot write ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`, 'out');
  }
}

/** ATLAS_PROGRESS=<seconds>: plain progress lines for logs (batch jobs); unset or bad: none. */
function progressInterval(v: string | undefined): number | undefined {
  const s = v === undefined ? NaN : Number(v);
  return Number.isFinite(s) && s >= 0 ? s : undefined;
}

/** The real process: stdout, stderr, files, worker threads, SIGINT. */
export function nodeIo(interrupt: AbortSignal, catchInterrupts: (on: boolean) => void): CliIo {
  return {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    stderrIsTTY: Boolean(process.stderr.isTTY),
    stderrColumns: process.stderr.columns || 80,
    progressEvery: progressInterval(process.env.ATLAS_PROGRESS),
    readText: readTextFile,
    writeText: writeTextFile,
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
