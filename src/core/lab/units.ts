/**
 * Lab numbers <-> model units for the array planner.
 *
 * Frequencies are ordinary frequencies nu = E/h (what a lab quotes as "g/2pi = 1 MHz").
 * The model measures energies in the collective coupling g = g0 sqrt(N) (so the vacuum
 * Rabi splitting at resonance is 2g) and lengths in the lattice spacing a.
 *
 *   g         = g0 sqrt(N)                  or  g = (collective splitting) / 2
 *   delta     = Delta / g,  mu = mu_lab / g,  T = k_B T_lab / (h g)
 *   V(r)      = C6 / r^6   (vdw),   V(Rb) = 2g  =>  Rb = (C6 / (2g))^(1/6)
 *   Rb / a    = (C6 / (a^6 2g))^(1/6),   V1 = V(a)/g = 2 (Rb/a)^6
 *
 * C6 is given as C6/h in GHz um^6 and converted to MHz um^6 before dividing by g in MHz,
 * so the ratio is dimensionless in um^6. k_B/h = 20.836 619 12 GHz/K is exact in the SI
 * since 2019 (k_B = 1.380 649e-23 J/K, h = 6.626 070 15e-34 J s; BIPM SI Brochure, 9th ed.).
 */
import { InputError, requireFinite } from '../input-error.ts';

/** k_B / h in MHz per kelvin (exact SI ratio). */
export const KB_OVER_H_MHZ_PER_K = 1.380649e-23 / 6.62607015e-34 / 1e6;

/** How the light-matter coupling is given. */
export type CouplingInput =
  | { kind: 'single'; g0MHz: number; emitters: number }
  | { kind: 'collective'; splittingMHz: number };

/** The planner's lab-side inputs. */
export interface LabNumbers {
  /** C6/h in GHz um^6 (van der Waals coefficient of the pair state). */
  c6GHzUm6: number;
  /** Lattice spacing a in um. */
  spacingUm: number;
  coupling: CouplingInput;
  /** Cavity minus emitter frequency, Delta/h in MHz. */
  detuningMHz: number;
  /** Excitation chemical potential from the emitter line, mu/h in MHz. */
  muMHz: number;
  /** Temperature of the excitations in kelvin. */
  temperatureK: number;
}

/** The same point in model units (energies in g, lengths in a). */
export interface ModelNumbers {
  /** Collective coupling g/h in MHz (the energy unit). */
  gMHz: number;
  /** Blockade radius in um and in lattice spacings. */
  rbUm: number;
  rbOverA: number;
  /** Nearest-neighbour interaction V(a) in units of g. */
  V1: number;
  delta: number;
  mu: number;
  T: number;
}

/** g = g0 sqrt(N), or half the collective (vacuum Rabi) splitting. Refuses non-positive input. */
export function collectiveCouplingMHz(c: CouplingInput): number {
  if (c.kind === 'single') {
    requireFinite(c.g0MHz, 'g0');
    requireFinite(c.emitters, 'emitters');
    if (!(c.g0MHz > 0)) throw new InputError(`single-emitter coupling g0 must be > 0, got ${c.g0MHz}`, 'g0');
    if (!(c.emitters >= 1) || !Number.isInteger(c.emitters)) {
      throw new InputError(`emitter number must be a whole number >= 1, got ${c.emitters}`, 'emitters');
    }
    return c.g0MHz * Math.sqrt(c.emitters);
  }
  requireFinite(c.splittingMHz, 'splitting');
  if (!(c.splittingMHz > 0)) throw new InputError(`collective splitting must be > 0, got ${c.splittingMHz}`, 'splitting');
  return c.splittingMHz / 2;
}

/** Rb = (C6 / (2g))^(1/6) in um, C6/h in GHz um^6 and g/h in MHz. */
export function blockadeRadiusUm(c6GHzUm6: number, gMHz: number): number {
  requireFinite(c6GHzUm6, 'c6');
  if (!(c6GHzUm6 > 0)) throw new InputError(`C6 must be > 0 (a repulsive van der Waals pair), got ${c6GHzUm6}`, 'c6');
  return Math.pow((c6GHzUm6 * 1e3) / (2 * gMHz), 1 / 6);
}

/** Convert lab numbers to model units. Every bad entry is refused with the field it came from. */
export function labToModel(lab: LabNumbers): ModelNumbers {
  const gMHz = collectiveCouplingMHz(lab.coupling);
  requireFinite(lab.spacingUm, 'spacing');
  if (!(lab.spacingUm > 0)) throw new InputError(`lattice spacing must be > 0, got ${lab.spacingUm}`, 'spacing');
  requireFinite(lab.detuningMHz, 'detuning');
  requireFinite(lab.muMHz, 'mu');
  requireFinite(lab.temperatureK, 'temperature');
  if (lab.temperatureK < 0) throw new InputError(`temperature must be >= 0, got ${lab.temperatureK}`, 'temperature');
  const rbUm = blockadeRadiusUm(lab.c6GHzUm6, gMHz);
  const rbOverA = rbUm / lab.spacingUm;
  return {
    gMHz, rbUm, rbOverA, V1: 2 * Math.pow(rbOverA, 6),
    delta: lab.detuningMHz / gMHz,
    mu: lab.muMHz / gMHz,
    T: (KB_OVER_H_MHZ_PER_K * lab.temperatureK) / gMHz,
  };
}

/**
 * Back from model units to the lab: given C6 and g (which fix Rb in um), the spacing that
 * realises Rb/a, and the detuning, pump and temperature that realise delta, mu, T.
 */
export function modelToLab(
  m: { rbOverA: number; delta: number; mu: number; T: number },
  c6GHzUm6: number, gMHz: number,
): { spacingUm: number; detuningMHz: number; muMHz: number; temperatureK: number } {
  if (!(m.rbOverA > 0)) throw new InputError(`Rb/a must be > 0, got ${m.rbOverA}`, 'rb');
  const rbUm = blockadeRadiusUm(c6GHzUm6, gMHz);
  return {
    spacingUm: rbUm / m.rbOverA,
    detuningMHz: m.delta * gMHz,
    muMHz: m.mu * gMHz,
    temperatureK: (m.T * gMHz) / KB_OVER_H_MHZ_PER_K,
  };
}
