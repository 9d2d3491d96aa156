/**
 * What every scan command of the CLI shares: its flags (--workers, --cold,
 * --point-budget), the check of every point of a plan before any work starts (a bad
 * point anywhere is refused first), and the worker count and point budget from the flags.
 * The scans themselves stream through the driver (workers/scan-driver.ts, the same path
 * the page takes): map-stream.ts, staircase-stream.ts, softlines-stream.ts, qmc-scan-stream.ts.
 */
import { lattice } from '../core/lattice/geometry.ts';
import { resolvePotential } from '../core/interaction/potential.ts';
import { validateModel } from '../core/model.ts';
import { InputError } from '../core/input-error.ts';
import { gridPoint, gridShape, type ScanPlan } from '../core/scan/grid.ts';
import { int, num, type FlagSpec, type ParsedArgs } from './flags.ts';
import type { CliIo } from './io.ts';

export const SCAN_FLAGS: readonly FlagSpec[] = [
  { name: 'workers', kind: 'int', value: 'n', def: 'all cores', help: 'worker threads' },
  { name: 'cold', kind: 'bool', help: 'start every point from scratch (no continuation along x; for checks)' },
  { name: 'point-budget', kind: 'number', value: 'seconds', def: '120', help: 'watchdog: a point (or a run of them) past this many seconds each is stopped and reported in its row' },
];

/** Refuse the first point of the plan that the engine would refuse. */
export function validatePlan(plan: ScanPlan): void {
  const { nx, ny } = gridShape(plan);
  const l = lattice(plan.base.lattice);
  for (let iy = 0; iy < ny; iy++) {
    for (let ix = 0; ix < nx; ix++) {
      const p = gridPoint(plan, ix, iy);
      validateModel(p);
      resolvePotential(p.interaction, l);
    }
  }
}

/** --workers, checked (default: the machine's cores), capped at the number of tasks. */
export function workerCount(a: ParsedArgs, io: CliIo, tasks: number): number {
  const w = int(a, 'workers');
  if (w !== undefined && !(w >= 1 && w <= 256)) throw new InputError(`--workers must be 1..256, got ${w}`, 'workers');
  return Math.max(1, Math.min(w ?? io.defaultWorkers, tasks));
}

/** --point-budget in ms (undefined: the driver's default). */
export function pointBudgetMs(a: ParsedArgs): number | undefined {
  const s = num(a, 'point-budget');
  if (s === undefined) return undefined;
  if (!(s > 0 && s <= 1e6)) throw new InputError(`--point-budget must be in (0, 1e6] seconds, got ${s}`, 'point-budget');
  return s * 1000;
}
