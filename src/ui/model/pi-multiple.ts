/**
 * A wavevector written as a multiple of pi where it is one: k = (p/q) pi with q <= 12
 * (the commensurate points a cell of up to 12 sites can hold: pi, 2pi/3, pi/2, ...) is
 * printed "2π/3"; otherwise its decimal. k* comes from a compass search refined to 1e-7
 * in zone fractions (core/softmode/softest.ts), so "is one" means within 1e-6 in k.
 */

/** Largest denominator tried: 12, the 1D default Mmax. */
export const PI_DENOMINATOR = 12;
/** Allowance in k (1/a): 1e-6, ten times the search's 1e-7 in zone fractions of 2pi. */
export const PI_TOL = 1e-6;

const fmt = (x: number, d: number) => (Math.abs(x) < 1e-12 ? '0' : Number(x.toPrecision(d)).toString());

/** "π", "−2π/3", "0", or null when k is no small rational multiple of pi. */
export function piMultiple(k: number): string | null {
  if (!Number.isFinite(k)) return null;
  if (Math.abs(k) < PI_TOL) return '0';
  const x = k / Math.PI;
  for (let q = 1; q <= PI_DENOMINATOR; q++) {
    const p = Math.round(x * q);
    if (p !== 0 && Math.abs(k - (p * Math.PI) / q) < PI_TOL) {
      const sign = p < 0 ? '\u2212' : '';
      const a = Math.abs(p);
      return `${sign}${a === 1 ? '' : a}\u03c0${q === 1 ? '' : `/${q}`}`;
    }
  }
  return null;
}

/** One component: "2π/3" where it is a multiple of pi, else its decimal to `digits`. */
export function kComponent(k: number, digits = 5): string {
  return piMultiple(k) ?? fmt(k, digits);
}

/** k* as the page prints it: "2π/3 (2.0944)" in 1D, "(π, 0)" in 2D; decimals where no multiple. */
export function kText(k: number | readonly [number, number], digits = 5): string {
  if (typeof k === 'number') {
    const p = piMultiple(k);
    return p && p !== '0' ? `${p} (${fmt(k, digits)})` : fmt(k, digits);
  }
  return `(${kComponent(k[0], digits)}, ${kComponent(k[1], digits)})`;
}
