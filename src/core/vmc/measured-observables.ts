/**
 * Observables of the measurement segments of all chains, bins concatenated in chain order
 * (chains are independent, so their bins are too):
 *
 *   energy per site <E_loc>/N, mean <sigma^x_i>, density <n>, site densities <n_i>
 *   (binning errors; tau_int of the energy in sweeps), and by jackknife
 *   S(k) = (1/N) (<|n_k|^2> - |<n_k>|^2),   n_k = sum_i e^{i k.r_i} n_i
 *        = (1/N) sum_ij e^{i k.(r_i - r_j)} (<n_i n_j> - <n_i><n_j>),
 *   C(r) = [ <sum_{i != j at r} n_i n_j> - sum_{i != j at r} <n_i><n_j> ] / (number of such pairs).
 */
import type { Cluster } from '../cluster/cluster.ts';
import { shellPairCounts } from '../cluster/cluster.ts';
import { type Estimate, autocorrelationTime, binnedMean, jackknife } from './binning.ts';
import type { MeasureBins } from './segment.ts';

export interface MeasuredObservables {
  samples: number;
  energyPerSite: Estimate;
  sigmaX: Estimate;
  density: Estimate;
  /** Integrated autocorrelation time of the energy, in sweeps. */
  tauInt: number;
  siteDensities: Estimate[];
  structureFactor: { k: [number, number]; m: [number, number]; value: number; error: number }[];
  correlation: { r: number; value: number; error: number; pairs: number }[];
}

/** Merge the bins of every chain into estimates. */
export function measuredObservables(c: Cluster, parts: MeasureBins[]): MeasuredObservables {
  const N = c.N, K = c.momenta.length / 2, S = c.shells.length;
  const L = parts[0].perBin;
  if (parts.some((p) => p.perBin !== L)) throw new Error('chains measured with different bin lengths');
  const cat = (pick: (p: MeasureBins) => Float64Array) => {
    const out = new Float64Array(parts.reduce((s, p) => s + pick(p).length, 0));
    let off = 0;
    for (const p of parts) { out.set(pick(p), off); off += pick(p).length; }
    return out;
  };
  const B = parts.reduce((s, p) => s + p.bins, 0), n = B * L;
  const perBin = (a: Float64Array) => a.map((v) => v / L);
  const e = perBin(cat((p) => p.e)), x = perBin(cat((p) => p.x)), rho = perBin(cat((p) => p.rho));
  const site = cat((p) => p.site), nkRe = cat((p) => p.nkRe), nkIm = cat((p) => p.nkIm), nk2 = cat((p) => p.nk2);
  const pairs = cat((p) => p.pairs);
  const sum2 = (f: (p: MeasureBins) => number) => parts.reduce((s, p) => s + f(p), 0);
  const energyPerSite = binnedMean(e);
  const siteDensities = Array.from({ length: N }, (_, i) => binnedMean(Array.from({ length: B }, (_, b) => site[b * N + i] / L)));
  // Column totals, so each jackknife sample is the total minus one bin.
  const total = (a: Float64Array, width: number) => {
    const t = new Float64Array(width);
    for (let b = 0; b < B; b++) for (let q = 0; q < width; q++) t[q] += a[b * width + q];
    return t;
  };
  const tRe = total(nkRe, K), tIm = total(nkIm, K), t2 = total(nk2, K), tSite = total(site, N), tPairs = total(pairs, S);
  const leave = (t: Float64Array, a: Float64Array, width: number, q: number, b: number) => (b < 0 ? t[q] : t[q] - a[b * width + q]);
  const sk = jackknife(B, (b) => {
    const m = b < 0 ? n : n - L, out = new Float64Array(K);
    for (let q = 0; q < K; q++) {
      const re = leave(tRe, nkRe, K, q, b) / m, im = leave(tIm, nkIm, K, q, b) / m;
      out[q] = (leave(t2, nk2, K, q, b) / m - re * re - im * im) / N;
    }
    return out;
  });
  const counts = shellPairCounts(c);
  const cr = jackknife(B, (b) => {
    const m = b < 0 ? n : n - L, rhoI = new Float64Array(N), out = new Float64Array(S);
    for (let i = 0; i < N; i++) rhoI[i] = leave(tSite, site, N, i, b) / m;
    for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) if (i !== j) out[c.shellOf[i * N + j]] -= rhoI[i] * rhoI[j];
    for (let d = 0; d < S; d++) out[d] = (out[d] + leave(tPairs, pairs, S, d, b) / m) / counts[d];
    return out;
  });
  return {
    samples: n, energyPerSite, sigmaX: binnedMean(x), density: binnedMean(rho),
    tauInt: autocorrelationTime(energyPerSite, n, sum2((p) => p.e2)),
    siteDensities,
    structureFactor: sk.map((s, q) => ({
      k: [c.momenta[2 * q], c.momenta[2 * q + 1]] as [number, number],
      m: [c.momentumLabels[2 * q], c.momentumLabels[2 * q + 1]] as [number, number], value: s.value, error: s.error,
    })),
    correlation: cr.map((s, d) => ({ r: c.shells[d], value: s.value, error: s.error, pairs: counts[d] })),
  };
}
