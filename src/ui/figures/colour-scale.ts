/**
 * The scale of a continuous map colouring (excitation or photon density): a range [lo, hi]
 * with values outside it clipped to the end colours, linear or logarithmic. Without a range
 * given, hi is the 95th percentile of the values, so a few diverging points (alpha^2 grows
 * without bound as mu -> delta) do not paint everything physical in one colour; the colour
 * bar says where clipping applies.
 */

export interface ColourScale {
  lo: number;
  hi: number;
  log: boolean;
  /** Some values lie below lo / above hi (drawn in the end colour). */
  clippedLow: boolean;
  clippedHigh: boolean;
  /** Position of v on the scale, 0..1 (clipped). */
  t(v: number): number;
  /** Value at position t (for the bar's ticks). */
  at(t: number): number;
}

/** Parse the typed colour range "lo:hi" (either end may be empty: automatic); null if malformed. */
export function parseColourRange(text: string): { lo?: number; hi?: number } | null {
  const t = text.trim();
  if (t === '') return {};
  const parts = t.split(':');
  if (parts.length !== 2) return null;
  const num = (s: string) => (s.trim() === '' ? undefined : Number(s));
  const lo = num(parts[0]), hi = num(parts[1]);
  if ((lo !== undefined && !Number.isFinite(lo)) || (hi !== undefined && !Number.isFinite(hi))) return null;
  if (lo !== undefined && hi !== undefined && !(hi > lo)) return null;
  return { lo, hi };
}

/** The scale of these values with the range asked for (ends left out: min and 95th percentile). */
export function colourScale(values: readonly number[], asked: { lo?: number; hi?: number }, log: boolean): ColourScale {
  const v = values.filter(Number.isFinite).sort((a, b) => a - b);
  const min = v.length ? v[0] : 0, max = v.length ? v[v.length - 1] : 1;
  const p95 = v.length ? v[Math.min(v.length - 1, Math.floor(0.95 * (v.length - 1)))] : 1;
  let hi = asked.hi ?? (p95 > min ? p95 : max);
  let lo = asked.lo ?? min;
  if (log) {
    // a log scale starts at the smallest positive value (or 1e-4 of hi), never at 0
    const firstPositive = v.find((x) => x > 0) ?? 1e-4;
    if (!(lo > 0)) lo = Math.max(firstPositive, hi * 1e-4);
    if (!(hi > lo)) hi = lo * 10;
  } else if (!(hi > lo)) hi = lo + 1;
  const f = log ? Math.log10 : (x: number) => x;
  const a = f(lo), b = f(hi);
  return {
    lo, hi, log,
    clippedLow: min < lo * (1 - 1e-12) - 1e-300, clippedHigh: max > hi * (1 + 1e-12),
    t: (x) => Math.min(1, Math.max(0, ((log ? Math.log10(Math.max(x, lo)) : x) - a) / (b - a))),
    at: (t) => (log ? Math.pow(10, a + t * (b - a)) : a + t * (b - a)),
  };
}
