/**
 * Emitter-emitter interaction shapes V(r), r in units of the lattice spacing, energies in g.
 *
 *   nn:       V1 at r = 1, V2 at the next-nearest distance, zero beyond
 *   vdw:      V(r) = V1 / r^6,  V(Rb) = 2 (the vacuum Rabi splitting)  =>  V1 = 2 Rb^6
 *   dipolar:  V(r) = V1 / r^3,  V(Rb) = 2                              =>  V1 = 2 Rb^3
 *   softcore: V(r) = V0 / (1 + (r/Rc)^6)
 *
 * An optional range rmax drops every pair with r > rmax.
 */
import { InputError, requireFinite } from '../input-error.ts';
import type { Lattice } from '../lattice/geometry.ts';

export type InteractionShape = 'nn' | 'vdw' | 'dipolar' | 'softcore';
export const INTERACTION_SHAPES: readonly InteractionShape[] = ['nn', 'vdw', 'dipolar', 'softcore'];

/** The user's description of the interaction (plain data). */
export interface InteractionSpec {
  shape: InteractionShape;
  /** Strength at r = 1 (nn, vdw, dipolar); for vdw/dipolar give either V1 or Rb. */
  V1?: number;
  /** Next-nearest strength of the nn shape (default 0). */
  V2?: number;
  /** Blockade radius with V(Rb) = 2 (vdw, dipolar). */
  Rb?: number;
  /** Plateau height and core radius of the softcore shape. */
  V0?: number;
  Rc?: number;
  /** Pairs with r > rmax are dropped; undefined or Infinity: full converged lattice sum. */
  rmax?: number;
}

/** A resolved interaction: V(r) and what the lattice sums need to know of it. */
export interface Potential {
  readonly shape: InteractionShape;
  /** V(r) without the range cut. */
  readonly V: (r: number) => number;
  /** Range cut (Infinity for none). */
  readonly rmax: number;
  /** V = C / r^s for the power laws. */
  readonly powerLaw?: { C: number; s: number };
  /** Parameters of the softcore shape. */
  readonly softcore?: { V0: number; Rc: number };
  /** Finite-range shells (nn shape): distances and values. */
  readonly shells?: { r: number; V: number }[];
}

const NO_RANGE = Infinity;

/**
 * Largest range rmax of a direct lattice sum: 1e5 in 1D, 200 in 2D (about 1.3e5 sites on the
 * square lattice; a sum is redone at every k of a spectrum and for every cell of a search,
 * so this bounds one mean-field point to about a second). Beyond it the truncated sum differs
 * from the full one by less than the tail, (1/rmax)^{s-d} of it for a power law: leave the
 * range unset instead.
 */
export const MAX_RANGE = { chain: 1e5, plane: 200 } as const;

/**
 * Largest |V1|, |V2|, |V0| or power-law strength C (units of g) taken: 1e30. A blockade is
 * complete once V exceeds every other energy (m ~ 1/V), so nothing physical changes beyond
 * ~1e3; the solvers multiply V up to three times (Hessians, stability matrices) and resolve
 * a blockaded m ~ 1/V only while V m stays exact, which failed for V ~ 1e45 - 1e90 at T = 0
 * (and V1 = 1e308 overflowed and hung a shift loop). For vdw this is rb < 8.9e4, for dipolar
 * rb < 7.9e9.
 */
export const MAX_STRENGTH = 1e30;

/** Refuse a strength beyond MAX_STRENGTH, naming the flag. */
function strength(x: number, field: string, what = field): number {
  if (Number.isNaN(x)) requireFinite(x, field);
  if (!(Math.abs(x) <= MAX_STRENGTH)) {
    throw new InputError(`${what} = ${x} is beyond the largest interaction strength taken, ${MAX_STRENGTH} g (the blockade is complete long before)`, field);
  }
  return x;
}

/**
 * Largest core radius of the full-range soft-core sum in 2D: the split V0 Rc^6 r^-6 + remainder
 * loses eps Rc^4 relative (3e-11 at 20) and sums 15 Rc out (about 3e5 sites at 20).
 */
export const MAX_SOFTCORE_RC_2D = 20;

/** Resolve a spec on a lattice into a Potential, refusing incomplete or bad input. */
export function resolvePotential(spec: InteractionSpec, l: Lattice): Potential {
  const rmax = spec.rmax === undefined ? NO_RANGE : spec.rmax;
  if (!(rmax > 0) || Number.isNaN(rmax)) throw new InputError(`range must be > 0, got ${rmax}`, 'range');
  const rangeLimit = l.dim === 1 ? MAX_RANGE.chain : MAX_RANGE.plane;
  if (Number.isFinite(rmax) && rmax > rangeLimit && spec.shape !== 'nn') {
    throw new InputError(
      `range ${rmax} is beyond the direct lattice sum's limit of ${rangeLimit} on the ${l.name} lattice; leave the range unset for the full converged sum`, 'range');
  }
  switch (spec.shape) {
    case 'nn': {
      const V1 = strength(spec.V1 ?? NaN, 'v1');
      const V2 = strength(spec.V2 ?? 0, 'v2');
      const shells = [{ r: 1, V: V1 }, { r: l.nextNearest, V: V2 }].filter((s) => s.r <= rmax + 1e-9);
      const V = (r: number) => (Math.abs(r - 1) < 1e-9 ? V1 : Math.abs(r - l.nextNearest) < 1e-9 ? V2 : 0);
      return { shape: 'nn', V, rmax: Math.min(rmax, l.nextNearest), shells };
    }
    case 'vdw':
    case 'dipolar': {
      const s = spec.shape === 'vdw' ? 6 : 3;
      let C: number;
      if (spec.V1 !== undefined && spec.Rb !== undefined) {
        throw new InputError('give either the blockade radius rb or the strength v1, not both', 'rb');
      } else if (spec.Rb !== undefined) {
        const Rb = requireFinite(spec.Rb, 'rb');
        if (!(Rb > 0)) throw new InputError(`blockade radius rb must be > 0, got ${Rb}`, 'rb');
        C = strength(2 * Math.pow(Rb, s), 'rb', `rb = ${Rb} gives V1 = 2 rb^${s}`);
      } else if (spec.V1 !== undefined) {
        C = strength(spec.V1, 'v1');
      } else {
        throw new InputError(`the ${spec.shape} shape needs rb or v1`, 'rb');
      }
      return { shape: spec.shape, V: (r) => C / Math.pow(r, s), rmax, powerLaw: { C, s } };
    }
    case 'softcore': {
      const V0 = strength(spec.V0 ?? NaN, 'v0');
      const Rc = requireFinite(spec.Rc ?? NaN, 'rc');
      if (!(Rc > 0)) throw new InputError(`core radius rc must be > 0, got ${Rc}`, 'rc');
      if (l.dim === 2 && !Number.isFinite(rmax) && Rc > MAX_SOFTCORE_RC_2D) {
        throw new InputError(
          `core radius rc = ${Rc} is above ${MAX_SOFTCORE_RC_2D}, the largest whose full soft-core lattice sum the ${l.name} lattice takes; give a range (at most ${MAX_RANGE.plane})`, 'rc');
      }
      return { shape: 'softcore', V: (r) => V0 / (1 + Math.pow(r / Rc, 6)), rmax, softcore: { V0, Rc } };
    }
    default:
      throw new InputError(`unknown interaction ${String((spec as InteractionSpec).shape)} (use ${INTERACTION_SHAPES.join(', ')})`, 'interaction');
  }
}

/** V(r) with the range cut applied. */
export function pairValue(p: Potential, r: number): number {
  return r > p.rmax + 1e-9 ? 0 : p.V(r);
}
