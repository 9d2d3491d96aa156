/**
 * The uniform deviates of the Monte Carlo sweeps: xoshiro128** (Blackman and Vigna,
 * "Scrambled linear pseudorandom number generators", ACM Trans. Math. Softw. 47, 36 (2021)),
 * 32-bit integer arithmetic that V8 runs in a few nanoseconds a draw, seeded from the
 * project's seeded stream of the chain (vmc/random-stream.ts), so a seed and a chain index
 * still fix every number. Deviates are k / 2^32, k = 0 .. 2^32 - 1.
 */
import { chainStream } from '../vmc/random-stream.ts';

/** The generator of chain `chain` of a run seeded by `seed`: a function returning [0, 1). */
export function sweepStream(seed: number | string, chain: number): () => number {
  const init = chainStream(seed, chain).next;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  while ((s0 | s1 | s2 | s3) === 0) {
    s0 = (init() * 4294967296) | 0; s1 = (init() * 4294967296) | 0;
    s2 = (init() * 4294967296) | 0; s3 = (init() * 4294967296) | 0;
  }
  return () => {
    const m = Math.imul(s1, 5);
    const r = Math.imul((m << 7) | (m >>> 25), 9);
    const t = s1 << 9;
    s2 ^= s0; s3 ^= s1; s1 ^= s2; s0 ^= s3; s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    return (r >>> 0) / 4294967296;
  };
}
