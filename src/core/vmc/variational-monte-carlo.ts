/**
 * Variational Monte Carlo at T = 0 with a coherent photon: optimise the Jastrow
 * wavefunction (and, with a detuning and no fixed alpha, the photon amplitude) by stochastic
 * reconfiguration, then measure. Energy per site
 *   e = (delta - mu) alpha^2 + <H(alpha)>/N      (self-consistent alpha),
 *   <H(alpha)>/N                                 (fixed alpha),
 * an upper bound of the exact ground energy on the same cluster (variational principle).
 *
 * alpha follows the Hellmann-Feynman gradient de/dalpha = 2 (delta - mu) alpha - <sigma^x>
 * (mean over sites) with step beta / (2 (delta - mu)):
 *   alpha <- (1 - beta) alpha + beta <sigma^x> / (2 (delta - mu)),
 * exact at beta = 1 for a fixed wavefunction, where e is quadratic in alpha. The parameters
 * measured are the average over the last quarter of the optimisation.
 *
 * Metropolis proposals are single flips and, a fraction `exchange` of them, nearest-neighbour
 * exchanges (markov-chain.ts); without them a 2D crystal can freeze in a wrong pattern of the
 * right density (4x4 vdw torus at alpha = 0: 3-10% above ED with none, 0.3-3% with 0.25).
 *
 * C chains (one per worker) run in lockstep: each step every chain samples its share of the
 * sweeps with the same parameters and the sums are merged in chain order, so the seed and C
 * fix the result bit for bit whichever worker runs which segment. `run` executes a batch of
 * segments (in a worker pool, or in-process with localSegmentRunner).
 */
import { InputError, requireFinite } from '../input-error.ts';
import type { ClusterSpec } from '../cluster/spec.ts';
import type { AnsatzSpec } from './ansatz.ts';
import { initialParameters } from './ansatz.ts';
import { type ChainState, type SegmentRequest, type SegmentResult, type VmcProblem, runSegment, vmcSystem, type VmcSystem } from './segment.ts';
import { reconfigurationStep } from './reconfiguration.ts';
import { measuredObservables } from './measured-observables.ts';
import { type VmcResult, vmcResult } from './vmc-result.ts';

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

export type SegmentRunner = (reqs: SegmentRequest[]) => Promise<SegmentResult[]>;

/** Runs segments in this thread, building each problem's system once. */
export function localSegmentRunner(): SegmentRunner {
  const cache = new Map<string, VmcSystem>();
  return async (reqs) => reqs.map((r) => runSegment(cachedSystem(cache, r.problem), r));
}

/** The system of a problem from a cache keyed by its JSON (used by workers as well). */
export function cachedSystem(cache: Map<string, VmcSystem>, p: VmcProblem): VmcSystem {
  const key = JSON.stringify(p);
  let sys = cache.get(key);
  if (!sys) { cache.clear(); sys = vmcSystem(p); cache.set(key, sys); }
  return sys;
}

function positiveInteger(x: number, field: string, min = 1): number {
  if (!Number.isInteger(x) || x < min) throw new InputError(`${field} must be an integer >= ${min}, got ${x}`, field);
  return x;
}

/**
 * Optimise and measure; `onProgress(done, total)` after every batch of segments, and
 * `onStep(entry)` with each optimisation step's trace entry as it is made (a live trace).
 */
export async function variationalMonteCarlo(
  req: VmcRequest, run: SegmentRunner, onProgress?: (done: number, total: number) => void,
  onStep?: (entry: VmcResult['trace'][number]) => void,
): Promise<VmcResult> {
  const mu = requireFinite(req.mu, 'mu');
  if (req.alpha === undefined && req.delta === undefined) {
    throw new InputError('give alpha (a fixed photon amplitude) or the detuning (alpha optimised)', 'alpha');
  }
  if (req.alpha !== undefined && (requireFinite(req.alpha, 'alpha') < 0)) throw new InputError(`alpha must be >= 0, got ${req.alpha}`, 'alpha');
  const gap = req.delta === undefined ? null : requireFinite(req.delta, 'detuning') - mu;
  if (gap !== null && !(gap > 0)) {
    throw new InputError(`mu = ${mu} must be below the detuning ${req.delta}: for mu >= delta the photon number is unbounded`, 'mu');
  }
  const chains = positiveInteger(req.chains ?? 1, 'chains'), steps = positiveInteger(req.steps ?? 200, 'steps', 0);
  const bins = positiveInteger(req.bins ?? 32, 'bins', chains > 1 ? 1 : 2);
  const thermalise = positiveInteger(req.thermalise ?? 100, 'thermalise', 0);
  const perStep = Math.ceil(positiveInteger(req.sweepsPerStep ?? 200, 'sweeps-per-step') / chains);
  const perChain = bins * Math.ceil(positiveInteger(req.sweeps ?? 8192, 'sweeps') / (chains * bins));
  const eta = requireFinite(req.learningRate ?? 0.05, 'learning-rate'), shift = requireFinite(req.shift ?? 1e-3, 'shift');
  const beta = requireFinite(req.alphaMixing ?? 0.5, 'alpha-mixing');
  const exchange = requireFinite(req.exchange ?? 0.25, 'exchange');
  if (!(exchange >= 0 && exchange <= 1)) throw new InputError(`exchange must be a fraction in [0, 1], got ${exchange}`, 'exchange');
  const problem: VmcProblem = { cluster: req.cluster, mu, ansatz: req.ansatz ?? {} };
  const sys = vmcSystem(problem);
  const N = sys.cluster.N;
  const selfConsistent = req.alpha === undefined;
  let alpha = selfConsistent ? 0.25 / (gap as number) : (req.alpha as number);
  let theta = initialParameters(sys.ansatz, mu, alpha);
  let states: (ChainState | null)[] = Array(chains).fill(null);
  const window = Math.max(1, Math.floor(steps / 4));
  const thetaSum = new Float64Array(theta.length);
  let alphaSum = 0, alphaSq = 0;
  const trace: VmcResult['trace'] = [];
  const batch = (mode: 'optimise' | 'measure', discard: number, sweeps: number): SegmentRequest[] =>
    states.map((state, chain) => ({ problem, seed: req.seed, chain, state, theta, alpha, discard, sweeps, mode, bins: mode === 'measure' ? bins : undefined, exchange }));
  for (let step = 0; step < steps; step++) {
    const res = sortByChain(await run(batch('optimise', step === 0 ? thermalise : 0, perStep)));
    states = res.map((r) => r.state);
    const sr = reconfigurationStep(res.map((r) => r.optimise!), N, eta, shift);
    const photon = gap === null ? 0 : gap * alpha * alpha;
    trace.push({ step, energyPerSite: photon + sr.energy / N, error: sr.energyError / N, alpha, acceptance: acceptance(res) });
    onStep?.(trace[trace.length - 1]);
    theta = theta.map((t, k) => t + sr.delta[k]);
    if (selfConsistent) alpha = Math.max(0, (1 - beta) * alpha + (beta * sr.sigmaX) / (2 * (gap as number)));
    if (step >= steps - window) {
      for (let k = 0; k < theta.length; k++) thetaSum[k] += theta[k];
      alphaSum += alpha; alphaSq += alpha * alpha;
    }
    onProgress?.(step + 1, steps + 1);
  }
  if (steps > 0) {
    theta = thetaSum.map((t) => t / Math.min(window, steps));
    if (selfConsistent) alpha = alphaSum / Math.min(window, steps);
  }
  const alphaSpread = selfConsistent && steps > 1
    ? Math.sqrt(Math.max(0, alphaSq / Math.min(window, steps) - alpha * alpha) / Math.min(window, steps)) : 0;
  const res = sortByChain(await run(batch('measure', thermalise, perChain)));
  onProgress?.(steps + 1, steps + 1);
  const obs = measuredObservables(sys.cluster, res.map((r) => r.measure!));
  return vmcResult({ sys, req, obs, theta, alpha, alphaError: alphaSpread, gap, chains, acceptance: acceptance(res), trace });
}

function sortByChain(res: SegmentResult[]): SegmentResult[] {
  return [...res].sort((a, b) => a.chain - b.chain);
}

function acceptance(res: SegmentResult[]): number {
  let a = 0, t = 0;
  for (const r of res) { a += r.accepted; t += r.attempted; }
  return t ? a / t : 0;
}
