/**
 * Start engine workers as Node worker threads. Two ways, chosen by what this module is:
 * - built (dist/cli/atlas.mjs, see scripts/build-cli.mjs): the thread runs the plain
 *   JavaScript engine-worker-node.mjs built beside it; no TypeScript, no tsx.
 * - TypeScript sources (tests under vitest, the benchmark under tsx): Node 20 does not apply
 *   `--import tsx` loader hooks to a worker's own entry module (ERR_UNKNOWN_FILE_EXTENSION),
 *   so the thread starts from a tiny bootstrap that registers tsx's ESM loader first and
 *   then imports engine-worker-node.ts.
 */
import { Worker } from 'node:worker_threads';
import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { availableParallelism } from 'node:os';
import { wrap, releaseProxy } from 'comlink';
import nodeEndpoint from 'comlink/dist/esm/node-adapter.mjs';
import type { Engine } from './engine.ts';
import type { EngineHandle } from './pool.ts';
import { WorkerPool } from './pool.ts';

let tsxApi: string | undefined;

/** file: URL of tsx's ESM register API, read from tsx's own package exports. */
function tsxApiUrl(): string {
  if (tsxApi) return tsxApi;
  const req = createRequire(import.meta.url);
  const pkgPath = req.resolve('tsx/package.json');
  const pkg = JSON.parse(readFileSync(pkgPath, 'utf8')) as { exports: Record<string, { import: { default: string } }> };
  tsxApi = pathToFileURL(join(dirname(pkgPath), pkg.exports['./esm/api'].import.default)).href;
  return tsxApi;
}

/** Is this module running as built JavaScript (the bundled CLI) rather than from its .ts source? */
const BUILT = !import.meta.url.endsWith('.ts');

/** Start one worker thread running `entry` (default: the engine worker), built or under tsx. */
export function spawnNodeWorker(entry?: URL): Worker {
  // The young generation is capped at 4 MB: a worker's live heap is ~10 MB, and V8 grows
  // the young generation towards its cap over a long run, so a larger cap made a map's
  // resident memory grow with its length (peak RSS of a 1000 x 1000 map, 2 workers, with
  // the main thread's flags of `npm run atlas`: 186 MB at a 16 MB cap, 135 MB at 4 MB, the
  // 100 x 100 map 111 MB; CPU time of a 200 x 200 map the same within 2%).
  const resourceLimits = { maxYoungGenerationSizeMb: 4 };
  if (BUILT && !entry) return new Worker(new URL('./engine-worker-node.mjs', import.meta.url), { resourceLimits });
  const source = entry ?? new URL('./engine-worker-node.ts', import.meta.url);
  const code = `import(${JSON.stringify(tsxApiUrl())})` +
    `.then((m) => { m.register(); return import(${JSON.stringify(source.href)}); });`;
  return new Worker(code, { eval: true, resourceLimits });
}

/** One engine worker thread as a pool handle. */
export function spawnNodeEngine(): EngineHandle<Engine> {
  const worker = spawnNodeWorker();
  const remote = wrap<Engine>(nodeEndpoint(worker));
  let terminated = false;
  const failed = new Promise<never>((_, reject) => {
    worker.on('error', (e) => reject(e));
    worker.on('exit', (code) => {
      if (!terminated) reject(new Error(`an engine worker stopped unexpectedly (exit code ${code})`));
    });
  });
  failed.catch(() => undefined); // observed by the pool when a task is running
  return {
    remote,
    failed,
    terminate() {
      if (terminated) return;
      terminated = true;
      remote[releaseProxy]();
      void worker.terminate();
    },
  };
}

/** Default worker count: the cores Node reports. */
export function defaultWorkerCount(): number {
  return Math.max(1, availableParallelism());
}

/** A pool of `size` engine worker threads. */
export function nodeEnginePool(size = defaultWorkerCount()): WorkerPool<Engine> {
  return new WorkerPool<Engine>(spawnNodeEngine, size);
}
