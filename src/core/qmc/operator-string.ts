/**
 * The stochastic series expansion configuration and its diagonal update (Sandvik,
 * Phys. Rev. E 68, 056701 (2003)):
 *
 *   Z = sum_{n, S_L} beta^n (L - n)! / L!  <alpha| prod_p H_{op(p)} |alpha>,
 *
 * a state |alpha> of the N emitters and a string of L slots, each empty or holding one
 * operator of the decomposition in sse-terms.ts: a constant or flip site operator, a
 * diagonal bond or a diagonal field operator. Expectation values follow from the operator
 * counts, e.g. <H> = E0 - <n>/beta.
 *
 * Diagonal update, slot by slot with the state propagated through the flip operators:
 * an empty slot takes a new diagonal operator b with probability
 *   min(1, beta W / (L - n)) * W_b(state) / W,   W = sum_b max W_b,
 * (b drawn in O(1) with weight max W_b, then kept with W_b(state) / max W_b), and a diagonal
 * operator is removed with probability min(1, (L - n + 1) / (beta W)); their ratio is the
 * weight ratio beta W_b / (L - n) (detailed balance).
 */
import { aliasDraw } from './alias-table.ts';
import type { SseTerms } from './sse-terms.ts';

import { SLOT } from './slots.ts';

const { EMPTY, CONST, FLIP, BOND, FIELD } = SLOT;

export interface SseConfig {
  readonly N: number;
  /** Slots in the string (the expansion cutoff). */
  L: number;
  /** Non-empty slots. */
  n: number;
  /** |alpha>: occupations n_i at the start of the string. */
  readonly state: Uint8Array;
  kind: Uint8Array;
  /** Site of the operator (site i of a bond). */
  siteA: Int32Array;
  /** Site j of a bond, -1 otherwise. */
  siteB: Int32Array;
  /** Bond class (displacement or pair index) of a bond operator. */
  cls: Int32Array;
}

/** An empty string of L slots over a given starting state. */
export function emptyConfig(state: Uint8Array, L: number): SseConfig {
  return {
    N: state.length, L, n: 0, state,
    kind: new Uint8Array(L), siteA: new Int32Array(L), siteB: new Int32Array(L).fill(-1), cls: new Int32Array(L),
  };
}

/** Grow the cutoff to L' = n + n/3 (at least L + 8) when n exceeds 3L/4, keeping the operators in order. */
export function adjustCutoff(c: SseConfig): boolean {
  if (4 * c.n <= 3 * c.L) return false;
  const L = Math.max(c.L + 8, Math.ceil((4 * c.n) / 3) + 8);
  const grow = <T extends Uint8Array | Int32Array>(a: T, fill: number): T => {
    const b = new (a.constructor as new (n: number) => T)(L);
    b.fill(fill); b.set(a);
    return b;
  };
  c.kind = grow(c.kind, EMPTY); c.siteA = grow(c.siteA, 0); c.siteB = grow(c.siteB, -1); c.cls = grow(c.cls, 0);
  c.L = L;
  return true;
}

/** Sweep every slot once: insert and remove diagonal operators (see the header). */
export function diagonalUpdate(c: SseConfig, t: SseTerms, beta: number, rng: () => number): void {
  const { kind, siteA, siteB, cls, state, L } = c;
  const total = t.constWeight + t.bondWeight + t.fieldWeight;
  const bw = beta * total;
  const N = t.N, Lx = t.Lx, Ly = t.Ly, torus = t.kind === 'torus';
  const bondW = t.bondW, bondMax = t.bondMax, nField = t.fieldSites.length;
  let n = c.n;
  for (let p = 0; p < L; p++) {
    const k = kind[p];
    if (k === FLIP) { state[siteA[p]] ^= 1; continue; }
    if (k !== EMPTY) {
      if (rng() * bw < L - n + 1) { kind[p] = EMPTY; siteB[p] = -1; n--; }
      continue;
    }
    if (rng() * (L - n) >= bw) continue;
    let r = rng() * total;
    if (r < t.constWeight) {
      kind[p] = CONST; siteA[p] = Math.min(N - 1, Math.floor(r / t.alpha)); siteB[p] = -1; n++;
      continue;
    }
    r -= t.constWeight;
    if (r < t.bondWeight) {
      let i: number, j: number, b: number;
      if (torus) {
        i = Math.floor(rng() * N);
        b = 1 + aliasDraw(t.displacementTable!, rng());
        const x = (i % Lx) + (b % Lx), y = Math.floor(i / Lx) + Math.floor(b / Lx);
        j = (x >= Lx ? x - Lx : x) + Lx * (y >= Ly ? y - Ly : y);
      } else {
        b = aliasDraw(t.pairTable!, rng());
        i = t.pairI[b]; j = t.pairJ[b];
      }
      if (rng() * bondMax[b] < bondW[4 * b + 2 * state[i] + state[j]]) {
        kind[p] = BOND; siteA[p] = i; siteB[p] = j; cls[p] = b; n++;
      }
    } else if (nField > 0) {
      const i = t.fieldSites[Math.min(nField - 1, Math.floor(rng() * nField))];
      if (rng() * t.fieldMax < t.fieldW[state[i]]) { kind[p] = FIELD; siteA[p] = i; siteB[p] = -1; n++; }
    }
  }
  c.n = n;
}
