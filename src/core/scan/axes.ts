/**
 * Scan axes: a parameter name and an evenly spaced list of values,
 *
 *   value_i = start + (stop - start) i / (count - 1),   i = 0 .. count-1   (count = 1: start)
 *
 * written `name=start:stop:count` (a map axis) or `start:stop:count` (a range of one
 * named parameter, as the staircase's mu). Applying an axis value to the model sets one
 * field of ModelParams: rb and v1 the interaction strength (V(Rb) = 2, or V1 at r = 1),
 * mu the chemical potential (fixed-mu mode), density the excitation density rho
 * (fixed-rho mode), detuning delta, temperature T.
 */
import { InputError } from '../input-error.ts';
import type { ModelParams } from '../model.ts';

export type AxisName = 'rb' | 'v1' | 'mu' | 'density' | 'detuning' | 'temperature';
export const AXIS_NAMES: readonly AxisName[] = ['rb', 'v1', 'mu', 'density', 'detuning', 'temperature'];

/** Largest number of values one axis may hold (a 10^4 x 10^4 map is already 10^8 points). */
export const MAX_AXIS_COUNT = 10_000;

export interface Range {
  start: number;
  stop: number;
  count: number;
}

export interface Axis extends Range {
  name: AxisName;
  /** The count values, start and stop included. */
  values: number[];
}

/** Parse `start:stop:count` (field names the flag in messages); count is an integer >= 1. */
export function parseRange(text: string, field: string): Range {
  const parts = text.split(':');
  if (parts.length !== 3) {
    throw new InputError(`${field} must be start:stop:count, got '${text}'`, field);
  }
  const [a, b, c] = parts.map((s) => s.trim());
  const start = strictNumber(a, `${field} start`, field);
  const stop = strictNumber(b, `${field} stop`, field);
  if (!/^[+]?\d+$/.test(c)) {
    throw new InputError(`${field} count must be a whole number, got '${c}'`, field);
  }
  const count = Number(c);
  if (count === 0) throw new InputError(`${field} is an empty range (count 0)`, field);
  if (count > MAX_AXIS_COUNT) {
    throw new InputError(`${field} count ${count} is above the limit ${MAX_AXIS_COUNT}`, field);
  }
  return { start, stop, count };
}

/** The count evenly spaced values of a range, start and stop exactly included. */
export function rangeValues(r: Range): number[] {
  if (r.count === 1) return [r.start];
  const out = new Array<number>(r.count);
  for (let i = 0; i < r.count; i++) {
    out[i] = i === r.count - 1 ? r.stop : r.start + ((r.stop - r.start) * i) / (r.count - 1);
  }
  return out;
}

/** Parse a map axis `name=start:stop:count`; flag names the option (x or y) in messages. */
export function parseAxis(text: string, flag: string): Axis {
  const eq = text.indexOf('=');
  if (eq < 0) {
    throw new InputError(`--${flag} must be name=start:stop:count with name one of ${AXIS_NAMES.join(', ')}, got '${text}'`, flag);
  }
  const name = text.slice(0, eq).trim().toLowerCase();
  if (!(AXIS_NAMES as readonly string[]).includes(name)) {
    throw new InputError(`--${flag}: unknown axis '${name}' (use ${AXIS_NAMES.join(', ')})`, flag);
  }
  const r = parseRange(text.slice(eq + 1), `--${flag} ${name}`);
  return { name: name as AxisName, ...r, values: rangeValues(r) };
}

/**
 * A copy of p with one axis value applied. rb and v1 exclude each other (the other one is
 * dropped); mu and density exclude each other likewise.
 */
export function applyAxis(p: ModelParams, name: AxisName, value: number): ModelParams {
  const q: ModelParams = { ...p, interaction: { ...p.interaction } };
  switch (name) {
    case 'rb':
      if (q.interaction.shape !== 'vdw' && q.interaction.shape !== 'dipolar') {
        throw new InputError(`the rb axis needs the vdw or dipolar interaction, not ${q.interaction.shape}`, 'rb');
      }
      q.interaction.Rb = value;
      delete q.interaction.V1;
      break;
    case 'v1':
      if (q.interaction.shape === 'softcore') {
        throw new InputError('the v1 axis does not apply to the softcore interaction (use v0 and rc)', 'v1');
      }
      q.interaction.V1 = value;
      delete q.interaction.Rb;
      break;
    case 'mu':
      q.mu = value;
      delete q.rho;
      break;
    case 'density':
      q.rho = value;
      delete q.mu;
      break;
    case 'detuning':
      q.delta = value;
      break;
    case 'temperature':
      q.T = value;
      break;
  }
  return q;
}

function strictNumber(s: string, what: string, field: string): number {
  const x = s === '' ? NaN : Number(s);
  if (!Number.isFinite(x)) throw new InputError(`${what} must be a finite number, got '${s}'`, field);
  return x;
}
