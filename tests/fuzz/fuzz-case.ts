/**
 * Run one fuzz case (fuzz-inputs.ts) against the core and judge the outcome:
 *
 *   answered  a result without NaN or infinite numbers, and, where physics gives the answer,
 *             the right one (the checks below);
 *   refused   an InputError (bad or out-of-limit input, said in one line);
 *   named     a ConvergenceError (a numerical limit at a valid input, named);
 *   crash     any other exception; wrong: a result that fails a check (with the reason).
 *
 * Checks without interaction (V = 0, or a range below the closest pair distance), from
 * DESIGN.md's check values, on any lattice:
 *   - mean-field at fixed mu: every emitter alone in the photon field. Normal state while
 *     (delta - mu) >= g0 = tanh(|mu|/(2T))/|mu| (T = 0: 1/|mu|; the Dicke transition, Hepp and
 *     Lieb 1973; Wang and Hioe 1973), with m = (1 + tanh(mu/(2T)))/2 and
 *     Omega = -mu/2 - T ln 2cosh(mu/(2T)); else the condensate with (delta - mu) = tanh(E/T)/(2E)
 *     (T = 0: 1/(2E); Hopfield 1958), alpha^2 = E^2 - mu^2/4, m = (1 + mu tanh(E/T)/(2E))/2,
 *     Omega = (delta - mu) alpha^2 - mu/2 - T ln 2cosh(E/T). Tolerances 1e-7 on m and (1 + alpha^2)
 *     (the solver converges m to 1e-12; near the transition alpha^2 ~ distance and a quartic
 *     minimum leaves alpha ~ 1e-7), 1e-9 relative on Omega (second order in those errors).
 *     Skipped within 1e-6 of the transition (either side is then right to that accuracy).
 *   - at any repulsion (V >= 0), fixed mu: Omega >= the free Omega above (the Hartree term
 *     (1/2M) m.J.m >= 0 only adds), and at T = 0 Omega <= 0 (the empty product state), to 1e-9.
 *   - fixed density: the state found has the asked density unless it reports coexistence, to
 *     the solver's promise STEEP_TOL (1 + rho) = 1e-6 (1 + rho) (RHO_TOL = 1e-12 where mu resolves
 *     rho(mu); at T >> g the condensate rises within 1/(2T) of delta, finer than mu resolves).
 *   - spectrum of the empty state at T = 0: polaritons delta/2 - mu +- sqrt(delta^2/4 + 1) at
 *     the zone centre and the flat band -mu elsewhere (Hopfield 1958), to 1e-9 relative.
 *   - ED at a fixed alpha: e = -mu/2 - sqrt(mu^2/4 + alpha^2) per site to 1e-9 (Lanczos is
 *     converged to 1e-10 relative); VMC at a fixed alpha: above that exact energy less
 *     4 standard errors (the variational bound, 4 sigma for Monte Carlo).
 */
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';
import { STEEP_TOL } from '../../src/core/meanfield/fixed-density.ts';
import { stateSpectrum } from '../../src/core/spectrum/state-spectrum.ts';
import { background, inputFromState } from '../../src/core/spectrum/background.ts';
import { softestMode } from '../../src/core/softmode/softest.ts';
import { exactDiagonalisation } from '../../src/core/ed/exact-diagonalisation.ts';
import { variationalMonteCarlo } from '../../src/core/vmc/variational-monte-carlo.ts';
import type { InteractionSpec } from '../../src/core/interaction/potential.ts';
import type { ModelParams } from '../../src/core/model.ts';
import type { ClusterSpec } from '../../src/core/cluster/spec.ts';
import type { FuzzCase } from './fuzz-inputs.ts';

export type Verdict = 'answered' | 'refused' | 'named' | 'crash' | 'wrong';

export interface Outcome {
  verdict: Verdict;
  /** The error message, or the failed check. */
  note?: string;
  /** A closed form was checked. */
  checked?: boolean;
}

/** No pair interacts: zero strengths, or a range below the closest distance (1 on a lattice). */
export function noInteraction(s: InteractionSpec, closest = 1): boolean {
  if (s.rmax !== undefined && s.rmax < closest - 1e-9) return true;
  if (s.shape === 'nn') return s.V1 === 0 && !s.V2;
  if (s.shape === 'softcore') return s.V0 === 0;
  return s.V1 === 0;
}

/** Closest pair distance of a cluster (1 for a periodic one, the lattice spacing). */
function closestPair(c: ClusterSpec): number {
  if (c.kind === 'periodic') return 1;
  let d = Infinity;
  const p = c.positions;
  for (let i = 0; i < p.length; i += 2) for (let j = i + 2; j < p.length; j += 2) d = Math.min(d, Math.hypot(p[j] - p[i], p[j + 1] - p[i + 1]));
  return d;
}

/** Every pair repels or is free (V >= 0 everywhere). */
function repulsive(s: InteractionSpec): boolean {
  if (s.shape === 'nn') return (s.V1 ?? 0) >= 0 && (s.V2 ?? 0) >= 0;
  if (s.shape === 'softcore') return (s.V0 ?? 0) >= 0;
  return s.Rb !== undefined || (s.V1 ?? 0) >= 0;
}

/** The first NaN or infinite number inside a result (its path), or null. */
function nonFinite(x: unknown, path = 'result', depth = 0): string | null {
  if (typeof x === 'number') return Number.isFinite(x) ? null : `${path} = ${x}`;
  if (x === null || typeof x !== 'object' || depth > 6) return null;
  if (ArrayBuffer.isView(x)) {
    const a = x as unknown as ArrayLike<number>;
    for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) return `${path}[${i}] = ${a[i]}`;
    return null;
  }
  for (const [k, v] of Object.entries(x as Record<string, unknown>)) {
    if (typeof v === 'function') continue;
    const r = nonFinite(v, `${path}.${k}`, depth + 1);
    if (r) return r;
  }
  return null;
}

const close = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol;

/** -T ln 2cosh(x/T) (T = 0: -|x|), without overflow. */
const lnCosh = (x: number, T: number) => (T === 0 ? -Math.abs(x) : -Math.abs(x) - T * Math.log1p(Math.exp(-2 * Math.abs(x) / T)));

/** The no-interaction mean-field state at fixed mu (module note), or null near the transition. */
export function freeState(p: ModelParams): { alpha2: number; m: number; omega: number } | null {
  const mu = p.mu as number, dmu = p.delta - mu, T = p.T < 1e-12 ? 0 : p.T;
  const g = (E: number) => (T === 0 ? 1 / (2 * E) : E === 0 ? 1 / (2 * T) : Math.tanh(E / T) / (2 * E));
  const g0 = g(Math.abs(mu) / 2);
  if (Math.abs(dmu - g0) <= 1e-6 * Math.max(1, dmu)) return null;
  if (dmu > g0) {
    const m = T === 0 ? (mu > 0 ? 1 : 0) : (1 + Math.tanh(mu / (2 * T))) / 2;
    return { alpha2: 0, m, omega: -mu / 2 + lnCosh(mu / 2, T) };
  }
  let lo = Math.abs(mu) / 2, hi = 1 / (2 * dmu);
  for (let it = 0; it < 200; it++) { const E = (lo + hi) / 2; if (g(E) > dmu) lo = E; else hi = E; }
  const E = (lo + hi) / 2, a = Math.max(0, E * E - mu * mu / 4);
  const r = T === 0 ? 1 : Math.tanh(E / T);
  return { alpha2: a, m: (1 + (mu * r) / (2 * E)) / 2, omega: dmu * a - mu / 2 + lnCosh(E, T) };
}

/** Judge one answered case: a string names a failed check; `checked` when a closed form applied. */
function check(c: FuzzCase, r: unknown, mark: { checked: boolean }): string | null {
  const bad = nonFinite(r);
  if (bad) return `non-finite number: ${bad}`;
  if (c.kind === 'solve' && c.params.mu !== undefined && repulsive(c.params.interaction)) {
    // Bounds at any repulsion: Omega(V) of a product state is Omega(0) plus (1/2M) m.J.m >= 0,
    // so the minimum lies above the free one; at T = 0 the empty product state has Omega = 0.
    const s = r as ReturnType<typeof solveGroundState>, f = freeState(c.params);
    const tol = 1e-9 * (1 + Math.abs(s.grandPotential));
    if (f && s.grandPotential < f.omega - tol) return `Omega = ${s.grandPotential} below the free ${f.omega} for a repulsive interaction`;
    if (c.params.T === 0 && s.grandPotential > tol) return `Omega = ${s.grandPotential} above the empty state's 0 at T = 0`;
  }
  if (c.kind === 'solve' && noInteraction(c.params.interaction)) {
    const s = r as ReturnType<typeof solveGroundState>;
    if (c.params.rho !== undefined) {
      mark.checked = !s.coexistence;
      if (!s.coexistence && !close(s.excitationDensity, c.params.rho, STEEP_TOL * (1 + c.params.rho))) {
        return `density ${s.excitationDensity} for the asked ${c.params.rho}`;
      }
      return null;
    }
    const f = freeState(c.params);
    if (!f) return null;
    mark.checked = true;
    const m = s.sublatticeDensities.reduce((x, y) => x + y, 0) / s.sublatticeDensities.length;
    if (!close(s.photonDensity, f.alpha2, 1e-7 * (1 + f.alpha2))) return `alpha^2 = ${s.photonDensity}, closed form ${f.alpha2}`;
    if (!close(m, f.m, 1e-7)) return `m = ${m}, closed form ${f.m}`;
    if (!close(s.grandPotential, f.omega, 1e-9 * (1 + Math.abs(f.omega)))) return `Omega = ${s.grandPotential}, closed form ${f.omega}`;
  }
  if (c.kind === 'spectrum' && noInteraction(c.params.interaction) && c.params.T === 0) {
    const s = r as ReturnType<typeof stateSpectrum>;
    const mu = c.params.mu as number, d = c.params.delta;
    if (s.state.phase !== 'empty') return null;
    mark.checked = true;
    const root = Math.sqrt(d * d / 4 + 1);
    const want = [d / 2 - mu - root, d / 2 - mu + root];
    const got = s.zoneCentre.omega;
    if (got.length !== 2 || want.some((w, i) => !close(got[i], w, 1e-9 * Math.abs(w)))) return `zone centre ${got}, polaritons ${want}`;
    for (const b of s.branches) {
      const k = typeof b.k === 'number' ? [b.k, 0] : b.k;
      if (Math.hypot(k[0], k[1]) < 1e-12) continue;
      if (b.omega.length !== 1 || !close(b.omega[0], -mu, 1e-9 * Math.abs(mu))) return `branch at k = ${b.k}: ${b.omega}, flat band ${-mu}`;
    }
  }
  if ((c.kind === 'ed' || c.kind === 'vmc') && c.alpha !== undefined && noInteraction(c.cluster.interaction, closestPair(c.cluster))) {
    const exact = -c.mu / 2 - Math.sqrt(c.mu * c.mu / 4 + c.alpha * c.alpha);
    mark.checked = true;
    if (c.kind === 'ed') {
      const e = (r as ReturnType<typeof exactDiagonalisation>).energyPerSite;
      if (!close(e, exact, 1e-9 * (1 + Math.abs(exact)))) return `ED energy ${e}, closed form ${exact}`;
    } else {
      const e = (r as ReturnType<typeof variationalMonteCarlo>).energyPerSite;
      if (e.value < exact - 4 * e.error - 1e-12 * (1 + Math.abs(exact))) return `VMC energy ${e.value} +- ${e.error} below the exact ${exact}`;
    }
  }
  return null;
}

/** Call the core for one case (no judging). */
export function callCore(c: FuzzCase): unknown {
  switch (c.kind) {
    case 'solve': return solveGroundState(c.params, { seed: 1 });
    case 'spectrum': return stateSpectrum(c.params, { points: c.points });
    case 'softmode': {
      const s = solveGroundState(c.params, { seed: 1 });
      const { evaluations: _e, ...mode } = softestMode(background(inputFromState(s, c.params)));
      return mode;
    }
    case 'ed': return exactDiagonalisation({ cluster: c.cluster, mu: c.mu, alpha: c.alpha, delta: c.delta });
    case 'vmc': {
      const { trace: _t, ...rest } = variationalMonteCarlo({
        cluster: c.cluster, mu: c.mu, alpha: c.alpha, delta: c.delta, seed: c.seed,
        steps: 3, sweepsPerStep: 16, thermalise: 8, sweeps: 128, bins: 4,
      });
      return rest;
    }
  }
}

/** Run and judge one case. */
export function runCase(c: FuzzCase): Outcome {
  let r: unknown;
  try {
    r = callCore(c);
  } catch (e) {
    const err = e as Error;
    if (err?.name === 'InputError') return { verdict: 'refused', note: err.message };
    if (err?.name === 'ConvergenceError') return { verdict: 'named', note: err.message };
    return { verdict: 'crash', note: `${err?.name}: ${err?.message}` };
  }
  const mark = { checked: false };
  const bad = check(c, r, mark);
  if (bad) return { verdict: 'wrong', note: bad };
  const checked = mark.checked;
  return { verdict: 'answered', checked };
}
