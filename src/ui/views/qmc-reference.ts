/**
 * The correlated check's verdict on a variational result, with quantum Monte Carlo as the
 * unbiased reference: the variational energy is an upper bound on the cluster's ground
 * energy, so VMC above an exact (ED) or unbiased (ground-state QMC) energy of the same
 * cluster beyond the errors means the ansatz or its optimisation falls short; above the
 * mean-field Omega (a product state) it is worse than the simplest state. An optimisation
 * trace whose energy still falls is not converged, whatever its error bars say.
 *
 * "Beyond the errors" is 3 sigma of the combined errors (Monte Carlo errors are Gaussian
 * to a good approximation after binning; 3 sigma is one false alarm in about 700).
 */
import type { Estimate } from '../../core/vmc/binning.ts';
import type { VmcResult } from '../../core/vmc/vmc-result.ts';
import { plusMinus } from './qmc-numbers.ts';

/** Sigmas of a difference that count as "beyond the errors". */
export const SIGMAS = 3;

/** Energies per site of the same inputs to hold the VMC energy against. */
export interface VmcReferences {
  /** Exact diagonalisation of the same cluster (no error). */
  ed?: number;
  /** Ground-state QMC of the same cluster. */
  qmc?: Estimate;
  /** Mean-field Omega per site at T = 0 (the infinite lattice's product state). */
  meanField?: number;
}

export interface TraceVerdict {
  /** Null when the trace is too short to judge (fewer than 10 steps). */
  converged: boolean | null;
  /** Mean of the last window minus mean of the window before it. */
  change: number;
  /** The change in units of its error. */
  sigmas: number;
  window: number;
}

/**
 * Drift of an optimisation trace: the mean energy of the last W = max(5, n/5) steps
 * against that of the W steps before, each with the standard error of its window's
 * scatter (the step errors when the scatter is zero). Converged when the change is
 * within SIGMAS of its error.
 */
export function traceVerdict(trace: readonly { energyPerSite: number; error: number }[]): TraceVerdict {
  const n = trace.length;
  const W = Math.max(5, Math.floor(n / 5));
  if (n < 10) return { converged: null, change: NaN, sigmas: NaN, window: W };
  const stats = (w: readonly { energyPerSite: number; error: number }[]) => {
    const m = w.reduce((s, t) => s + t.energyPerSite, 0) / w.length;
    const v = w.reduce((s, t) => s + (t.energyPerSite - m) ** 2, 0) / (w.length - 1);
    const e2 = w.reduce((s, t) => s + t.error * t.error, 0) / w.length;
    return { m, se2: (v > 0 ? v : e2) / w.length };
  };
  const last = stats(trace.slice(n - W)), before = stats(trace.slice(n - 2 * W, n - W));
  const change = last.m - before.m;
  const err = Math.sqrt(last.se2 + before.se2);
  const sigmas = err > 0 ? Math.abs(change) / err : change === 0 ? 0 : Infinity;
  return { converged: sigmas <= SIGMAS, change, sigmas, window: W };
}

/** Warnings on a VMC result against the references (empty when it passes every check). */
export function vmcWarnings(v: VmcResult, refs: VmcReferences): string[] {
  const out: string[] = [];
  const e = v.energyPerSite;
  const above = (ref: number, refErr: number) => e.value - ref > SIGMAS * Math.hypot(e.error, refErr);
  if (refs.ed !== undefined && above(refs.ed, 0)) {
    out.push(`VMC e = ${plusMinus(e.value, e.error)} lies above the exact ED energy ${refs.ed.toPrecision(8)} of this cluster beyond ${SIGMAS}\u03c3: the ansatz misses the ground state; do not trust its phase.`);
  }
  if (refs.qmc && above(refs.qmc.value, refs.qmc.error)) {
    out.push(`VMC e = ${plusMinus(e.value, e.error)} lies above the unbiased QMC ground energy ${plusMinus(refs.qmc.value, refs.qmc.error)} beyond ${SIGMAS}\u03c3: trust QMC here.`);
  }
  if (refs.meanField !== undefined && above(refs.meanField, 0)) {
    out.push(`VMC e = ${plusMinus(e.value, e.error)} lies above the mean-field \u03a9 = ${refs.meanField.toPrecision(8)} (a product state) beyond ${SIGMAS}\u03c3: the optimisation has not found the right state.`);
  }
  const t = traceVerdict(v.trace);
  if (t.converged === false) {
    out.push(`The optimisation trace has not converged: over the last ${t.window} steps e moved by ${t.change.toPrecision(2)} (${t.sigmas.toFixed(1)}\u03c3 of its noise); its error bars understate the error. Run more steps.`);
  } else if (t.converged === null) {
    out.push(`The optimisation trace has ${v.trace.length} steps, too few to judge its convergence.`);
  }
  return out;
}
