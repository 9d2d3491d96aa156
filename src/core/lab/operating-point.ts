/**
 * The lab's operating point in model units with its tolerance: the planner's numbers
 * (units.ts) and the standard uncertainties the user gives for the spacing a, the
 * detuning Delta and the pump mu_lab, carried to every quantity a map axis can hold.
 *
 * First-order (linear) propagation of uncorrelated inputs: for f(x_1..x_n),
 *
 *   sigma_f^2 = sum_i (df/dx_i)^2 sigma_i^2
 *
 * (the usual law of propagation of uncertainty; JCGM 100:2008, "GUM", eq. 10). With C6, g
 * and T taken as exact (the planner asks no uncertainty for them), each model quantity
 * depends on one input only, so the sum has one term:
 *
 *   Rb/a = Rb / a                   d(Rb/a)/da = -(Rb/a)/a     sigma(Rb/a) = (Rb/a) sigma_a / a
 *   V1   = 2 (Rb/a)^6 = 2 Rb^6 a^-6  dV1/da = -6 V1 / a         sigma(V1)   = 6 V1 sigma_a / a
 *   delta = Delta / g                                          sigma(delta) = sigma_Delta / g
 *   mu    = mu_lab / g                                         sigma(mu)    = sigma_mu / g
 *
 * Rb/a and V1 share the one input a, so their errors are fully correlated (on a map over
 * both the tolerance would be a curve, not a box). The linear box is symmetric; the true
 * image of a +- sigma_a under V1 ~ a^-6 is not, and its second-order term is
 * 21 (sigma_a/a)^2 V1, so the box is a fair picture only while 6 sigma_a / a is small:
 * `linear` says whether that ratio is below LINEAR_LIMIT.
 */
import { InputError, requireFinite } from '../input-error.ts';
import { type LabNumbers, type ModelNumbers, labToModel } from './units.ts';

/** A value with its standard uncertainty (one sigma, same units). */
export interface Uncertain { value: number; sigma: number }

/** Standard uncertainties of the lab entries (um and MHz, >= 0; 0 = exact). */
export interface LabUncertainties { spacingUm: number; detuningMHz: number; muMHz: number }

/** Largest 6 sigma_a / a (the V1 box's relative half-width) the linear box is shown as fair for. */
export const LINEAR_LIMIT = 0.2;

export interface OperatingPoint {
  model: ModelNumbers;
  rbOverA: Uncertain;
  V1: Uncertain;
  delta: Uncertain;
  mu: Uncertain;
  /** Temperature in g (exact: no uncertainty asked). */
  T: number;
  /** 6 sigma_a / a < LINEAR_LIMIT: the first-order box is a fair picture. */
  linear: boolean;
}

function requireSigma(x: number, field: string, what: string): number {
  requireFinite(x, field);
  if (x < 0) throw new InputError(`uncertainty of the ${what} must be >= 0, got ${x}`, field);
  return x;
}

/**
 * The operating point and its first-order tolerances (formulas in the file's doc block).
 * Refuses a negative or non-finite uncertainty, and a spacing uncertainty as large as the
 * spacing itself (the linear picture means nothing there), naming the field
 * ('dspacing', 'ddetuning', 'dmu').
 */
export function operatingPoint(lab: LabNumbers, u: LabUncertainties): OperatingPoint {
  const model = labToModel(lab);
  const sa = requireSigma(u.spacingUm, 'dspacing', 'spacing');
  const sD = requireSigma(u.detuningMHz, 'ddetuning', 'detuning');
  const sm = requireSigma(u.muMHz, 'dmu', 'pump');
  const rel = sa / lab.spacingUm;
  if (!(rel < 1)) throw new InputError(`uncertainty of the spacing (${sa} \u00b5m) must be below the spacing itself (${lab.spacingUm} \u00b5m)`, 'dspacing');
  const g = model.gMHz;
  return {
    model,
    rbOverA: { value: model.rbOverA, sigma: model.rbOverA * rel },
    V1: { value: model.V1, sigma: 6 * model.V1 * rel },
    delta: { value: model.delta, sigma: sD / g },
    mu: { value: model.mu, sigma: sm / g },
    T: model.T,
    linear: 6 * rel < LINEAR_LIMIT,
  };
}
