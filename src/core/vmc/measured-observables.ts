/**
 * Observables of the measurement segments of all chains, bins concatenated in chain order
 * (chains are independent, so their bins are too). Every average is a weighted ratio
 * <A> = sum w A / sum w (the guide's weights, markov-chain.ts), its error the jackknife over
 * bins (Efron 1982), which handles ratios and the nonlinear estimators alike:
 *
 *   energy per site <E_loc>/N, mean <sigma^x_i>, density <n>, site densities <n_i>,
 *   S(k) = (1/N) (<|n_k|^2> - |<n_k>|^2),   n_k = sum_i e^{i k.r_i} n_i
 *        = (1/N) sum_ij e^{i k.(r_i - r_j)} (<n_i n_j> - <n_i><n_j>),
 *   C(r) = [ <sum_{i != j at r} n_i n_j> - sum_{i != j at r} <n_i><n_j> ] / (number of such pairs),
 *
 * the density-wave order m^2 = <|n_k|^2>/N^2 at its largest k != 0, and tau_int of the energy
 * in sweeps from its jackknife and naive errors.
 */
import type { Cluster } from '../cluster/cluster.ts';
import { shellPairCounts } from '../cluster/cluster.ts';
import { type Estimate, jackknife } from './binning.ts';
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
  /** m^2 = <|n_k*|^2>/N^2 at the k* != 0 maximising it (see cluster/correlations.ts). */
  orderParameter: { k: [number, number]; m: [number, number]; value: number; error: number } | null;
}

/** Merge the bins of every chain into estimates. */
export function measuredObservables(c: Cluster, parts: MeasureBins[]): MeasuredObservables {
  const N = c.N, K = c.momenta.length / 2, S = c.shells.length;
  const B = parts.reduce((s, p) => s + p.bins, 0), n = parts.reduce((s, p) => s + p.bins * p.perBin, 0);
  const cat = (pick: (p: MeasureBins) => Float64Array) => {
    const out = new Float64Array(parts.reduce((s, p) => s + pick(p).length, 0));
    let off = 0;
    for (const p of parts) { out.set(pick(p), off); off += pick(p).length; }
    return out;
  };
  const columns = (pick: (p: MeasureBins) => Float64Array, width: number) => {
    const a = cat(pick), total = new Float64Array(width);
    for (let b = 0; b < B; b++) for (let q = 0; q < width; q++) total[q] += a[b * width + q];
    // The column sum without bin b (all bins for b = -1).
    return (q: number, b: number) => (b < 0 ? total[q] : total[q] - a[b * width + q]);
  };
  const w = columns((p) => p.w, 1), e = columns((p) => p.e, 1), x = columns((p) => p.x, 1), rho = columns((p) => p.rho, 1);
  const site = columns((p) => p.site, N), re = columns((p) => p.nkRe, K), im = columns((p) => p.nkIm, K);
  const nk2 = columns((p) => p.nk2, K), pairs = columns((p) => p.pairs, S);
  const scalars = jackknife(B, (b) => Float64Array.of(e(0, b) / w(0, b), x(0, b) / w(0, b), rho(0, b) / w(0, b)));
  const sites = jackknife(B, (b) => Float64Array.from({ length: N }, (_, i) => site(i, b) / w(0, b)));
  const sk = jackknife(B, (b) => {
    const W = w(0, b), out = new Float64Array(K);
    for (let q = 0; q < K; q++) out[q] = (nk2(q, b) / W - (re(q, b) / W) ** 2 - (im(q, b) / W) ** 2) / N;
    return out;
  });
  const m2 = jackknife(B, (b) => Float64Array.from({ length: K }, (_, q) => nk2(q, b) / w(0, b) / (N * N)));
  let qBest = -1;
  for (let q = 0; q < K; q++) {
    if (c.momentumLabels[2 * q] === 0 && c.momentumLabels[2 * q + 1] === 0) continue;
    if (qBest < 0 || m2[q].value > m2[qBest].value) qBest = q;
  }
  const counts = shellPairCounts(c);
  const cr = jackknife(B, (b) => {
    const W = w(0, b), rhoI = Float64Array.from({ length: N }, (_, i) => site(i, b) / W), out = new Float64Array(S);
    for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) if (i !== j) out[c.shellOf[i * N + j]] -= rhoI[i] * rhoI[j];
    for (let d = 0; d < S; d++) out[d] = (out[d] + pairs(d, b) / W) / counts[d];
    return out;
  });
  // Naive error of the weighted mean energy: sum w^2 (e - <e>)^2 / W^2.
  const eMean = scalars[0].value, W = w(0, -1);
  const w2 = parts.reduce((s, p) => s + p.w2, 0), w2e = parts.reduce((s, p) => s + p.w2e, 0), w2e2 = parts.reduce((s, p) => s + p.w2e2, 0);
  const naive = (w2e2 - 2 * eMean * w2e + eMean * eMean * w2) / (W * W);
  return {
    samples: n, energyPerSite: scalars[0], sigmaX: scalars[1], density: scalars[2],
    tauInt: naive > 0 ? (scalars[0].error ** 2) / (2 * naive) : 0.5,
    siteDensities: sites,
    structureFactor: sk.map((s, q) => ({
      k: [c.momenta[2 * q], c.momenta[2 * q + 1]] as [number, number],
      m: [c.momentumLabels[2 * q], c.momentumLabels[2 * q + 1]] as [number, number], value: s.value, error: s.error,
    })),
    correlation: cr.map((s, d) => ({ r: c.shells[d], value: s.value, error: s.error, pairs: counts[d] })),
    orderParameter: qBest < 0 ? null : {
      k: [c.momenta[2 * qBest], c.momenta[2 * qBest + 1]], m: [c.momentumLabels[2 * qBest], c.momentumLabels[2 * qBest + 1]], ...m2[qBest],
    },
  };
}
