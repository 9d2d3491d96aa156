/**
 * A quantum Monte Carlo run as plain data (crosses to a worker, printed by the CLI), with
 * its defaults and the refusals of bad input. The photon amplitude is either fixed
 * (`alpha`) or found from the detuning (`delta`): f(alpha) minimised over a grid
 * (free-energy-scan.ts). `temperature` T > 0 sets beta = 1/T; `ground` instead doubles beta
 * until the energy stops changing within its error.
 */
import { InputError, requireFinite } from '../input-error.ts';
import type { ClusterSpec } from '../cluster/spec.ts';

export interface QmcRequest {
  cluster: ClusterSpec;
  mu: number;
  /** Temperature in units of g (T > 0), unless `ground`. */
  temperature?: number;
  /** Ground-state mode: beta = 4, 8, 16, ... until the energy per site is converged. */
  ground?: boolean;
  /** Fixed photon amplitude alpha >= 0. */
  alpha?: number;
  /** Cavity detuning: alpha from the global minimum of f(alpha). */
  delta?: number;
  /** Measurement sweeps per chain (default 4000) and thermalisation sweeps (default a quarter). */
  sweeps?: number;
  thermalization?: number;
  /** Bins per chain (default 32). */
  bins?: number;
  /** Independent chains (default 1; the pool runs one a worker). */
  chains?: number;
  seed?: number;
  /** Points of the coarse alpha grid when self-consistent (default 16). */
  alphaPoints?: number;
  /** Integer label (m1, m2) of the momentum whose order parameter and Binder cumulant to report. */
  orderMomentum?: [number, number];
}

export const QMC_DEFAULTS = { sweeps: 4000, bins: 32, chains: 1, seed: 1, alphaPoints: 16 } as const;
/** Limits that keep every run bounded. */
export const QMC_LIMITS = { sweeps: 1e7, chains: 256, alphaPoints: 64, bins: 1024, slots: 2e7, groundBeta: 4096 } as const;

export interface ResolvedQmcRequest extends Required<Omit<QmcRequest, 'temperature' | 'alpha' | 'delta' | 'orderMomentum' | 'ground'>> {
  ground: boolean;
  temperature: number | null;
  alpha: number | null;
  delta: number | null;
  orderMomentum: [number, number] | null;
}

function integerIn(x: number, lo: number, hi: number, field: string): number {
  if (!Number.isInteger(x) || x < lo || x > hi) throw new InputError(`${field} must be an integer from ${lo} to ${hi}, got ${x}`, field);
  return x;
}

/** Fill defaults and refuse bad input with an InputError naming the field. */
export function resolveQmcRequest(req: QmcRequest): ResolvedQmcRequest {
  const mu = requireFinite(req.mu, 'mu');
  const ground = req.ground === true;
  let temperature: number | null = null;
  if (!ground) {
    if (req.temperature === undefined) throw new InputError('give a temperature T > 0, or ask for the ground state', 'temperature');
    temperature = requireFinite(req.temperature, 'temperature');
    if (!(temperature > 0)) throw new InputError(`temperature must be > 0 (T = 0 is the ground-state mode), got ${temperature}`, 'temperature');
    if (1 / temperature > QMC_LIMITS.groundBeta) throw new InputError(`temperature ${temperature} is below the lowest this Monte Carlo reaches, 1/${QMC_LIMITS.groundBeta}; use the ground-state mode`, 'temperature');
  }
  if (req.alpha === undefined && req.delta === undefined) {
    throw new InputError('give alpha (a fixed photon amplitude) or the detuning (alpha found self-consistently)', 'alpha');
  }
  let alpha: number | null = null, delta: number | null = null;
  if (req.alpha !== undefined) {
    alpha = requireFinite(req.alpha, 'alpha');
    if (alpha < 0) throw new InputError(`alpha must be >= 0, got ${alpha}`, 'alpha');
  }
  if (req.delta !== undefined) {
    delta = requireFinite(req.delta, 'detuning');
    if (mu >= delta) throw new InputError(`mu = ${mu} must be below the detuning ${delta}: for mu >= delta the photon number is unbounded`, 'mu');
  }
  const sweeps = integerIn(req.sweeps ?? QMC_DEFAULTS.sweeps, 16, QMC_LIMITS.sweeps, 'sweeps');
  const bins = integerIn(req.bins ?? QMC_DEFAULTS.bins, 4, QMC_LIMITS.bins, 'bins');
  if (sweeps < 2 * bins) throw new InputError(`sweeps (${sweeps}) must be at least twice the bins (${bins})`, 'sweeps');
  const thermalization = integerIn(req.thermalization ?? Math.max(100, Math.floor(sweeps / 4)), 0, QMC_LIMITS.sweeps, 'thermalization');
  const chains = integerIn(req.chains ?? QMC_DEFAULTS.chains, 1, QMC_LIMITS.chains, 'chains');
  const seed = requireFinite(req.seed ?? QMC_DEFAULTS.seed, 'seed');
  const alphaPoints = integerIn(req.alphaPoints ?? QMC_DEFAULTS.alphaPoints, 4, QMC_LIMITS.alphaPoints, 'alphaPoints');
  const om = req.orderMomentum;
  if (om !== undefined && (om.length !== 2 || !om.every(Number.isInteger))) throw new InputError('order momentum must be two integer labels m1,m2', 'order');
  return { cluster: req.cluster, mu, ground, temperature, alpha, delta, sweeps, bins, thermalization, chains, seed, alphaPoints, orderMomentum: om ?? null };
}
