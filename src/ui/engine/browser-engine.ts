/**
 * The page's engine client on Web Workers: a scan pool of `scanWorkers` workers and one
 * interactive worker (see engine-client.ts).
 */
import { browserEnginePool } from '../../../workers/browser-spawn.ts';
import { EngineClient } from './engine-client.ts';

/** An EngineClient whose workers are module Web Workers. */
export function browserEngineClient(scanWorkers = Math.max(1, navigator.hardwareConcurrency || 2)): EngineClient {
  return new EngineClient(browserEnginePool(scanWorkers), browserEnginePool(1));
}
