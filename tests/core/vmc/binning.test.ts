/**
 * Binning errors and tau_int on a synthetic AR(1) series x_t = phi x_{t-1} + e_t, whose
 * integrated autocorrelation time is tau_int = (1/2)(1 + phi)/(1 - phi) in closed form
 * (Sokal, Monte Carlo Methods in Statistical Mechanics, Cargese lectures (1996), from memory).
 */
import { describe, it, expect } from 'vitest';
import { autocorrelationTime, binnedMean, jackknife } from '../../../src/core/vmc/binning.ts';
import { chainStream } from '../../../src/core/vmc/random-stream.ts';
import { expectRel } from '../../references.ts';

describe('binning and jackknife', () => {
  it('AR(1), phi = 0.8: tau_int = 4.5 within 30% (256 bins of 1024)', () => {
    const phi = 0.8, B = 256, L = 1024, rng = chainStream('ar1', 0).next;
    const bins = new Float64Array(B);
    let x = 0, sum2 = 0;
    for (let t = 0; t < B * L; t++) {
      // Box-Muller normal deviate.
      const e = Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
      x = phi * x + e;
      bins[Math.floor(t / L)] += x / L; sum2 += x * x;
    }
    const m = binnedMean(bins);
    // tolerance 30%: the variance of 256 bin means has relative spread sqrt(2/255) = 9%, 3 sigma = 27%;
    // the bias of bins of length 1024 >> tau is ~tau/L = 0.4%.
    expectRel(autocorrelationTime(m, B * L, sum2), 0.5 * (1 + phi) / (1 - phi), 0.3);
  });

  it('the jackknife error of a mean equals the binning error (identity)', () => {
    const v = Float64Array.from([1.2, 0.7, 1.9, 1.1, 0.4, 1.6]);
    const jk = jackknife(6, (b) => {
      let s = 0, n = 0;
      for (let q = 0; q < 6; q++) if (q !== b) { s += v[q]; n++; }
      return Float64Array.of(s / n);
    });
    const bm = binnedMean(v);
    expectRel(jk[0].value, bm.value, 1e-14);
    expectRel(jk[0].error, bm.error, 1e-12);
  });
});
