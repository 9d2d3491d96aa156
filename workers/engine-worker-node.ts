/**
 * Node entry of the engine worker (a worker thread, see node-spawn.ts): exposes the same
 * engine object as the browser entry, over the parent port through Comlink's node adapter.
 */
import { parentPort } from 'node:worker_threads';
import { expose } from 'comlink';
import nodeEndpoint from 'comlink/dist/esm/node-adapter.mjs';
import { engine } from './engine.ts';

if (!parentPort) throw new Error('engine-worker-node.ts must run as a worker thread');
expose(engine, nodeEndpoint(parentPort));
