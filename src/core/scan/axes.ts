/**
 * Scan axes: a parameter name and an evenly spaced list of values,
 *
 *   value_i = start + (stop - start) i / (N - 1),   i = 0 .. N-1   (N = 1: start = stop)
 *
 * written `start..stop xN` ("from start to stop, N points", both ends included; spaces
 * optional, so `-1..3.9x200` needs no quotes on a command line) for a range of one named
 * parameter (the staircase's mu), and `name=start..stop xN` for a map axis. The older
 * `start:stop:count` is still read, with a note (rangeNote): readers used to matrix
 * languages take its middle number for a step. This is the one parser of ranges for the
 * page and the CLI. Applying an axis value to the model sets one field of ModelParams: rb
 * and v1 the interaction strength (V(Rb) = 2, or V1 at r = 1), mu the chemical potential
 * (fixed-mu mode), density the excitation density rho (fixed-rho mode), detuning delta,
 * temperature T.
 */
import { InputError } from '../input-error.ts';
import type { ModelParams } from '../model.ts';

export type AxisName = 'rb' | 'v1' | 'mu' | 'density' | 'detuning' | 'temperature';
export const AXIS_NAMES: readonly AxisName[] = ['rb', 'v1', 'mu', 'density', 'detuning', 'temperature'];

/** Largest number of values one axis may hold (a 10^4 x 10^4 map is already 10^8 points). */
export const MAX_AXIS_COUNT = 10_000;

/** How a range is written, for messages and the page (the space before x is optional). */
export const RANGE_FORM = 'start..stop xN';
/** How a map axis is written. */
export const AXIS_FORM = `name=${RANGE_FORM}`;
/** The command line's placeholders: one argument, no space, no quotes needed (`mu=-1..3.9x200`). */
export const CLI_RANGE_FORM = 'START..STOPxN';
export const CLI_AXIS_FORM = `name=${CLI_RANGE_FORM}`;
/** A range written out in full, for messages. */
const EXAMPLE = '-1..3.9x200';

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

/** A decimal number as typed (no hex, no "Infinity"); U+2212 minus is read as "-". */
const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;

/**
 * The range in the current form: `start..stopxN` (one command-line argument; messages use
 * it, so a suggestion pastes into the CLI and the page alike) or, spaced, `start..stop xN`
 * (the page's fields).
 */
export function formatRange(r: Range, spaced = false): string {
  return `${r.start}..${r.stop}${spaced ? ' ' : ''}x${r.count}`;
}

/** The three parts of an old-form `start:stop:count`, or null when `text` is not one. */
function oldParts(text: string): [string, string, string] | null {
  const parts = text.split(':');
  return parts.length === 3 ? [parts[0].trim(), parts[1].trim(), parts[2].trim()] : null;
}

/**
 * "If `step` was meant as a step from a to c, write a..c xN" when (c - a)/step is a whole
 * number of steps (to 1e-9 relative: typed decimals such as 0.1 are not exact in binary),
 * else "".
 */
function stepHint(a: number, step: number, c: number): string {
  const n = (c - a) / step;
  const whole = Math.round(n);
  if (!(step !== 0 && Math.abs(step) < Math.abs(c - a) && whole >= 1 && Math.abs(n - whole) < 1e-9 * whole && whole < MAX_AXIS_COUNT)) return '';
  return ` If ${step} was meant as a step from ${a} to ${c}, write ${formatRange({ start: a, stop: c, count: whole + 1 })}.`;
}

/**
 * Parse a range, `start..stop xN` (or the older `start:stop:count`); field names the flag
 * or entry in messages. N is a whole number from 1 to MAX_AXIS_COUNT, and N = 1 needs
 * start = stop. A count/step mix-up (`0:0.1:1`) is refused with the form that was meant.
 */
export function parseRange(text: string, field: string): Range {
  const t = text.replace(/\u2212/g, '-').replace(/\u00d7/g, 'x').trim();
  const old = oldParts(t);
  let a: string, b: string, c: string;
  if (old) {
    [a, b, c] = old;
  } else {
    const dots = t.indexOf('..');
    if (dots < 0) throw new InputError(`${field} must be ${RANGE_FORM} (N points from start to stop, both ends included, e.g. ${EXAMPLE}), got '${text}'`, field);
    a = t.slice(0, dots).trim();
    const rest = t.slice(dots + 2);
    const x = rest.search(/x/i);
    if (x < 0) throw new InputError(`${field} needs its number of points: ${RANGE_FORM}, e.g. ${EXAMPLE}, got '${text}'`, field);
    b = rest.slice(0, x).trim();
    c = rest.slice(x + 1).trim();
  }
  const start = strictNumber(a, `${field} start`, field);
  const stop = strictNumber(b, `${field} stop`, field);
  if (!/^[+]?\d+$/.test(c)) {
    const asNumber = NUMBER.test(c) ? Number(c) : NaN;
    // start:stop:step (the step last) or start:step:stop (the step in the middle)
    const hint = old && Number.isFinite(asNumber) ? stepHint(start, asNumber, stop) || stepHint(start, stop, asNumber) : '';
    const what = old ? 'count must be a whole number of points (the last number of start:stop:count)' : 'number of points N must be a whole number';
    throw new InputError(`${field} ${what}, got '${c}'.${hint}`, field);
  }
  const count = Number(c);
  if (count === 0) throw new InputError(`${field} is an empty range (count 0)`, field);
  if (count > MAX_AXIS_COUNT) {
    throw new InputError(`${field} count ${count} is above the limit ${MAX_AXIS_COUNT}`, field);
  }
  if (count === 1 && start !== stop) {
    const how = old
      ? `'${text.trim()}' reads as start ${start}, stop ${stop} and 1 point (the middle number of start:stop:count is the stop, not a step)`
      : `'${text.trim()}' asks for 1 point between two different ends`;
    throw new InputError(`${field}: ${how}; one point needs start = stop (${formatRange({ start, stop: start, count: 1 })}).${old ? stepHint(start, stop, count) : ''}`, field);
  }
  return { start, stop, count };
}

/**
 * A range (or `name=range`) as one command-line argument: `start..stopxN`, whichever form
 * it was typed in (the page's spaced form would need quotes); text that does not parse is
 * returned as it is (the command line then gives its error).
 */
export function cliRange(text: string): string {
  const eq = text.indexOf('=');
  try {
    return (eq >= 0 ? text.slice(0, eq).trim() + '=' : '') + formatRange(parseRange(eq >= 0 ? text.slice(eq + 1) : text, 'range'));
  } catch {
    return text;
  }
}

/**
 * The note for a range (or `name=range`) written in the old `start:stop:count` form: how
 * it was read, the same range in the current form, and the step reading where the numbers
 * allow one (`spaced`: the range as the page writes it). Null for the current form and for text that does not parse (its error says more).
 */
export function rangeNote(text: string, spaced = false): string | null {
  const eq = text.indexOf('=');
  const body = (eq >= 0 ? text.slice(eq + 1) : text).trim();
  const parts = oldParts(body);
  if (!parts) return null;
  let r: Range;
  try { r = parseRange(body, 'range'); } catch { return null; }
  const name = eq >= 0 ? text.slice(0, eq).trim() + '=' : '';
  return `'${text.trim()}' is the old start:stop:count form, read as ${name}${formatRange(r, spaced)} `
    + `(${r.count} point${r.count === 1 ? '' : 's'} from ${r.start} to ${r.stop}); please write it that way.${stepHint(r.start, r.stop, r.count)}`;
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

/** Parse a map axis `name=start..stop xN` (or `name=start:stop:count`); flag names the option (x or y) in messages. */
export function parseAxis(text: string, flag: string): Axis {
  const eq = text.indexOf('=');
  if (eq < 0) {
    throw new InputError(`--${flag} must be ${AXIS_FORM} with name one of ${AXIS_NAMES.join(', ')}, got '${text}'`, flag);
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
  const x = NUMBER.test(s) ? Number(s) : NaN;
  if (!Number.isFinite(x)) throw new InputError(`${what} must be a finite number, got '${s}'`, field);
  return x;
}
