/**
 * Linear scales and round-number ticks (steps of 1, 2 or 5 times a power of ten).
 */

export interface LinearScale {
  (v: number): number;
  readonly domain: readonly [number, number];
  readonly range: readonly [number, number];
  /** Data value at a pixel position. */
  invert(p: number): number;
  /** About `count` round tick values inside the domain. */
  ticks(count?: number): number[];
  /** A tick label with as many decimals as the tick step needs. */
  format(v: number, count?: number): string;
}

/** Tick step of 1, 2 or 5 x 10^k giving about `count` intervals over [lo, hi]. */
export function tickStep(lo: number, hi: number, count: number): number {
  const span = Math.abs(hi - lo) || Math.abs(lo) || 1;
  const raw = span / Math.max(1, count);
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const f = raw / p;
  return (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10) * p;
}

/** Round ticks inside [lo, hi] (either order). */
export function niceTicks(lo: number, hi: number, count = 6): number[] {
  const a = Math.min(lo, hi), b = Math.max(lo, hi);
  const step = tickStep(a, b, count);
  const out: number[] = [];
  const eps = step * 1e-9;
  for (let t = Math.ceil((a - eps) / step) * step; t <= b + eps; t += step) {
    out.push(Math.abs(t) < eps ? 0 : Number(t.toPrecision(12)));
  }
  return out;
}

/** The linear map of `domain` onto pixel `range`. */
export function linearScale(domain: readonly [number, number], range: readonly [number, number]): LinearScale {
  const [d0, d1] = domain, [r0, r1] = range;
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  const s = ((v: number) => r0 + (v - d0) * k) as LinearScale;
  Object.assign(s, {
    domain, range,
    invert: (p: number) => (k === 0 ? d0 : d0 + (p - r0) / k),
    ticks: (count = 6) => niceTicks(d0, d1, count),
    format: (v: number, count = 6) => {
      const step = tickStep(Math.min(d0, d1), Math.max(d0, d1), count);
      const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
      return v.toFixed(Math.min(decimals, 6)).replace(/^-(0\.?0*)$/, '$1').replace('-', '\u2212');
    },
  });
  return s;
}
