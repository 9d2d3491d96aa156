/**
 * The result of a variational Monte Carlo run as plain data: every observable with its
 * error (binning or jackknife), the optimised parameters, and the optimisation trace
 * (energy per step) for convergence plots. Field names match the exact-diagonalisation
 * result, so the two can be compared line by line.
 */
import type { Estimate } from './binning.ts';
import type { MeasuredObservables } from './measured-observables.ts';
import type { VmcSystem } from './segment.ts';
import type { VmcRequest, VmcSettings } from './vmc-request.ts';

export interface VmcResult {
  method: 'vmc';
  sites: number;
  chains: number;
  seed: number | string;
  mu: number;
  delta: number | null;
  selfConsistent: boolean;
  /** Photon amplitude (optimised: the average over the last steps, error its spread / sqrt(those steps)). */
  alpha: Estimate;
  /** <H(alpha)>/N (fixed alpha) or e = (delta - mu) alpha^2 + <H>/N (optimised alpha). */
  energyPerSite: Estimate;
  hamiltonianPerSite: Estimate;
  grandPotentialPerSite: Estimate | null;
  /** de/dalpha = 2 (delta - mu) alpha - <sigma^x> at the measured alpha. */
  dEdAlpha: Estimate | null;
  density: Estimate;
  photonDensity: Estimate;
  sigmaX: Estimate;
  siteDensities: Estimate[];
  structureFactor: { k: [number, number]; m: [number, number]; value: number; error: number }[];
  correlation: { r: number; value: number; error: number; pairs: number }[];
  /** Density-wave order m^2 = <|n_k*|^2>/N^2 at the k* != 0 maximising it. */
  orderParameter: { k: [number, number]; m: [number, number]; value: number; error: number } | null;
  acceptance: number;
  /** Integrated autocorrelation time of the energy (sweeps). */
  tauInt: number;
  /** Measurement sweeps over all chains. */
  samples: number;
  parameters: { oneBody: number[]; jastrow: { r: number; v: number }[] };
  trace: { step: number; energyPerSite: number; error: number; alpha: number; acceptance: number }[];
}

export interface VmcResultInput {
  sys: VmcSystem;
  req: VmcRequest;
  set: VmcSettings;
  obs: MeasuredObservables;
  theta: Float64Array;
  alpha: number;
  alphaError: number;
  acceptance: number;
  trace: VmcResult['trace'];
}

/** Assemble the result. */
export function vmcResult(r: VmcResultInput): VmcResult {
  const { obs, alpha } = r;
  const { gap, selfConsistent } = r.set;
  const h = obs.energyPerSite;
  const grand = gap === null ? null : { value: gap * alpha * alpha + h.value, error: h.error };
  const G = r.sys.ansatz.groups;
  return {
    method: 'vmc', sites: r.sys.cluster.N, chains: r.set.chains, seed: r.req.seed, mu: r.req.mu, delta: r.req.delta ?? null,
    selfConsistent, alpha: { value: alpha, error: r.alphaError },
    energyPerSite: selfConsistent ? (grand as Estimate) : h, hamiltonianPerSite: h, grandPotentialPerSite: grand,
    dEdAlpha: gap === null ? null : { value: 2 * gap * alpha - obs.sigmaX.value, error: obs.sigmaX.error },
    density: obs.density, photonDensity: { value: alpha * alpha, error: 2 * alpha * r.alphaError }, sigmaX: obs.sigmaX,
    siteDensities: obs.siteDensities, structureFactor: obs.structureFactor, correlation: obs.correlation, orderParameter: obs.orderParameter,
    acceptance: r.acceptance, tauInt: obs.tauInt, samples: obs.samples,
    parameters: {
      oneBody: Array.from(r.theta.subarray(0, G)),
      jastrow: Array.from(r.sys.ansatz.shellDistances, (d, s) => ({ r: d, v: r.theta[G + s] })),
    },
    trace: r.trace,
  };
}
