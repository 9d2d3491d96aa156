/**
 * Uniform numbers in [0, 1) from a string seed, the same doubles, bit for bit, as the first
 * draws of the seedrandom package's default generator (ARC4 keyed by the seed's character
 * codes, the first 256 bytes dropped, 7 bytes or more a double with 52 significant bits),
 * without its per-generator costs: a 256-entry state array, a closure, and the mixing of
 * that state into the package's global entropy pool as a string on every construction. The
 * mean-field search seeds one generator a cell and point (starts.ts), so those costs were a
 * tenth of a map's solver time. ARC4: Rivest's cipher as in the package; checked against it.
 */

const S = new Uint8Array(256);
let si = 0, sj = 0;

/** Next `count` bytes of the keystream as one number (big-endian), as the package's g(count). */
function bytes(count: number): number {
  let r = 0, i = si, j = sj;
  while (count--) {
    i = (i + 1) & 255;
    const t = S[i];
    j = (j + t) & 255;
    S[i] = S[j];
    S[j] = t;
    r = r * 256 + S[(S[i] + t) & 255];
  }
  si = i;
  sj = j;
  return r;
}

/** Key the cipher with `seed` as the package does (its mixkey of the string, then ARC4's schedule, 256 bytes dropped). */
function key(seed: string): void {
  const k: number[] = [];
  let smear = 0;
  for (let j = 0; j < seed.length; j++) {
    const old = k[j & 255];
    // the package's `smear ^= key[j] * 19`: an unset entry gives NaN, which ^ reads as 0
    smear ^= old === undefined ? 0 : old * 19;
    k[j & 255] = 255 & (smear + seed.charCodeAt(j));
  }
  if (!k.length) k.push(0);
  const n = k.length;
  for (let i = 0; i < 256; i++) S[i] = i;
  for (let i = 0, j = 0; i < 256; i++) {
    const t = S[i];
    j = (j + k[i % n] + t) & 255;
    S[i] = S[j];
    S[j] = t;
  }
  si = 0;
  sj = 0;
  bytes(256);
}

/** One double in [0, 1): 6 bytes, more until 52 bits are significant, shifted down past 53 (the package's prng()). */
function uniform(): number {
  let n = bytes(6), d = 2 ** 48, x = 0;
  while (n < 2 ** 52) {
    n = (n + x) * 256;
    d *= 256;
    x = bytes(1);
  }
  while (n >= 2 ** 53) {
    n /= 2;
    d /= 2;
    x >>>= 1;
  }
  return (n + x) / d;
}

/** Fill `out` with the first out.length draws of the generator seeded by `seed`. */
export function arc4Uniforms(seed: string, out: Float64Array): Float64Array {
  key(seed);
  for (let i = 0; i < out.length; i++) out[i] = uniform();
  return out;
}
