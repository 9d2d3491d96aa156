/**
 * Losses in the array planner: cooperativity, strong coupling, and the loss rates against
 * the energy scales of the predicted phase. A check of scales, not a calculation: the tool
 * solves a quasi-equilibrium model (a chemical potential for the excitations, no losses);
 * full driven-dissipative steady states are NOT computed here.
 *
 * Conventions (all rates as ordinary frequencies in MHz, like the rest of the planner, so
 * kappa means kappa/2pi and g means g/2pi; the ratios below do not depend on the unit):
 *   kappa     cavity linewidth: FULL width at half maximum of the empty-cavity line
 *             (the photon-number, i.e. energy, decay rate; the field decays at kappa/2).
 *   gamma     emitter decay: full width of the radiative line (the excited-state
 *             population decay rate; the coherence decays at gamma/2).
 *   gammaPhi  emitter dephasing, given as the extra FULL width it adds to the emitter
 *             line, so the emitter line is gammaTot = gamma + gammaPhi wide and its
 *             coherence decays at gammaTot/2. (Papers that quote a pure-dephasing rate
 *             gamma* of the coherence have gammaPhi = 2 gamma*.)
 *   g0, g     couplings with 2 g0 (2 g) the vacuum Rabi splitting of one emitter (of the
 *             ensemble, g = g0 sqrt(N)), as in units.ts.
 */
import { InputError, requireFinite } from '../input-error.ts';

/** The loss entries, full widths in MHz (kappa/2pi, gamma/2pi, gammaPhi/2pi). */
export interface LossRates {
  kappaMHz: number;
  gammaMHz: number;
  /** Extra full width from dephasing (0 for a purely radiative emitter line). */
  gammaPhiMHz: number;
}

/** Refuses negative or non-finite widths; kappa and gamma must be > 0 (they divide). */
export function validateLosses(l: LossRates): void {
  requireFinite(l.kappaMHz, 'kappa');
  requireFinite(l.gammaMHz, 'gamma');
  requireFinite(l.gammaPhiMHz, 'dephasing');
  if (!(l.kappaMHz > 0)) throw new InputError(`cavity linewidth kappa must be > 0, got ${l.kappaMHz}`, 'kappa');
  if (!(l.gammaMHz > 0)) throw new InputError(`emitter decay gamma must be > 0, got ${l.gammaMHz}`, 'gamma');
  if (!(l.gammaPhiMHz >= 0)) throw new InputError(`dephasing must be >= 0, got ${l.gammaPhiMHz}`, 'dephasing');
}

/**
 * Cooperativity C = 4 g^2 / (kappa gamma), g the coupling (half the vacuum Rabi splitting),
 * kappa and gamma FULL widths. With g = g0 this is the single-emitter C1; with the
 * collective g = g0 sqrt(N) it is the collective C = N C1. This is the convention of
 * H. Tanji-Suzuki et al., Adv. At. Mol. Opt. Phys. 60, 201 (2011) (their eta = 4g^2/(kappa
 * Gamma); convention recalled from memory). Pass gamma + gammaPhi for the cooperativity
 * that dephasing leaves (the emitter coherence then decays at (gamma + gammaPhi)/2).
 */
export function cooperativity(gMHz: number, kappaMHz: number, gammaMHz: number): number {
  return (4 * gMHz * gMHz) / (kappaMHz * gammaMHz);
}

/**
 * One emitter and one mode at resonance, with the field decaying at kappa/2 and the emitter
 * coherence at gammaTot/2: the non-Hermitian matrix [[-i kappa/2, g], [g, -i gammaTot/2]]
 * has the eigenvalues  -i (kappa + gammaTot)/4 +- sqrt(g^2 - (kappa - gammaTot)^2/16)
 * (derived here). Each polariton has the full width (kappa + gammaTot)/2; the two are split
 * by 2g when g >> |kappa - gammaTot|/4.
 *
 * Criterion used for "strong coupling": the splitting exceeds the polariton full width,
 *   2g > (kappa + gammaTot)/2,
 * i.e. the two normal-mode lines are resolved (a resolution criterion of the Rayleigh kind,
 * a convention; many works write g >> kappa, gamma instead, from memory). The weaker
 * condition g > |kappa - gammaTot|/4 is where the normal modes split at all (exceptional
 * point of the matrix above); both are returned. Inhomogeneous broadening is not included.
 */
export function strongCoupling(gMHz: number, kappaMHz: number, gammaTotMHz: number): {
  splittingMHz: number; polaritonWidthMHz: number; strong: boolean; split: boolean;
} {
  const polaritonWidthMHz = (kappaMHz + gammaTotMHz) / 2;
  return {
    splittingMHz: 2 * gMHz,
    polaritonWidthMHz,
    strong: 2 * gMHz > polaritonWidthMHz,
    split: gMHz > Math.abs(kappaMHz - gammaTotMHz) / 4,
  };
}

/**
 * Lower polariton of one excitation, relative to the emitter line (same model as the tool:
 * cavity at Delta above the emitter, collective coupling g):
 *   E_LP = Delta/2 - sqrt(Delta^2/4 + g^2),   polariton gap E_UP - E_LP = sqrt(Delta^2 + 4 g^2).
 * (The eigenvalues of [[Delta, g], [g, 0]].) Without interactions the empty state becomes
 * unstable to a condensate of these polaritons when the pump mu exceeds E_LP, so
 * |mu - E_LP| is the condensate scale of the bare polaritons.
 */
export function polaritonScales(gMHz: number, detuningMHz: number, muMHz: number): {
  lowerPolaritonMHz: number; polaritonGapMHz: number; pumpToLowerPolaritonMHz: number;
} {
  const root = Math.sqrt((detuningMHz * detuningMHz) / 4 + gMHz * gMHz);
  const lowerPolaritonMHz = detuningMHz / 2 - root;
  return { lowerPolaritonMHz, polaritonGapMHz: 2 * root, pumpToLowerPolaritonMHz: Math.abs(muMHz - lowerPolaritonMHz) };
}

/** The loss check's answer. */
export type QuasiEquilibrium = 'applies' | 'marginal' | 'does not apply';

/** Losses against the scales of the planned point (every energy and rate in MHz). */
export interface LossBudget {
  gammaTotMHz: number;
  /** Single-emitter cooperativity (null when only the collective splitting is known). */
  c1: number | null;
  /** C1 with the emitter line broadened by dephasing, 4 g0^2/(kappa (gamma + gammaPhi)). */
  c1Dephased: number | null;
  /** Collective C = 4 g^2/(kappa gamma) = N C1, and with dephasing. */
  c: number;
  cDephased: number;
  strong: ReturnType<typeof strongCoupling>;
  polariton: ReturnType<typeof polaritonScales>;
  /** The largest loss rate max(kappa, gamma + gammaPhi). */
  maxLossMHz: number;
  /** The phase margin in energy (distance to the nearest boundary along mu, times g); null if unknown. */
  marginMHz: number | null;
  /** The smallest of margin, polariton gap and |mu - E_LP|, and which one it is. */
  smallestGapMHz: number;
  smallestGapName: 'phase margin' | 'polariton gap' | 'pump to lower polariton';
  /** maxLoss / smallestGap. */
  lossOverGap: number;
  verdict: QuasiEquilibrium;
}

/**
 * Ratio below which losses count as small against a gap. A choice of this tool (an order
 * of magnitude), not a published threshold.
 */
export const SMALL_LOSS_RATIO = 0.1;

/**
 * The loss budget of a planned point. Quasi-equilibrium can apply only if (i) the coupling
 * is strong (above), (ii) the largest loss rate is small (< SMALL_LOSS_RATIO) against the
 * phase margin, the polariton gap and the pump's distance to the lower polariton, and
 * (iii) the excitations relax to the temperature T faster than they are lost: this tool
 * does not know that relaxation rate, so (iii) is stated, not checked. "marginal" when the
 * losses are below every gap but not small against the smallest; "does not apply"
 * otherwise or without strong coupling.
 */
export function lossBudget(a: {
  losses: LossRates; gMHz: number; g0MHz?: number; detuningMHz: number; muMHz: number; marginMHz?: number | null;
}): LossBudget {
  const l = a.losses;
  validateLosses(l);
  const gammaTotMHz = l.gammaMHz + l.gammaPhiMHz;
  const g0 = a.g0MHz;
  const strong = strongCoupling(a.gMHz, l.kappaMHz, gammaTotMHz);
  const polariton = polaritonScales(a.gMHz, a.detuningMHz, a.muMHz);
  const maxLossMHz = Math.max(l.kappaMHz, gammaTotMHz);
  const marginMHz = a.marginMHz ?? null;
  const gaps: [LossBudget['smallestGapName'], number][] = [
    ['polariton gap', polariton.polaritonGapMHz], ['pump to lower polariton', polariton.pumpToLowerPolaritonMHz],
  ];
  if (marginMHz !== null) gaps.unshift(['phase margin', marginMHz]);
  const [smallestGapName, smallestGapMHz] = gaps.reduce((m, x) => (x[1] < m[1] ? x : m));
  const lossOverGap = maxLossMHz / smallestGapMHz;
  const verdict: QuasiEquilibrium = !strong.strong || !(lossOverGap < 1) ? 'does not apply'
    : lossOverGap < SMALL_LOSS_RATIO ? 'applies' : 'marginal';
  return {
    gammaTotMHz,
    c1: g0 === undefined ? null : cooperativity(g0, l.kappaMHz, l.gammaMHz),
    c1Dephased: g0 === undefined ? null : cooperativity(g0, l.kappaMHz, gammaTotMHz),
    c: cooperativity(a.gMHz, l.kappaMHz, l.gammaMHz),
    cDephased: cooperativity(a.gMHz, l.kappaMHz, gammaTotMHz),
    strong, polariton, maxLossMHz, marginMHz, smallestGapMHz, smallestGapName, lossOverGap, verdict,
  };
}
