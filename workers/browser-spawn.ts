/**
 * Start engine workers as module Web Workers (bundled by Vite from the `new URL(...,
 * import.meta.url)` form). The UI owns how many and when; see DEVELOPERS.md.
 */
import { wrap, releaseProxy } from 'comlink';
import type { Engine } from './engine.ts';
import { WorkerPool, type EngineHandle } from './pool.ts';

/** One engine Web Worker as a pool handle. */
export function spawnBrowserEngine(): EngineHandle<Engine> {
  const worker = new Worker(new URL('./engine-worker.ts', import.meta.url), { type: 'module' });
  const remote = wrap<Engine>(worker);
  const failed = new Promise<never>((_, reject) => {
    worker.addEventListener('error', (e) => reject(new Error(`an engine worker failed: ${e.message}`)));
  });
  failed.catch(() => undefined);
  return {
    remote,
    failed,
    terminate() {
      remote[releaseProxy]();
      worker.terminate();
    },
  };
}

/** A pool of browser engine workers (default: navigator.hardwareConcurrency). */
export function browserEnginePool(size = Math.max(1, navigator.hardwareConcurrency || 2)): WorkerPool<Engine> {
  return new WorkerPool<Engine>(spawnBrowserEngine, size);
}
