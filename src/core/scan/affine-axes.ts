/**
 * Which map axes enter the grand potential of a fixed trial state affinely
 * (docs/certified-maps.md). With the state fixed (occupations, Bloch angles, alpha),
 *
 *   Omega = (delta - mu) alpha^2 - mu mean m + alpha mean <sigma^x> + (1/(2M)) m.J.m ,
 *
 * is affine in mu, in delta and in every interaction strength (J is linear in V1; vdw and
 * dipolar sums are linear in C = 2 Rb^6 or 2 Rb^3, so in Rb^s, a monotone function of Rb).
 * The affine coordinate u of an axis is the variable in which Omega is affine: mu, delta,
 * V1, or Rb^s. Temperature and a fixed density are not such parameters (at T > 0 the
 * minimiser moves with every parameter and is never a fixed state; at fixed rho, mu is an
 * output), so maps over them, or at T > 0, are refined without certification.
 */
import type { ModelParams } from '../model.ts';
import type { AxisName } from './axes.ts';
import type { ScanPlan } from './grid.ts';

/** The affine coordinate u(value) of an axis at base parameters p, or null when Omega is not affine in it. */
export function affineCoordinate(name: AxisName, value: number, p: ModelParams): number | null {
  switch (name) {
    case 'mu': case 'detuning': case 'v1': return value;
    case 'rb': return p.interaction.shape === 'vdw' ? value ** 6 : p.interaction.shape === 'dipolar' ? value ** 3 : null;
    default: return null;
  }
}

/** The axis value of an affine coordinate u (the inverse of affineCoordinate). */
export function axisValue(name: AxisName, u: number, p: ModelParams): number {
  if (name === 'rb') return p.interaction.shape === 'vdw' ? u ** (1 / 6) : u ** (1 / 3);
  return u;
}

/**
 * Why a plan's map cannot be certified (a sentence for the output's notes), or null when
 * it can: T = 0, fixed mu, and every axis affine.
 */
export function certificationBlocker(plan: ScanPlan): string | null {
  const axes = plan.y ? [plan.x, plan.y] : [plan.x];
  for (const a of axes) {
    if (affineCoordinate(a.name, a.values[0], plan.base) === null) {
      return `the ${a.name} axis does not enter the grand potential of a fixed state affinely: every pixel is solved (adaptive refinement without certification)`;
    }
  }
  if (plan.base.rho !== undefined) return 'at fixed density mu is an output, not an affine parameter: every pixel is solved (no certification)';
  if (plan.base.T !== 0) return 'at T > 0 no state is an integer pattern (the minimiser moves with every parameter): every pixel is solved (no certification)';
  return null;
}
