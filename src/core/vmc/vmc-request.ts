/**
 * The inputs of a variational Monte Carlo run as plain data, and their validation into the
 * settings the run uses (defaults filled in, bad input refused with an InputError).
 */
import { InputError, requireBelowDetuning, requireFinite } from '../input-error.ts';
import type { ClusterSpec } from '../cluster/spec.ts';
import type { AnsatzSpec } from './ansatz.ts';

export interface VmcRequest {
  cluster: ClusterSpec;
  mu: number;
  /** Fixed photon amplitude alpha >= 0. */
  alpha?: number;
  /** Cavity detuning; without alpha the photon amplitude is optimised. */
  delta?: number;
  ansatz?: AnsatzSpec;
  seed: number | string;
  /** Number of Markov chains (one per worker); default 1. */
  chains?: number;
  /** Stochastic-reconfiguration steps (default 200) and sweeps per step over all chains (default 200). */
  steps?: number;
  sweepsPerStep?: number;
  /** SR imaginary-time step eta (default 0.05) and diagonal shift (default 1e-3). */
  learningRate?: number;
  shift?: number;
  /** Mixing beta of the alpha update (default 0.5). */
  alphaMixing?: number;
  /** Sweeps discarded at the start of each chain and before measuring (default 100). */
  thermalise?: number;
  /** Fraction of proposals that are nearest-neighbour exchanges (default 0.25). */
  exchange?: number;
  /** Measurement sweeps over all chains (default 8192) and bins per chain (default 32). */
  sweeps?: number;
  bins?: number;
}

/** A validated request: every default filled in, sweeps split over the chains. */
export interface VmcSettings {
  mu: number;
  /** delta - mu, or null with a fixed alpha and no detuning. */
  gap: number | null;
  /** alpha optimised (no fixed alpha given). */
  selfConsistent: boolean;
  chains: number;
  steps: number;
  bins: number;
  thermalise: number;
  /** Sweeps per chain per optimisation step, and measured sweeps per chain. */
  perStep: number;
  perChain: number;
  eta: number;
  shift: number;
  beta: number;
  exchange: number;
}

function positiveInteger(x: number, field: string, min = 1): number {
  if (!Number.isInteger(x) || x < min) throw new InputError(`${field} must be an integer >= ${min}, got ${x}`, field);
  return x;
}

/** Validate a request; mu >= delta is refused (the photon number would be unbounded). */
export function vmcSettings(req: VmcRequest): VmcSettings {
  const mu = requireFinite(req.mu, 'mu');
  if (req.alpha === undefined && req.delta === undefined) {
    throw new InputError('give alpha (a fixed photon amplitude) or the detuning (alpha optimised)', 'alpha');
  }
  if (req.alpha !== undefined && (requireFinite(req.alpha, 'alpha') < 0)) throw new InputError(`alpha must be >= 0, got ${req.alpha}`, 'alpha');
  const gap = req.delta === undefined ? null : requireBelowDetuning(mu, req.delta);
  const chains = positiveInteger(req.chains ?? 1, 'chains'), steps = positiveInteger(req.steps ?? 200, 'steps', 0);
  const bins = positiveInteger(req.bins ?? 32, 'bins', chains > 1 ? 1 : 2);
  const thermalise = positiveInteger(req.thermalise ?? 100, 'thermalise', 0);
  const perStep = Math.ceil(positiveInteger(req.sweepsPerStep ?? 200, 'sweeps-per-step') / chains);
  const perChain = bins * Math.ceil(positiveInteger(req.sweeps ?? 8192, 'sweeps') / (chains * bins));
  const eta = requireFinite(req.learningRate ?? 0.05, 'learning-rate'), shift = requireFinite(req.shift ?? 1e-3, 'shift');
  // A step -eta (S + shift)^-1 F with eta <= 0 climbs the energy or stands still; shift < 0 can make S singular.
  if (!(eta > 0)) throw new InputError(`learning-rate must be > 0, got ${eta}`, 'learning-rate');
  if (!(shift >= 0)) throw new InputError(`shift must be >= 0, got ${shift}`, 'shift');
  const beta = requireFinite(req.alphaMixing ?? 0.5, 'alpha-mixing');
  const exchange = requireFinite(req.exchange ?? 0.25, 'exchange');
  if (!(exchange >= 0 && exchange <= 1)) throw new InputError(`exchange must be a fraction in [0, 1], got ${exchange}`, 'exchange');
  return { mu, gap, selfConsistent: req.alpha === undefined, chains, steps, bins, thermalise, perStep, perChain, eta, shift, beta, exchange };
}
