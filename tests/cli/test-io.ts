// A CliIo for tests: captured stdout and stderr, files in memory (or on disk when asked),
// real engine worker threads.
import type { CliIo } from '../../src/cli/io.ts';
import { runCli } from '../../src/cli/run.ts';
import { nodeEnginePool } from '../../workers/node-spawn.ts';

export interface Captured {
  code: number;
  out: string;
  err: string;
  files: Map<string, string>;
}

/** Run a command line in this process; `files` are readable inputs, written files land in the result; `extra` replaces parts of the io. */
export async function cli(argv: string[], files = new Map<string, string>(), interrupt?: AbortSignal, extra: Partial<CliIo> = {}): Promise<Captured> {
  let out = '', err = '';
  const io: CliIo = {
    stdout: (t) => void (out += t),
    stderr: (t) => void (err += t),
    stderrIsTTY: false,
    stderrColumns: 80,
    readText(path) {
      const t = files.get(path);
      if (t === undefined) throw Object.assign(new Error(`cannot read ${path}: no such file`), { name: 'InputError' });
      return t;
    },
    writeText: (path, text) => void files.set(path, text),
    pool(size) {
      const pool = nodeEnginePool(size);
      return { pool, release: () => pool.close() };
    },
    defaultWorkers: 2,
    interrupt: interrupt ?? new AbortController().signal,
    catchInterrupts: () => undefined,
    now: () => performance.now(),
    ...extra,
  };
  const code = await runCli(argv, io);
  return { code, out, err, files };
}
