/**
 * The lab's operating point as the views see it: the state's `lab` section (strings, so
 * the URL and a saved session carry it) read back into numbers, its value and tolerance on
 * any map axis, and the state change the planner's "use these numbers" makes: the model
 * set to the point, the point stored, and the atlas and staircase axes re-centred on it
 * where it lies outside them.
 */
import type { OperatingPoint } from '../../core/lab/operating-point.ts';
import type { ModelParams } from '../../core/model.ts';
import { type AxisName, formatRange, parseAxis, parseRange } from '../../core/scan/axes.ts';
import { type AppState, type ModelKey, cloneState, emptyLab } from './app-state.ts';

/** A value and its one-sigma half-width on one axis (sigma 0: known exactly). */
export interface AxisValue { value: number; sigma: number }

/** The operating point in model units (energies in g, lengths in a). */
export interface LabPoint {
  rb: AxisValue; v1: AxisValue; detuning: AxisValue; mu: AxisValue; temperature: AxisValue;
  /** The energy unit g / 2 pi in MHz the point was converted with. */
  gMHz: number;
  /** The first-order box is a fair picture (operating-point.ts, LINEAR_LIMIT). */
  linear: boolean;
}

const short = (v: number) => String(Number(v.toPrecision(6)));

/** The lab section of an operating point (what "use these numbers" stores). */
export function labSection(p: OperatingPoint): AppState['lab'] {
  return {
    rb: String(p.rbOverA.value), drb: String(p.rbOverA.sigma), v1: String(p.V1.value), dv1: String(p.V1.sigma),
    detuning: String(p.delta.value), ddetuning: String(p.delta.sigma), mu: String(p.mu.value), dmu: String(p.mu.sigma),
    temperature: String(p.T), g: String(p.model.gMHz), linear: p.linear ? '1' : '',
  };
}

/** The stored point, or null when there is none or an entry is not a number (a hand-edited link). */
export function readLabPoint(s: AppState['lab']): LabPoint | null {
  if (!s || s.rb.trim() === '') return null;
  const num = (t: string) => (t.trim() === '' ? NaN : Number(t));
  const pair = (v: string, d: string): AxisValue | null => {
    const value = num(v), sigma = d.trim() === '' ? 0 : num(d);
    return Number.isFinite(value) && Number.isFinite(sigma) && sigma >= 0 ? { value, sigma } : null;
  };
  const rb = pair(s.rb, s.drb), v1 = pair(s.v1, s.dv1), detuning = pair(s.detuning, s.ddetuning), mu = pair(s.mu, s.dmu);
  const temperature = pair(s.temperature, '');
  const gMHz = num(s.g);
  if (!rb || !v1 || !detuning || !mu || !temperature || !(rb.value > 0) || !(gMHz > 0)) return null;
  return { rb, v1, detuning, mu, temperature, gMHz, linear: s.linear === '1' };
}

/** The point's value on a map axis, or null for a quantity it does not fix (the density). */
export function labOnAxis(p: LabPoint, name: AxisName): AxisValue | null {
  return name === 'density' ? null : p[name];
}

/** One line naming the point with its tolerances, for legends and notes. */
export function labPointText(p: LabPoint): string {
  const pm = (a: AxisValue) => (a.sigma > 0 ? `${short(a.value)} \u00b1 ${Number(a.sigma.toPrecision(3))}` : short(a.value));
  return `Rb/a = ${pm(p.rb)}, \u03b4 = ${pm(p.detuning)} g, \u03bc = ${pm(p.mu)} g, T = ${short(p.temperature.value)} g`;
}

/**
 * Whether a model point lies inside the point's tolerance box: Rb/a (or V1), delta, mu
 * within one sigma (plus a relative 1e-9 for the decimal round trip of the stored numbers),
 * T equal to the same rounding. Each quantity the model does not set (a fixed density
 * instead of mu) counts as outside.
 */
export function insideBox(p: LabPoint, m: { rb?: number; v1?: number; delta: number; mu?: number; T: number }): boolean {
  const near = (x: number | undefined, a: AxisValue) => x !== undefined && Math.abs(x - a.value) <= a.sigma + 1e-9 * Math.max(1, Math.abs(a.value));
  const strength = m.rb !== undefined ? near(m.rb, p.rb) : near(m.v1, p.v1);
  return strength && near(m.delta, p.detuning) && near(m.mu, p.mu) && near(m.T, p.temperature);
}

/** Whether the model's parameters are the lab point's within its box (a van der Waals model, as the planner sets it). */
export function modelAtLabPoint(p: LabPoint, m: ModelParams | null): boolean {
  if (!m || m.interaction.shape !== 'vdw' || m.interaction.rmax !== undefined) return false;
  return insideBox(p, { rb: m.interaction.Rb, v1: m.interaction.Rb === undefined ? m.interaction.V1 : undefined, delta: m.delta, mu: m.mu, T: m.T });
}

/** Domain of an axis quantity for the re-centred range: a lower bound (exclusive or not) and an upper one. */
interface Domain { lo?: number; loOpen?: boolean; hi?: number }

/**
 * A range `start..stop xN` re-centred on `a` where it must move: an end outside the
 * quantity's domain is first pulled inside (2% of the span from an open bound); if the box
 * a.value +- a.sigma then lies inside, that is the range; else the range gets the same
 * span centred on the value (widened to 1.25 times the box where the box is wider than the
 * span), shifted to stay inside the domain. The count and the direction are kept; null
 * when nothing moves.
 */
export function recentredRange(range: { start: number; stop: number; count: number }, a: AxisValue, d: Domain = {}): string | null {
  const lo0 = Math.min(range.start, range.stop), hi0 = Math.max(range.start, range.stop);
  const out = (lo: number, hi: number) => {
    const [s, e] = range.start <= range.stop ? [lo, hi] : [hi, lo];
    return formatRange({ start: Number(short(s)), stop: Number(short(e)), count: range.count }, true);
  };
  const below = (x: number) => d.lo !== undefined && (d.loOpen ? x <= d.lo : x < d.lo);
  const above = (x: number) => d.hi !== undefined && x >= d.hi;
  let lo = lo0, hi = hi0;
  if (above(hi)) hi = d.hi! - 0.02 * (hi0 - lo0);
  if (below(lo)) lo = d.lo! + (d.loOpen ? 0.02 * (hi0 - lo0) : 0);
  const holds = a.value - a.sigma >= lo && a.value + a.sigma <= hi;
  if (lo < hi && holds) return lo === lo0 && hi === hi0 ? null : out(lo, hi);
  const half = Math.max((hi0 - lo0) / 2, 1.25 * a.sigma, 1e-6 * Math.max(1, Math.abs(a.value)));
  lo = a.value - half; hi = a.value + half;
  const gap = 0.02 * (hi - lo);
  if (above(hi)) { hi = d.hi! - gap; lo = hi - 2 * half; }
  if (below(lo)) { lo = d.lo! + (d.loOpen ? gap : 0); hi = Math.max(hi, lo + 2 * half); }
  return out(lo, hi);
}

/** The domain of each axis quantity given the point (mu below the detuning and the other way round). */
function domainOf(name: AxisName, mu: number, delta: number): Domain {
  switch (name) {
    case 'rb': case 'v1': return { lo: 0, loOpen: true };
    case 'temperature': case 'density': return { lo: 0 };
    case 'mu': return { hi: delta };
    case 'detuning': return { lo: mu, loOpen: true };
  }
}

/** A map axis text `name=range` re-centred on the point (unchanged when it holds the box or the point does not fix its quantity). */
function recentreAxisText(text: string, p: LabPoint, bounds: { mu: number; delta: number }): string {
  let axis;
  try { axis = parseAxis(text, 'x'); } catch { return text; }
  const a = labOnAxis(p, axis.name);
  if (!a) return text;
  const r = recentredRange(axis, a, domainOf(axis.name, bounds.mu, bounds.delta));
  return r === null ? text : `${axis.name}=${r}`;
}

/**
 * "Use these numbers": the model set to the point (`model` holds the form entries the
 * planner writes), the point stored, and the atlas axes and the staircase's mu range
 * re-centred on it where it lies outside them. When one atlas axis is the detuning and
 * the other mu, the detuning axis moves first and mu is then kept below its smallest value.
 */
export function useLabPoint(state: AppState, model: Partial<Record<ModelKey, string>>, p: OperatingPoint): AppState {
  const next = cloneState(state);
  Object.assign(next.model, model);
  next.lab = labSection(p);
  const lab = readLabPoint(next.lab);
  if (!lab) return next;
  // the model's own mu and delta bound the other axis (mu < delta at every grid point)
  const bounds = { mu: lab.mu.value, delta: lab.detuning.value };
  const nameOf = (t: string) => t.slice(0, Math.max(0, t.indexOf('='))).trim();
  const order: ('x' | 'y')[] = nameOf(next.atlas.y) === 'detuning' ? ['y', 'x'] : ['x', 'y'];
  for (const which of order) {
    next.atlas[which] = recentreAxisText(next.atlas[which], lab, bounds);
    if (nameOf(next.atlas[which]) !== 'detuning') continue;
    try { const d = parseAxis(next.atlas[which], which); bounds.delta = Math.min(d.start, d.stop); } catch { /* its error shows */ }
  }
  try {
    const r = parseRange(next.staircase.mu, 'mu');
    const c = recentredRange(r, lab.mu, { hi: lab.detuning.value });
    if (c !== null) next.staircase.mu = c;
  } catch { /* the staircase shows its own error */ }
  return next;
}

/** The state without an operating point. */
export function clearLabPoint(state: AppState): AppState {
  const next = cloneState(state);
  next.lab = emptyLab();
  return next;
}
