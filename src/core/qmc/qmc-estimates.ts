/**
 * Estimates with error bars from the bins of independent chains (the bins of every chain
 * are pooled; chains are independent, bins much longer than the autocorrelation time are
 * too). Linear averages take the binning error, nonlinear ones the jackknife
 * (binning.ts), and each scalar reports its integrated autocorrelation time in sweeps:
 *
 *   S(k) = (<|n_k|^2> - |<n_k>|^2) / N          (connected, as the exact diagonalisation's)
 *
 * On a torus <n_k> = 0 for k != 0 exactly (translation invariance), so only k = 0 is
 * subtracted there: a chain that stays in one orientation of a crystal for a while has a
 * sample <n_k> != 0, and subtracting it would remove the order it is measuring.
 *   m^2  = <|n_k*|^2> / N^2,   U = 1 - <m^4> / (3 <m^2>^2)   (Binder, Z. Phys. B 43, 119 (1981))
 *   d rho / d mu = (1/N) [ int_0^beta <N(tau) N> dtau - beta <N>^2 ]
 *   C(r) = mean over pairs at distance r of <n_i n_j> - <n_i><n_j>
 *
 * k* is the momentum the caller names, else the k != 0 of largest S(k). Equilibration is
 * checked: the drift of each scalar between the first and the second half of every chain,
 * in units of its error.
 */
import { type Estimate, autocorrelationTime, binnedMean, jackknife } from '../vmc/binning.ts';
import type { QmcGeometry } from './qmc-geometry.ts';
import { SCALARS, type SseChainResult } from './sse-chain.ts';
import { torusCorrelation } from './torus-transform.ts';

export interface Drift {
  first: number;
  second: number;
  /** (second - first) / combined error. */
  sigmas: number;
}

export interface ChainEstimates {
  energyPerSite: Estimate;
  density: Estimate;
  sigmaX: Estimate;
  compressibility: Estimate;
  structureFactor: { k: [number, number]; m: [number, number]; value: number; error: number }[];
  orderParameter: { k: [number, number]; m: [number, number]; value: number; error: number } | null;
  binder: Estimate | null;
  correlation: { r: number; value: number; error: number; pairs: number }[];
  siteDensities: Estimate[] | null;
  /** Integrated autocorrelation times (sweeps) of energy, density, sigma^x. */
  autocorrelation: { energy: number; density: number; sigmaX: number };
  drift: { energy: Drift; density: Drift; sigmaX: Drift };
  /**
   * Binning convergence: the error from bins merged four at a time over the error from the
   * bins (about 1 when the bins are longer than the autocorrelation time; Flyvbjerg and
   * Petersen 1989). Null where there are too few bins to merge.
   */
  binningGrowth: { energy: number; density: number; sigmaX: number; orderParameter: number } | null;
  bins: number;
  samples: number;
  cutoff: number;
  meanOperators: number;
}

/** Pool the chains' bins into estimates; `order` is the (m1, m2) label of a named k*. */
export function chainEstimates(g: QmcGeometry, beta: number, chains: SseChainResult[], order?: [number, number]): ChainEstimates {
  const NS = SCALARS.length, N = g.N, K = g.momenta.length / 2;
  const B = chains.reduce((s, c) => s + c.bins, 0);
  const samples = chains.reduce((s, c) => s + c.bins * c.binSize, 0);
  const cat = (f: (c: SseChainResult) => Float64Array, width: number) => {
    const out = new Float64Array(B * width);
    let at = 0;
    for (const c of chains) { out.set(f(c), at); at += c.bins * width; }
    return out;
  };
  const scalars = cat((c) => c.scalars, NS);
  const col = (v: number) => Float64Array.from({ length: B }, (_, b) => scalars[b * NS + v]);
  const scalar = (v: number) => {
    const est = binnedMean(col(v));
    const sq = chains.reduce((s, c) => s + c.squares[v], 0);
    // tau_int in sweeps: the energy is sampled every fourierInterval sweeps.
    const n = v === 0 ? chains.reduce((s, c) => s + c.energySamples, 0) : samples;
    return { est, tau: autocorrelationTime(est, n, sq) * (v === 0 ? chains[0].fourierInterval : 1) };
  };
  const [e, rho, sx] = [0, 1, 2].map(scalar);
  const nkRe = cat((c) => c.nkRe, K), nkIm = cat((c) => c.nkIm, K), nk2 = cat((c) => c.nk2, K), nk4 = cat((c) => c.nk4, K);
  /** Mean over every bin but `ex` of column q of a B x width table. */
  const mean = (t: Float64Array, width: number, q: number, ex: number) => {
    let s = 0;
    for (let b = 0; b < B; b++) if (b !== ex) s += t[b * width + q];
    return s / (ex < 0 ? B : B - 1);
  };
  const kubo = col(3), num = col(4);
  const [compressibility] = jackknife(B, (ex) => {
    const k = mean(kubo, 1, 0, ex), n = mean(num, 1, 0, ex);
    return Float64Array.of((k - beta * n * n) / N);
  });
  const sk = jackknife(B, (ex) => Float64Array.from({ length: K }, (_, q) => {
    if (g.torus && q !== 0) return mean(nk2, K, q, ex) / N;
    const re = mean(nkRe, K, q, ex), im = mean(nkIm, K, q, ex);
    return (mean(nk2, K, q, ex) - re * re - im * im) / N;
  }));
  const label = (q: number): [number, number] => [g.momentumLabels[2 * q], g.momentumLabels[2 * q + 1]];
  const kvec = (q: number): [number, number] => [g.momenta[2 * q], g.momenta[2 * q + 1]];
  const structureFactor = sk.map((s, q) => ({ k: kvec(q), m: label(q), value: s.value, error: s.error }));
  let star = -1;
  if (order) {
    star = structureFactor.findIndex((s) => s.m[0] === order[0] && s.m[1] === order[1]);
    if (star < 0) throw new Error(`momentum (${order.join(', ')}) is not a momentum of this cluster`);
  } else {
    for (let q = 0; q < K; q++) {
      const [m1, m2] = label(q);
      if ((m1 !== 0 || m2 !== 0) && (star < 0 || sk[q].value > sk[star].value)) star = q;
    }
  }
  let orderParameter: ChainEstimates['orderParameter'] = null, binder: Estimate | null = null;
  if (star >= 0) {
    const [m2, U] = jackknife(B, (ex) => {
      const p2 = mean(nk2, K, star, ex) / (N * N), p4 = mean(nk4, K, star, ex) / (N * N * N * N);
      return Float64Array.of(p2, 1 - p4 / (3 * p2 * p2));
    });
    orderParameter = { k: kvec(star), m: label(star), value: m2.value, error: m2.error };
    binder = U;
  }
  return {
    energyPerSite: e.est, density: rho.est, sigmaX: sx.est, compressibility,
    structureFactor, orderParameter, binder,
    correlation: correlation(g, B, nk2, cat, mean),
    siteDensities: g.kind === 'array' ? siteMeans(g.N, B, cat((c) => c.sites!, g.N)) : null,
    autocorrelation: { energy: e.tau, density: rho.tau, sigmaX: sx.tau },
    drift: { energy: drift(chains, 0), density: drift(chains, 1), sigmaX: drift(chains, 2) },
    binningGrowth: chains.every((c) => c.bins % 4 === 0) && B >= 16 ? {
      energy: growth(col(0)), density: growth(col(1)), sigmaX: growth(col(2)),
      orderParameter: star >= 0 ? growth(Float64Array.from({ length: B }, (_, b) => nk2[b * K + star])) : 1,
    } : null,
    bins: B, samples,
    cutoff: Math.max(...chains.map((c) => c.cutoff)),
    meanOperators: chains.reduce((s, c) => s + c.meanOperators, 0) / chains.length,
  };
}

type Cat = (f: (c: SseChainResult) => Float64Array, width: number) => Float64Array;
type Mean = (t: Float64Array, width: number, q: number, ex: number) => number;

/** C(r) on the distance shells, jackknifed over bins. */
function correlation(g: QmcGeometry, B: number, nk2: Float64Array, cat: Cat, mean: Mean) {
  const S = g.shells.length, N = g.N, K = g.momenta.length / 2;
  let f: (ex: number) => Float64Array;
  if (g.torus) {
    // <n_i n_(i+d)> averaged over i is G(d) from <|n_k|^2>; <n_i> = <n> = <n_(k=0)> / N.
    const { Lx, Ly } = g.torus, shellOf = g.shellOfDisplacement!, nkRe = cat((c) => c.nkRe, K);
    f = (ex) => {
      const G = torusCorrelation(Lx, Ly, Float64Array.from({ length: K }, (_, q) => mean(nk2, K, q, ex)));
      const n0 = mean(nkRe, K, 0, ex) / N;
      const out = new Float64Array(S), count = new Float64Array(S);
      for (let d = 1; d < N; d++) { out[shellOf[d]] += G[d] - n0 * n0; count[shellOf[d]]++; }
      return out.map((v, s) => v / count[s]);
    };
  } else {
    const c = g.cluster!, sites = cat((ch) => ch.sites!, N), sums = cat((ch) => ch.shellSums!, S);
    f = (ex) => {
      const n = Float64Array.from({ length: N }, (_, i) => mean(sites, N, i, ex));
      const out = Float64Array.from({ length: S }, (_, s) => mean(sums, S, s, ex));
      for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) if (i !== j) out[c.shellOf[i * N + j]] -= n[i] * n[j];
      return out.map((v, s) => v / g.shellPairs[s]);
    };
  }
  const est = jackknife(B, f);
  return Array.from(g.shells, (r, s) => ({ r, value: est[s].value, error: est[s].error, pairs: g.shellPairs[s] }));
}

/** Error of the mean from bins merged four at a time over the error from the bins themselves. */
function growth(x: Float64Array): number {
  const merged = Float64Array.from({ length: Math.floor(x.length / 4) }, (_, b) => (x[4 * b] + x[4 * b + 1] + x[4 * b + 2] + x[4 * b + 3]) / 4);
  const e1 = binnedMean(x).error, e4 = binnedMean(merged).error;
  return e1 > 0 ? e4 / e1 : 1;
}

/** Per-site means with binning errors. */
function siteMeans(N: number, B: number, sites: Float64Array): Estimate[] {
  return Array.from({ length: N }, (_, i) => binnedMean(Float64Array.from({ length: B }, (_, b) => sites[b * N + i])));
}

/** First-half against second-half means of scalar v over every chain's bins. */
function drift(chains: SseChainResult[], v: number): Drift {
  const first: number[] = [], second: number[] = [];
  for (const c of chains) {
    const h = Math.floor(c.bins / 2);
    for (let b = 0; b < c.bins; b++) (b < h ? first : second).push(c.scalars[b * SCALARS.length + v]);
  }
  const a = binnedMean(first), b = binnedMean(second);
  const err = Math.hypot(a.error, b.error);
  return { first: a.value, second: b.value, sigmas: err > 0 ? (b.value - a.value) / err : 0 };
}
