/**
 * Map axis ranges checked like every other entry, and a default range for an axis when it
 * is chosen. A plan is refused exactly as the command line's `map` refuses it (every grid
 * point through the core's validateModel, in the CLI's order, so the first message is the
 * CLI's): a temperature or density axis below zero, a mu axis reaching the detuning, a
 * strength axis the interaction does not take. The message is shown beside the axis whose
 * values break the rule.
 */
import { InputError } from '../../core/input-error.ts';
import { validateModel, type ModelParams } from '../../core/model.ts';
import { gridPoint } from '../../core/scan/grid.ts';
import { type Axis, type AxisName, formatRange } from '../../core/scan/axes.ts';
import { parseEntryNumber } from '../../core/scan/model-entries.ts';
import type { ModelInputs } from '../state/app-state.ts';

export interface AxisProblem { axis: 'x' | 'y'; message: string }

/** The axis a refused entry belongs to (the one whose values set it; else the one that moves the other side of mu < delta). */
function blame(field: string | undefined, x: Axis, y: Axis): 'x' | 'y' {
  const sets: Record<string, AxisName[]> = {
    mu: ['mu', 'detuning'], detuning: ['detuning', 'mu'], density: ['density'], temperature: ['temperature'], rb: ['rb', 'v1'], v1: ['v1', 'rb'],
  };
  for (const name of sets[field ?? ''] ?? []) {
    if (x.name === name) return 'x';
    if (y.name === name) return 'y';
  }
  return 'y';
}

function problemAt(base: ModelParams, x: Axis, y: Axis, ix: number, iy: number): InputError | null {
  try {
    validateModel(gridPoint({ base, x, y, seed: 0 }, ix, iy));
    return null;
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
}

/**
 * The first grid point the engine would refuse, as the CLI reports it, or null. Every rule
 * is affine in one axis value (T >= 0, rho >= 0, mu < delta, Rb > 0), so when the four
 * corners pass every point does; only a refused plan is walked point by point.
 */
export function planProblem(base: ModelParams, x: Axis, y: Axis): AxisProblem | null {
  const corners: [number, number][] = [[0, 0], [x.count - 1, 0], [0, y.count - 1], [x.count - 1, y.count - 1]];
  if (corners.every(([ix, iy]) => problemAt(base, x, y, ix, iy) === null)) return null;
  for (let iy = 0; iy < y.count; iy++) {
    for (let ix = 0; ix < x.count; ix++) {
      const e = problemAt(base, x, y, ix, iy);
      if (e) return { axis: blame(e.field, x, y), message: e.message };
    }
  }
  return null;
}

const r4 = (v: number) => Number(v.toPrecision(4));

/**
 * A range that makes sense for an axis just chosen: inside the model's domain for the
 * other entries (mu below the detuning, the detuning above mu, T and rho from 0), with the
 * count the axis had, written `start..stop xN`. `other` is the other axis (its values bound mu or delta too).
 */
export function defaultRange(name: AxisName, m: ModelInputs, count: number, other: Axis | null): string {
  const delta = other?.name === 'detuning' ? Math.min(other.start, other.stop) : parseEntryNumber(m.detuning);
  const mu = other?.name === 'mu' ? Math.max(other.start, other.stop) : m.pump === 'mu' ? parseEntryNumber(m.mu) : NaN;
  let lo: number, hi: number;
  switch (name) {
    case 'mu': {
      hi = Number.isFinite(delta) ? Math.min(2.9, delta - 0.1) : 2.9;
      lo = Math.min(-1, hi - 1);
      break;
    }
    case 'detuning': {
      lo = Number.isFinite(mu) ? Math.max(0, mu + 0.1) : 0;
      hi = lo + 5;
      break;
    }
    case 'density': lo = 0; hi = 1; break;
    case 'temperature': lo = 0; hi = 0.5; break;
    case 'rb': lo = 0.8; hi = 2.4; break;
    case 'v1': lo = 0; hi = 4; break;
  }
  return formatRange({ start: r4(lo), stop: r4(hi), count }, true);
}
