/**
 * Browser entry of the coordinating worker (a module Web Worker started by
 * browser-spawn.ts spawnScanCoordinator): it owns the page's pool of engine workers, started
 * from here as nested workers, and serves scans to the page with the one scan driver
 * (scan-host.ts). Its name carries the pool size: `scan-coordinator:<workers>`.
 */
import { serveScans, type HostPort } from './scan-host.ts';
import { browserEnginePool } from './browser-spawn.ts';

const scope = self as unknown as HostPort & { name: string };
const size = Number(scope.name.split(':')[1]) || 1;
serveScans(scope, browserEnginePool(size));
