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
 * C chains run in lockstep: each step every chain samples its share of the sweeps with the
 * same parameters and the sums are merged in chain order, so the seed and C fix the result
 * bit for bit whichever worker runs which segment. The run is a generator of segment
 * batches (`vmcBatches`), pure and synchronous: whoever drives it runs the segments, in this
 * thread (`variationalMonteCarlo`) or on a worker pool (workers/vmc-chains.ts).
 */
import { initialParameters } from './ansatz.ts';
import { type ChainState, type SegmentRequest, type SegmentResult, type VmcProblem, runSegment, vmcSystem, type VmcSystem } from './segment.ts';
import { reconfigurationStep } from './reconfiguration.ts';
import { measuredObservables } from './measured-observables.ts';
import { type VmcResult, vmcResult } from './vmc-result.ts';
import { type VmcRequest, vmcSettings } from './vmc-request.ts';

export type { VmcRequest } from './vmc-request.ts';

export type TraceEntry = VmcResult['trace'][number];

/** One batch of segments to run (one per chain), with the progress so far. */
export interface VmcBatch {
  requests: SegmentRequest[];
  /** Batches finished before this one, out of `total` (optimisation steps + measurement). */
  done: number;
  total: number;
  /** Trace entry of the optimisation step just finished (for a live trace). */
  step?: TraceEntry;
}

/** Progress hooks of a driver: `onProgress(done, total)` per batch, `onStep` per SR step. */
export interface VmcHooks {
  onProgress?: (done: number, total: number) => void;
  onStep?: (entry: TraceEntry) => void;
}

/**
 * The run as a generator: it yields each batch of segments and expects their results (in
 * any order) back from `next`; it returns the result. Input is validated at the first `next`.
 */
export function* vmcBatches(req: VmcRequest): Generator<VmcBatch, VmcResult, SegmentResult[]> {
  const set = vmcSettings(req);
  const { mu, gap, steps, chains } = set;
  const problem: VmcProblem = { cluster: req.cluster, mu, ansatz: req.ansatz ?? {} };
  const sys = vmcSystem(problem);
  const N = sys.cluster.N;
  let alpha = set.selfConsistent ? 0.25 / (gap as number) : (req.alpha as number);
  let theta = initialParameters(sys.ansatz, mu, alpha);
  let states: (ChainState | null)[] = Array(chains).fill(null);
  const tail = Math.max(1, Math.floor(steps / 4));
  const thetaSum = new Float64Array(theta.length);
  let alphaSum = 0, alphaSq = 0;
  const trace: TraceEntry[] = [];
  const batch = (mode: 'optimise' | 'measure', discard: number, sweeps: number): SegmentRequest[] =>
    states.map((state, chain) => ({
      problem, seed: req.seed, chain, state, theta, alpha, discard, sweeps, mode,
      bins: mode === 'measure' ? set.bins : undefined, exchange: set.exchange,
    }));
  for (let step = 0; step < steps; step++) {
    const requests = batch('optimise', step === 0 ? set.thermalise : 0, set.perStep);
    const res = sortByChain(yield { requests, done: step, total: steps + 1, step: trace[trace.length - 1] });
    states = res.map((r) => r.state);
    const sr = reconfigurationStep(res.map((r) => r.optimise!), N, set.eta, set.shift);
    const photon = gap === null ? 0 : gap * alpha * alpha;
    trace.push({ step, energyPerSite: photon + sr.energy / N, error: sr.energyError / N, alpha, acceptance: acceptance(res) });
    theta = theta.map((t, k) => t + sr.delta[k]);
    if (set.selfConsistent) alpha = Math.max(0, (1 - set.beta) * alpha + (set.beta * sr.sigmaX) / (2 * (gap as number)));
    if (step >= steps - tail) {
      for (let k = 0; k < theta.length; k++) thetaSum[k] += theta[k];
      alphaSum += alpha; alphaSq += alpha * alpha;
    }
  }
  const averaged = Math.min(tail, steps);
  if (steps > 0) {
    theta = thetaSum.map((t) => t / averaged);
    if (set.selfConsistent) alpha = alphaSum / averaged;
  }
  const alphaSpread = set.selfConsistent && steps > 1
    ? Math.sqrt(Math.max(0, alphaSq / averaged - alpha * alpha) / averaged) : 0;
  const requests = batch('measure', set.thermalise, set.perChain);
  const res = sortByChain(yield { requests, done: steps, total: steps + 1, step: trace[trace.length - 1] });
  const obs = measuredObservables(sys.cluster, res.map((r) => r.measure!));
  return vmcResult({ sys, req, set, obs, theta, alpha, alphaError: alphaSpread, acceptance: acceptance(res), trace });
}

/** Report a batch to the hooks (shared by every driver of vmcBatches). */
export function reportBatch(b: VmcBatch, hooks: VmcHooks): void {
  if (b.step) hooks.onStep?.(b.step);
  if (b.done > 0) hooks.onProgress?.(b.done, b.total);
}

/**
 * Run in this thread. `run` executes a batch (default: each segment here, with each
 * problem's system built once); a test may pass one that reorders segments, as a pool might.
 */
export function variationalMonteCarlo(
  req: VmcRequest, hooks: VmcHooks & { run?: (reqs: SegmentRequest[]) => SegmentResult[] } = {},
): VmcResult {
  const cache = new Map<string, VmcSystem>();
  const run = hooks.run ?? ((reqs: SegmentRequest[]) => reqs.map((r) => runSegment(cachedSystem(cache, r.problem), r)));
  const gen = vmcBatches(req);
  let next = gen.next();
  let total = 1;
  while (!next.done) {
    reportBatch(next.value, hooks);
    total = next.value.total;
    next = gen.next(run(next.value.requests));
  }
  hooks.onProgress?.(total, total);
  return next.value;
}

/** The system of a problem from a one-entry cache keyed by its JSON (the worker keeps one too). */
export function cachedSystem(cache: Map<string, VmcSystem>, p: VmcProblem): VmcSystem {
  const key = JSON.stringify(p);
  let sys = cache.get(key);
  if (!sys) { cache.clear(); sys = vmcSystem(p); cache.set(key, sys); }
  return sys;
}

function sortByChain(res: SegmentResult[]): SegmentResult[] {
  return [...res].sort((a, b) => a.chain - b.chain);
}

function acceptance(res: SegmentResult[]): number {
  let a = 0, t = 0;
  for (const r of res) { a += r.accepted; t += r.attempted; }
  return t ? a / t : 0;
}
