/**
 * One Markov chain of stochastic series expansion for H(alpha) at inverse temperature beta:
 * a sweep is a diagonal update, the multibranch cluster update (alpha > 0) and the line
 * updates; the expansion cutoff L grows whenever the operators fill more than 3/4 of it (the
 * expansion truncated at L is exact while n never reaches L, so growing it never biases,
 * and a short thermalisation cannot leave it too small). The scalar estimators are
 * read after every sweep, the density Fourier components (O(N (Lx + Ly)) each) every
 * `fourierInterval` sweeps, chosen so that they cost at most about a quarter of the sweeps;
 * both are averaged in `bins` consecutive bins, the raw material of binning errors and
 * jackknife estimates (qmc-estimates.ts). A chain is fixed by its seed and chain
 * index (seedrandom's Alea stream) and runs the same on any worker.
 */
import { sweepStream } from './xoshiro-stream.ts';
import type { ClusterSpec } from '../cluster/spec.ts';
import { type QmcGeometry } from './qmc-geometry.ts';
import { densityFourier, type DensityFourier } from './density-fourier.ts';
import { sseTerms } from './sse-terms.ts';
import { adjustCutoff, diagonalUpdate, emptyConfig } from './operator-string.ts';
import { linkVertices, readBackState, vertexLinks } from './vertex-links.ts';
import { clusterScratch, clusterUpdate } from './cluster-update.ts';
import { lineScratch, lineUpdate } from './line-update.ts';
import { sampleConfig } from './sse-sample.ts';
import { diagonalEnergy } from './diagonal-energy.ts';

/**
 * Scalars binned per sample, in this order. The energy E_diag/N - n_flip/(beta N)
 * (diagonal-energy.ts) is sampled with the Fourier components, the rest every sweep.
 */
export const SCALARS = ['energy', 'density', 'sigmaX', 'kubo', 'number'] as const;
const NS = SCALARS.length;

export interface SseChainRequest {
  cluster: ClusterSpec;
  mu: number;
  alpha: number;
  beta: number;
  thermalization: number;
  sweeps: number;
  bins: number;
  seed: number | string;
  /** Chain index: chains of one seed draw independent streams. */
  chain: number;
}

export interface SseChainResult {
  bins: number;
  /** Samples (sweeps) per bin. */
  binSize: number;
  /** Bin means of the scalars at [b * 5 + s] (SCALARS order). */
  scalars: Float64Array;
  /** Sum over every sample of each scalar squared (for tau_int). */
  squares: Float64Array;
  /** Samples of the energy (every fourierInterval sweeps) and of the other scalars. */
  energySamples: number;
  samples: number;
  /** Bin means of Re n_k, Im n_k, |n_k|^2, |n_k|^4 at [b * K + q]. */
  nkRe: Float64Array;
  nkIm: Float64Array;
  nk2: Float64Array;
  nk4: Float64Array;
  /** Arrays: bin means of n_i at [b * N + i] and of sum_{pairs in shell} n_i n_j at [b * S + s]. */
  sites: Float64Array | null;
  shellSums: Float64Array | null;
  /** Sweeps between density Fourier measurements. */
  fourierInterval: number;
  /** Expansion cutoff reached and mean operator count. */
  cutoff: number;
  meanOperators: number;
}

export interface SseChainHooks {
  /** Called every `every` sweeps with (sweeps done, total sweeps). */
  onProgress?: (done: number, total: number) => void;
}

/**
 * Thermalisation by annealing: beta / 2^m, ..., beta / 2, beta, from beta_0 <= 1 / (weight
 * per site) (where defects of a random start heal at once) up to beta, a share of the
 * sweeps each and the last half at beta itself. A string at beta' stays a valid start at
 * 2 beta' (the diagonal update rescales n). Without it, domain walls of a random start
 * coarsen only diffusively (~L^2 sweeps) at low T and bias every estimate.
 */
function annealing(beta: number, weight: number, sweeps: number): { beta: number; sweeps: number }[] {
  const beta0 = Math.min(beta, 1 / Math.max(weight, 1e-300));
  const m = Math.min(30, Math.max(0, Math.ceil(Math.log2(beta / beta0))));
  const each = m > 0 ? Math.floor(sweeps / (2 * m)) : 0;
  const out = Array.from({ length: m }, (_, k) => ({ beta: beta / 2 ** (m - k), sweeps: each }));
  out.push({ beta, sweeps: sweeps - m * each });
  return out;
}

/** Run one chain on a built geometry (`fourier` may be passed in to reuse its tables). */
export function runSseChain(req: SseChainRequest, g: QmcGeometry, hooks: SseChainHooks = {}, fourier: DensityFourier = densityFourier(g)): SseChainResult {
  const { beta, alpha, bins } = req;
  const N = g.N, K = fourier.K;
  const rng = sweepStream(req.seed, req.chain);
  const terms = sseTerms(g.couplings, req.mu, alpha);
  const state = new Uint8Array(N);
  for (let i = 0; i < N; i++) state[i] = rng() < 0.5 ? 1 : 0;
  const total = terms.constWeight + terms.bondWeight + terms.fieldWeight;
  const schedule = annealing(beta, total, req.thermalization);
  const cfg = emptyConfig(state, Math.max(32, Math.ceil(1.25 * schedule[0].beta * total)));
  const links = vertexLinks(N, cfg.L), cs = clusterScratch(cfg.L), ls = lineScratch(64);
  // A sweep measures between its diagonal and off-diagonal halves, on the linked string.
  let measure: (() => void) | null = null;
  let b = beta;
  const sweep = () => {
    diagonalUpdate(cfg, terms, b, rng);
    linkVertices(cfg, links);
    if (measure) measure();
    if (alpha > 0) clusterUpdate(cfg, terms, links, cs, rng);
    lineUpdate(cfg, terms, links, ls, rng);
    readBackState(cfg, links);
  };
  const totalSweeps = req.thermalization + req.sweeps;
  const every = Math.max(1, Math.floor(totalSweeps / 50));
  let s = 0;
  for (const stage of schedule) {
    b = stage.beta;
    for (let k = 0; k < stage.sweeps; k++, s++) {
      sweep();
      adjustCutoff(cfg);
      if ((s + 1) % every === 0) hooks.onProgress?.(s + 1, totalSweeps);
    }
  }
  b = beta;
  const binSize = Math.floor(req.sweeps / bins);
  const interval = Math.max(1, Math.min(binSize, Math.ceil(fourier.work / (4 * cfg.L))));
  const out: SseChainResult = {
    bins, binSize, fourierInterval: interval, scalars: new Float64Array(bins * NS), squares: new Float64Array(NS),
    energySamples: bins * Math.ceil(binSize / interval), samples: bins * binSize,
    nkRe: new Float64Array(bins * K), nkIm: new Float64Array(bins * K), nk2: new Float64Array(bins * K), nk4: new Float64Array(bins * K),
    sites: g.kind === 'array' ? new Float64Array(bins * N) : null,
    shellSums: g.kind === 'array' ? new Float64Array(bins * g.shells.length) : null,
    cutoff: cfg.L, meanOperators: 0,
  };
  const re = new Float64Array(K), im = new Float64Array(K), values = new Float64Array(NS);
  const shellOf = g.cluster ? g.cluster.shellOf : null;
  const diag = diagonalEnergy(g, req.mu);
  let operators = 0, bin = 0, inBin = 0;
  measure = () => {
    const x = sampleConfig(links.counts, N, beta, alpha);
    values[1] = x.density; values[2] = x.sigmaX; values[3] = x.kubo; values[4] = x.number;
    for (let v = 1; v < NS; v++) { out.scalars[bin * NS + v] += values[v]; out.squares[v] += values[v] * values[v]; }
    operators += x.operators;
    if (inBin % interval === 0) {
      fourier.transform(cfg.state, re, im);
      const e = diag(cfg.state, re, im) / N - links.counts.flips / (beta * N);
      out.scalars[bin * NS] += e; out.squares[0] += e * e;
      for (let q = 0; q < K; q++) {
        const p2 = re[q] * re[q] + im[q] * im[q];
        out.nkRe[bin * K + q] += re[q]; out.nkIm[bin * K + q] += im[q];
        out.nk2[bin * K + q] += p2; out.nk4[bin * K + q] += p2 * p2;
      }
      if (out.sites && out.shellSums && shellOf) {
        const S = g.shells.length, st = cfg.state;
        for (let i = 0; i < N; i++) {
          if (!st[i]) continue;
          out.sites[bin * N + i] += 1;
          for (let j = 0; j < N; j++) if (j !== i && st[j]) out.shellSums[bin * S + shellOf[i * N + j]] += 1;
        }
      }
    }
  };
  for (bin = 0; bin < bins; bin++) {
    for (inBin = 0; inBin < binSize; inBin++) {
      sweep();
      adjustCutoff(cfg);
      const done = req.thermalization + bin * binSize + inBin + 1;
      if (done % every === 0) hooks.onProgress?.(done, totalSweeps);
    }
  }
  const scale = 1 / binSize, fscale = 1 / Math.ceil(binSize / interval);
  for (let t = 0; t < out.scalars.length; t++) out.scalars[t] *= t % NS === 0 ? fscale : scale;
  for (const a of [out.nkRe, out.nkIm, out.nk2, out.nk4, out.sites, out.shellSums]) if (a) for (let t = 0; t < a.length; t++) a[t] *= fscale;
  out.cutoff = cfg.L;
  out.meanOperators = operators / (bins * binSize);
  return out;
}
