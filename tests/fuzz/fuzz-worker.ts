/**
 * The worker thread of the fuzz driver: draws case i of a seeded stream, runs it against the
 * core (fuzz-case.ts) and posts the outcome with its time. In a thread of its own so that a
 * case that never returns can be stopped (the core's calls are synchronous).
 */
import { parentPort } from 'node:worker_threads';
import { drawCase } from './fuzz-inputs.ts';
import { runCase } from './fuzz-case.ts';

export interface FuzzRequest { seed: number; i: number; quick: boolean }

const port = parentPort!;
port.on('message', (q: FuzzRequest) => {
  const t0 = performance.now();
  const outcome = runCase(drawCase(q.seed, q.i, q.quick));
  port.postMessage({ i: q.i, outcome, ms: performance.now() - t0 });
});
port.postMessage({ ready: true });
