/**
 * A sequential colour ramp of our own for continuous quantities on a map (excitation or
 * photon density): from warm paper through teal to deep indigo, monotone in lightness
 * (92% -> 22%), so it reads in grey and under colour-vision deficiencies. Values are
 * quantised to `levels` steps, which also lets the heatmap merge equal runs.
 */

const STOPS: [number, number, number, number][] = [
  // t, hue, saturation %, lightness %
  [0, 48, 60, 92], [0.35, 170, 38, 66], [0.7, 215, 45, 42], [1, 255, 50, 22],
];

/** Colour of t in [0, 1]. */
export function rampColour(t: number): string {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  let k = 0;
  while (k < STOPS.length - 2 && x > STOPS[k + 1][0]) k++;
  const [t0, h0, s0, l0] = STOPS[k], [t1, h1, s1, l1] = STOPS[k + 1];
  const u = (x - t0) / (t1 - t0);
  return `hsl(${Math.round(h0 + u * (h1 - h0))} ${Math.round(s0 + u * (s1 - s0))}% ${Math.round(l0 + u * (l1 - l0))}%)`;
}

/** Quantised position of v on [lo, hi]: level index 0..levels-1. */
export function rampLevel(v: number, lo: number, hi: number, levels = 24): number {
  if (!(hi > lo)) return 0;
  return Math.min(levels - 1, Math.max(0, Math.floor(((v - lo) / (hi - lo)) * levels)));
}
