/**
 * One Markov chain of stochastic series expansion for H(alpha) at inverse temperature beta:
 * a sweep is a diagonal update, the multibranch cluster update (alpha > 0) and the line
 * updates; the expansion cutoff grows during thermalisation only. Measurements are taken
 * after every sweep and averaged in `bins` consecutive bins, the raw material of binning
 * errors and jackknife estimates (qmc-estimates.ts). A chain is fixed by its seed and chain
 * index (seedrandom's Alea stream) and runs the same on any worker.
 */
import { chainStream } from '../vmc/random-stream.ts';
import type { ClusterSpec } from '../cluster/spec.ts';
import { type QmcGeometry } from './qmc-geometry.ts';
import { densityFourier, type DensityFourier } from './density-fourier.ts';
import { sseTerms } from './sse-terms.ts';
import { adjustCutoff, diagonalUpdate, emptyConfig } from './operator-string.ts';
import { linkVertices, readBackState, vertexLinks } from './vertex-links.ts';
import { clusterScratch, clusterUpdate } from './cluster-update.ts';
import { lineScratch, lineUpdate } from './line-update.ts';
import { sampleConfig } from './sse-sample.ts';

/** Scalars binned per sample, in this order. */
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
  /** Bin means of Re n_k, Im n_k, |n_k|^2, |n_k|^4 at [b * K + q]. */
  nkRe: Float64Array;
  nkIm: Float64Array;
  nk2: Float64Array;
  nk4: Float64Array;
  /** Arrays: bin means of n_i at [b * N + i] and of sum_{pairs in shell} n_i n_j at [b * S + s]. */
  sites: Float64Array | null;
  shellSums: Float64Array | null;
  /** Expansion cutoff reached and mean operator count. */
  cutoff: number;
  meanOperators: number;
}

export interface SseChainHooks {
  /** Called every `every` sweeps with (sweeps done, total sweeps). */
  onProgress?: (done: number, total: number) => void;
}

/** Run one chain on a built geometry (`fourier` may be passed in to reuse its tables). */
export function runSseChain(req: SseChainRequest, g: QmcGeometry, hooks: SseChainHooks = {}, fourier: DensityFourier = densityFourier(g)): SseChainResult {
  const { beta, alpha, bins } = req;
  const N = g.N, K = fourier.K;
  const rng = chainStream(req.seed, req.chain).next;
  const terms = sseTerms(g.couplings, req.mu, alpha);
  const state = new Uint8Array(N);
  for (let i = 0; i < N; i++) state[i] = rng() < 0.5 ? 1 : 0;
  const total = terms.constWeight + terms.bondWeight + terms.fieldWeight;
  const cfg = emptyConfig(state, Math.max(32, Math.ceil(1.25 * beta * total)));
  const links = vertexLinks(N, cfg.L), cs = clusterScratch(cfg.L), ls = lineScratch(64);
  const scratch = new Uint8Array(N);
  const sweep = () => {
    diagonalUpdate(cfg, terms, beta, rng);
    linkVertices(cfg, links);
    if (alpha > 0) clusterUpdate(cfg, terms, links, cs, rng);
    lineUpdate(cfg, terms, links, ls, rng);
    readBackState(cfg, links);
  };
  const totalSweeps = req.thermalization + req.sweeps;
  const every = Math.max(1, Math.floor(totalSweeps / 50));
  for (let s = 0; s < req.thermalization; s++) {
    sweep();
    adjustCutoff(cfg);
    if ((s + 1) % every === 0) hooks.onProgress?.(s + 1, totalSweeps);
  }
  const binSize = Math.floor(req.sweeps / bins);
  const out: SseChainResult = {
    bins, binSize, scalars: new Float64Array(bins * NS), squares: new Float64Array(NS),
    nkRe: new Float64Array(bins * K), nkIm: new Float64Array(bins * K), nk2: new Float64Array(bins * K), nk4: new Float64Array(bins * K),
    sites: g.kind === 'array' ? new Float64Array(bins * N) : null,
    shellSums: g.kind === 'array' ? new Float64Array(bins * g.shells.length) : null,
    cutoff: cfg.L, meanOperators: 0,
  };
  const re = new Float64Array(K), im = new Float64Array(K);
  const shellOf = g.cluster ? g.cluster.shellOf : null;
  let operators = 0;
  for (let b = 0; b < bins; b++) {
    for (let s = 0; s < binSize; s++) {
      sweep();
      const x = sampleConfig(cfg, terms.E0, beta, alpha, scratch);
      const values = [x.energy, x.density, x.sigmaX, x.kubo, x.number];
      for (let v = 0; v < NS; v++) { out.scalars[b * NS + v] += values[v]; out.squares[v] += values[v] * values[v]; }
      operators += x.operators;
      fourier.transform(cfg.state, re, im);
      for (let q = 0; q < K; q++) {
        const p2 = re[q] * re[q] + im[q] * im[q];
        out.nkRe[b * K + q] += re[q]; out.nkIm[b * K + q] += im[q];
        out.nk2[b * K + q] += p2; out.nk4[b * K + q] += p2 * p2;
      }
      if (out.sites && out.shellSums && shellOf) {
        const S = g.shells.length, st = cfg.state;
        for (let i = 0; i < N; i++) {
          if (!st[i]) continue;
          out.sites[b * N + i] += 1;
          for (let j = 0; j < N; j++) if (j !== i && st[j]) out.shellSums[b * S + shellOf[i * N + j]] += 1;
        }
      }
      const done = req.thermalization + b * binSize + s + 1;
      if (done % every === 0) hooks.onProgress?.(done, totalSweeps);
    }
  }
  const scale = 1 / binSize;
  for (const a of [out.scalars, out.nkRe, out.nkIm, out.nk2, out.nk4, out.sites, out.shellSums]) if (a) for (let t = 0; t < a.length; t++) a[t] *= scale;
  out.cutoff = cfg.L;
  out.meanOperators = operators / (bins * binSize);
  return out;
}
