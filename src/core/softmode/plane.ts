/**
 * The parameter plane of a soft-line map and the interaction ranges compared on it.
 *
 * Axes set one parameter each: mu, detuning (delta), temperature (T), rb (the blockade
 * radius, V(Rb) = 2) or v1 (the strength at r = 1), evenly from start to stop; `count` is
 * the number of seed-grid nodes along the axis (zero-line-trace.ts).
 *
 * Range tokens name the interaction of one line: `nn`, `vdw[:rmax]`, `dipolar[:rmax]`,
 * `softcore[:rmax]`, rmax a number or `inf` (default). They share the strength of the base
 * interaction: vdw and dipolar take its Rb (or V1); nn takes V1, or, given only Rb, the
 * van der Waals value at r = 1, V1 = 2 Rb^6 (so `nn` and `vdw:1` are the same
 * interaction); softcore takes V0 and Rc.
 */
import { InputError } from '../input-error.ts';
import type { InteractionSpec } from '../interaction/potential.ts';
import type { PointModel } from './own-solution.ts';

export type PlaneAxisName = 'mu' | 'detuning' | 'temperature' | 'rb' | 'v1';
export const PLANE_AXES: readonly PlaneAxisName[] = ['mu', 'detuning', 'temperature', 'rb', 'v1'];

export interface PlaneAxis {
  name: PlaneAxisName;
  start: number;
  stop: number;
  count: number;
}

/** The interaction of a range token, with the strength of `base`. */
export function rangeInteraction(token: string, base: InteractionSpec): InteractionSpec {
  const [shape, r, extra] = token.trim().toLowerCase().split(':');
  if (extra !== undefined) throw new InputError(`range '${token}' must be shape or shape:rmax`, 'ranges');
  let rmax: number | undefined;
  if (r !== undefined && r !== 'inf') {
    rmax = Number(r);
    if (!(rmax > 0) || !Number.isFinite(rmax)) throw new InputError(`range '${token}': rmax must be a number > 0 or inf`, 'ranges');
  }
  const withRange = (s: InteractionSpec): InteractionSpec => (rmax === undefined ? s : { ...s, rmax });
  switch (shape) {
    case 'nn': {
      if (r !== undefined) throw new InputError(`range '${token}': nn has no rmax (it is nearest neighbours only)`, 'ranges');
      const V1 = base.V1 ?? (base.Rb !== undefined ? 2 * Math.pow(base.Rb, 6) : undefined);
      if (V1 === undefined) throw new InputError('the nn range needs --v1 or --rb', 'ranges');
      return { shape: 'nn', V1, V2: base.shape === 'nn' ? base.V2 : undefined };
    }
    case 'vdw':
    case 'dipolar':
      if (base.Rb === undefined && base.V1 === undefined) throw new InputError(`the ${shape} range needs --rb or --v1`, 'ranges');
      return withRange(base.Rb !== undefined ? { shape, Rb: base.Rb } : { shape, V1: base.V1 });
    case 'softcore':
      if (base.V0 === undefined || base.Rc === undefined) throw new InputError('the softcore range needs --v0 and --rc', 'ranges');
      return withRange({ shape: 'softcore', V0: base.V0, Rc: base.Rc });
    default:
      throw new InputError(`unknown range '${token}' (use nn, vdw[:rmax], dipolar[:rmax], softcore[:rmax])`, 'ranges');
  }
}

/** The point of the plane at axis values (xv, yv); strength axes replace Rb/V1 of the base before the range is applied. */
export function planePoint(base: PointModel, range: string, x: PlaneAxis, xv: number, y: PlaneAxis, yv: number): PointModel {
  const p: PointModel = { ...base, interaction: { ...base.interaction } };
  for (const [ax, v] of [[x, xv], [y, yv]] as const) {
    switch (ax.name) {
      case 'mu': p.mu = v; break;
      case 'detuning': p.delta = v; break;
      case 'temperature': p.T = v; break;
      case 'rb': p.interaction.Rb = v; delete p.interaction.V1; break;
      case 'v1': p.interaction.V1 = v; delete p.interaction.Rb; break;
    }
  }
  p.interaction = rangeInteraction(range, p.interaction);
  return p;
}

/** Refuse axes that leave the model's domain everywhere they could (T < 0, Rb <= 0, equal names). */
export function checkPlane(x: PlaneAxis, y: PlaneAxis): void {
  if (x.name === y.name) throw new InputError(`the two axes must differ, both are ${x.name}`, 'y');
  for (const [flag, a] of [['x', x], ['y', y]] as const) {
    if (!PLANE_AXES.includes(a.name)) throw new InputError(`--${flag}: soft lines take the axes ${PLANE_AXES.join(', ')}, not ${a.name}`, flag);
    if (!(a.count >= 2)) throw new InputError(`--${flag}: need at least 2 seed points along ${a.name}`, flag);
    if (!(a.stop !== a.start)) throw new InputError(`--${flag}: ${a.name} range is empty`, flag);
    const lo = Math.min(a.start, a.stop);
    if (a.name === 'temperature' && lo < 0) throw new InputError(`--${flag}: temperature must be >= 0`, flag);
    if (a.name === 'rb' && !(lo > 0)) throw new InputError(`--${flag}: rb must be > 0`, flag);
  }
}
