/**
 * Browser entry of the engine worker (a module Web Worker, see browser-spawn.ts): exposes
 * the engine object over the worker's own message port. The Node entry
 * (engine-worker-node.ts) exposes the same object over worker_threads.
 */
import { expose } from 'comlink';
import { engine } from './engine.ts';

expose(engine);
