/**
 * Quantum Monte Carlo of the emitters with the cavity field, as a generator of batches of
 * independent chains (so a pool can run each batch in parallel) that returns the result:
 *
 * 1. the alpha grid (one point when alpha is fixed) at beta = 1/T, or in the ground-state
 *    mode at beta = 4, 8, 16, ... until every point's energy changes by less than twice its
 *    combined error (or beta reaches its limit: then the result says it is unconverged);
 * 2. self-consistent: f(alpha) from the grid, a finer grid around its global minimum, the
 *    stationary alpha* of that basin (free-energy-scan.ts);
 * 3. the measurement at alpha*.
 *
 * Every chain's seed is derived from the run's seed, the stage and the chain index, so the
 * result depends on the seed and the chain count only, not on which worker ran what.
 */
import { InputError } from '../input-error.ts';
import type { Estimate } from '../vmc/binning.ts';
import { type QmcGeometry, qmcGeometry } from './qmc-geometry.ts';
import { type QmcRequest, type ResolvedQmcRequest, QMC_LIMITS, resolveQmcRequest } from './qmc-request.ts';
import { type SseChainRequest, type SseChainResult, runSseChain } from './sse-chain.ts';
import { sseTerms } from './sse-terms.ts';
import { type ChainEstimates, chainEstimates } from './qmc-estimates.ts';
import {
  type AlphaScanPoint, alphaGrid, freeEnergyCurve, globalMinimum, localMinima, refinementGrid, resolvedMinimum,
  stationaryAlpha, unresolvedRange, condensateThreshold,
} from './free-energy-scan.ts';
import { type QmcResult, qmcPhase } from './qmc-result.ts';

export type { QmcRequest } from './qmc-request.ts';
export type { QmcResult } from './qmc-result.ts';

export interface QmcBatch {
  stage: 'grid' | 'refine' | 'measure';
  beta: number;
  requests: SseChainRequest[];
}

/** Points of the refinement grid around the global minimum. */
const REFINE_POINTS = 6;
/** First beta of the ground-state mode. */
const GROUND_BETA0 = 4;

/** The run as batches of chains; send each batch's results back into the generator. */
export function* qmcBatches(req: QmcRequest, geometry?: QmcGeometry): Generator<QmcBatch, QmcResult, SseChainResult[]> {
  const r = resolveQmcRequest(req);
  const g = geometry ?? qmcGeometry(r.cluster);
  const notes: string[] = [];
  const om = r.orderMomentum;
  if (om && !Array.from({ length: g.momenta.length / 2 }, (_, q) => q).some((q) => g.momentumLabels[2 * q] === om[0] && g.momentumLabels[2 * q + 1] === om[1])) {
    throw new InputError(`order momentum (${om.join(', ')}) is not a momentum of this cluster (labels m run over (-L/2, L/2] along each axis)`, 'order');
  }
  const alphas = r.alpha !== null ? [r.alpha] : alphaGrid(r.delta!, r.mu, r.alphaPoints);
  checkMemory(r, g, Math.max(...alphas), r.ground ? QMC_LIMITS.groundBeta : 1 / r.temperature!);
  let tag = 0;
  const batch = (stage: QmcBatch['stage'], beta: number, as: number[]): QmcBatch => ({
    stage, beta,
    requests: as.flatMap((alpha) => {
      const seed = `${r.seed}/${stage}/${tag++}`;
      return Array.from({ length: r.chains }, (_, chain) => ({
        cluster: r.cluster, mu: r.mu, alpha, beta, thermalization: r.thermalization, sweeps: r.sweeps, bins: r.bins, seed, chain,
      }));
    }),
  });
  const split = (as: number[], beta: number, res: SseChainResult[]): ChainEstimates[] =>
    as.map((_, a) => chainEstimates(g, beta, res.slice(a * r.chains, (a + 1) * r.chains), r.orderMomentum ?? undefined));

  // 1. The grid at the temperature, or with beta doubled until converged.
  let beta = r.ground ? GROUND_BETA0 : 1 / r.temperature!;
  let grid = split(alphas, beta, yield batch('grid', beta, alphas));
  let ground: QmcResult['ground'] = null;
  if (r.ground) {
    ground = { betas: [beta], energies: [grid[0].energyPerSite], converged: false };
    while (!ground.converged && 2 * beta <= QMC_LIMITS.groundBeta) {
      beta *= 2;
      const next = split(alphas, beta, yield batch('grid', beta, alphas));
      ground.converged = next.every((e, a) => Math.abs(e.energyPerSite.value - grid[a].energyPerSite.value) <= 2 * Math.hypot(e.energyPerSite.error, grid[a].energyPerSite.error));
      grid = next;
      ground.betas.push(beta); ground.energies.push(grid[0].energyPerSite);
    }
    if (!ground.converged) notes.push(`ground state not reached: the energy still changed between beta = ${beta / 2} and ${beta}; the result is at T = ${1 / beta}`);
  }

  // 2. Self-consistent alpha.
  let alpha = alphas[0], alphaError = 0, final = grid[0], alphaScan: AlphaScanPoint[] | null = null;
  const delta = r.delta;
  if (r.alpha === null && delta !== null) {
    const pts = alphas.map((a, k) => ({ alpha: a, sigmaX: grid[k].sigmaX }));
    let curve = freeEnergyCurve(delta, r.mu, pts);
    const refine = refinementGrid(curve, globalMinimum(curve), REFINE_POINTS);
    if (refine.length) {
      const fine = split(refine, beta, yield batch('refine', beta, refine));
      curve = freeEnergyCurve(delta, r.mu, [...pts, ...refine.map((a, k) => ({ alpha: a, sigmaX: fine[k].sigmaX }))]);
    }
    const best = resolvedMinimum(curve);
    alpha = stationaryAlpha(delta, r.mu, curve, best);
    alphaError = best > 0 ? alphaUncertainty(delta, r.mu, curve, best) : unresolvedRange(curve);
    if (best === 0 && globalMinimum(curve) > 0) {
      notes.push(`the lowest f(alpha) on the grid (alpha = ${fmt(curve[globalMinimum(curve)].alpha)}) is not significantly below f(0): alpha = 0 is kept, and alpha up to ${fmt(alphaError)} is not excluded`);
    }
    alphaScan = curve;
    const minima = localMinima(curve);
    if (minima.length > 1) {
      const [a, b] = [...minima].sort((x, y) => x.f.value - y.f.value);
      if (b.f.value - a.f.value < 2 * Math.hypot(a.f.error, b.f.error)) notes.push(`two minima of f(alpha) compete within errors (alpha = ${fmt(a.alpha)} and ${fmt(b.alpha)}): near a first-order line`);
    }
    final = split([alpha], beta, yield batch('measure', beta, [alpha]))[0];
  }
  const threshold = alphaScan && delta !== null ? condensateThreshold(delta, r.mu, alphaScan) : null;
  return { ...assemble(r, g, beta, alpha, alphaError, final, ground, alphaScan, notes), condensateThreshold: threshold };
}

/** Run every chain in this thread (tests, the CLI's single-thread mode). */
export function quantumMonteCarlo(req: QmcRequest, geometry?: QmcGeometry): QmcResult {
  const g = geometry ?? qmcGeometry(req.cluster);
  const gen = qmcBatches(req, g);
  let next = gen.next();
  while (!next.done) next = gen.next(next.value.requests.map((c) => runSseChain(c, g)));
  return next.value;
}

/** Refuse a run whose operator string would not fit in memory. */
function checkMemory(r: ResolvedQmcRequest, g: QmcGeometry, alphaMax: number, betaMax: number): void {
  const t = sseTerms(g.couplings, r.mu, alphaMax);
  const slots = 1.4 * betaMax * (t.constWeight + t.bondWeight + t.fieldWeight);
  if (slots > QMC_LIMITS.slots) {
    throw new InputError(`${g.N} sites at beta = ${betaMax} need about ${slots.toExponential(1)} operator slots, above the limit of ${QMC_LIMITS.slots.toExponential(0)}: use a smaller cluster or a higher temperature`, 'size');
  }
}

/** Error of alpha* from the error of <sigma^x> and the slope of D = 2 (delta - mu) alpha - <sigma^x>. */
function alphaUncertainty(delta: number, mu: number, curve: AlphaScanPoint[], g: number): number {
  if (g === 0 || g + 1 >= curve.length) return 0;
  const a = curve[g - 1], b = curve[g + 1];
  const slope = 2 * (delta - mu) - (b.sigmaX.value - a.sigmaX.value) / (b.alpha - a.alpha);
  const e = curve[g].sigmaX.error;
  return slope > 0 ? Math.min(e / slope, b.alpha - a.alpha) : b.alpha - a.alpha;
}

function fmt(x: number): string {
  return x.toPrecision(4);
}

function assemble(
  r: ResolvedQmcRequest, g: QmcGeometry, beta: number, alpha: number, alphaError: number, est: ChainEstimates,
  ground: QmcResult['ground'], alphaScan: AlphaScanPoint[] | null, notes: string[],
): QmcResult {
  const H = est.energyPerSite;
  const sc = alphaScan !== null && r.delta !== null;
  const energy: Estimate = sc ? { value: (r.delta! - r.mu) * alpha * alpha + H.value, error: H.error } : H;
  const realOrder = est.orderParameter !== null && g.torus !== null
    && (2 * est.orderParameter.m[0]) % g.torus.Lx === 0 && (2 * est.orderParameter.m[1]) % g.torus.Ly === 0;
  for (const [name, d] of Object.entries(est.drift)) {
    if (Math.abs(d.sigmas) > 4) notes.push(`${name} drifts by ${d.sigmas.toFixed(1)} sigma between the halves of the run: not equilibrated, raise the sweeps`);
  }
  if (r.chains === 1) notes.push('one chain: a mode it never leaves (a crystal orientation under strong blockade) cannot show in its error bars; run two or more chains');
  if (est.binningGrowth) {
    const slow = Object.entries(est.binningGrowth).filter(([, v]) => v > 1.5).map(([k, v]) => `${k} (x${v.toFixed(1)})`);
    if (slow.length) notes.push(`error bars still grow with bin length for ${slow.join(', ')}: the chain has not sampled its slowest mode often enough; run more chains or sweeps`);
  }
  const binSweeps = Math.floor(r.sweeps / r.bins);
  const tauMax = Math.max(est.autocorrelation.energy, est.autocorrelation.density, est.autocorrelation.sigmaX);
  if (tauMax > binSweeps / 4) notes.push(`autocorrelation time ${tauMax.toFixed(0)} sweeps is not short against the bins of ${binSweeps} sweeps: error bars are underestimated, raise the sweeps`);
  if (g.torus && g.torus.Ly === 1 && !r.ground) notes.push('in 1D no density wave survives at T > 0 in the infinite chain; order on a finite ring means its correlation length exceeds the ring');
  notes.push(`finite cluster of ${g.N} sites: the phase label is a finite-size crossover; locate transitions from Binder crossings over several sizes`);
  return {
    ...est, method: 'qmc', sites: g.N, clusterKind: g.kind, mu: r.mu, delta: r.delta, temperature: r.ground ? null : r.temperature,
    beta, ground, selfConsistent: sc,
    alpha: { value: alpha, error: alphaError },
    photonDensity: { value: alpha * alpha, error: 2 * alpha * alphaError },
    energyPerSite: energy, hamiltonianPerSite: H,
    alphaScan, minima: alphaScan ? localMinima(alphaScan) : null,
    phase: qmcPhase(alpha, est.density.value, est.binder, realOrder),
    chains: r.chains, sweeps: r.sweeps, thermalization: r.thermalization, notes,
  };
}
