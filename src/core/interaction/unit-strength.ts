/**
 * Lattice sums are linear in the strength of a shape: power laws C / r^s in C (= V1 or
 * 2 Rb^s), the softcore V0 / (1 + (r/Rc)^6) in V0. Caches of J_st(k) therefore keep the sums
 * at unit strength and scale them; this names the unit-strength potential, its cache key
 * (lattice, shape, range[, Rc]) and the scale factor. The nn shape (a direct sum of two
 * shells) is kept as it is, keyed by V1 and V2.
 */
import type { Lattice } from '../lattice/geometry.ts';
import { type InteractionSpec, type Potential, resolvePotential } from './potential.ts';

export interface UnitStrength {
  /** Cache key of the unit-strength sums (without the cell or k). */
  key: string;
  /** The potential at unit strength. */
  unit: Potential;
  /** Factor that turns the unit-strength sums into those of `pot`. */
  scale: number;
}

/** The unit-strength form of `pot` (resolved from `spec` on lattice `l`). */
export function unitStrength(l: Lattice, spec: InteractionSpec, pot: Potential): UnitStrength {
  const range = Number.isFinite(pot.rmax) ? String(pot.rmax) : 'inf';
  if (pot.powerLaw) {
    const unit = resolvePotential({ shape: pot.shape, V1: 1, rmax: spec.rmax }, l);
    return { key: `${l.name}|${pot.shape}|${range}`, unit, scale: pot.powerLaw.C };
  }
  if (pot.softcore) {
    const { V0, Rc } = pot.softcore;
    const unit = resolvePotential({ shape: 'softcore', V0: 1, Rc, rmax: spec.rmax }, l);
    return { key: `${l.name}|softcore|${Rc}|${range}`, unit, scale: V0 };
  }
  return { key: `${l.name}|${pot.shape}|${spec.V1}|${spec.V2 ?? 0}|${range}`, unit: pot, scale: 1 };
}
