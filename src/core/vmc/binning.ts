/**
 * Error bars of Markov-chain averages from bins of consecutive samples (Flyvbjerg and
 * Petersen, J. Chem. Phys. 91, 461 (1989)).
 *
 *   mean = (1/B) sum_b x_b,   sigma^2 = sum_b (x_b - mean)^2 / (B (B - 1))
 *
 * over B bin means x_b; with bins much longer than the autocorrelation time this is the
 * true error of the mean. The integrated autocorrelation time follows as
 *   tau_int = sigma^2 / (2 sigma_naive^2),   sigma_naive^2 = var(x) / n,
 * in units of the sampling interval (tau_int = 1/2 for independent samples).
 * Nonlinear functions of averages (S(k), C(r)) take jackknife errors over the bins
 * (Efron, The Jackknife, the Bootstrap and Other Resampling Plans (1982)):
 *   sigma^2 = ((B - 1)/B) sum_b (f_(b) - f_(.))^2,  f_(b) from all bins but b.
 */

export interface Estimate {
  value: number;
  error: number;
}

/** Mean and binning error of bin means (B >= 2). */
export function binnedMean(binMeans: ArrayLike<number>): Estimate {
  const B = binMeans.length;
  let mean = 0;
  for (let b = 0; b < B; b++) mean += binMeans[b];
  mean /= B;
  let v = 0;
  for (let b = 0; b < B; b++) v += (binMeans[b] - mean) ** 2;
  return { value: mean, error: B > 1 ? Math.sqrt(v / (B * (B - 1))) : NaN };
}

/** tau_int from the binned error of the mean and the naive one of n samples with sum x2 of squares. */
export function autocorrelationTime(binned: Estimate, n: number, sumSquares: number): number {
  const naive = (sumSquares / n - binned.value * binned.value) / (n - 1);
  return naive > 0 ? (binned.error * binned.error) / (2 * naive) : 0.5;
}

/**
 * Jackknife of f over B bins: `f(exclude)` evaluates the estimator leaving out bin
 * `exclude` (-1: all bins). Returns the full-sample value with the jackknife error, for
 * estimators of several outputs at once.
 */
export function jackknife(B: number, f: (exclude: number) => Float64Array): Estimate[] {
  const full = f(-1), K = full.length;
  const mean = new Float64Array(K), parts: Float64Array[] = [];
  for (let b = 0; b < B; b++) {
    const fb = f(b);
    parts.push(fb);
    for (let q = 0; q < K; q++) mean[q] += fb[q] / B;
  }
  return Array.from(full, (value, q) => {
    let v = 0;
    for (const fb of parts) v += (fb[q] - mean[q]) ** 2;
    return { value, error: Math.sqrt(((B - 1) / B) * v) };
  });
}
