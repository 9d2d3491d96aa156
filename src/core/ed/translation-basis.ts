/**
 * The translation-invariant sector of a periodic cluster (crystal momentum k = 0), which
 * holds the ground state for alpha > 0: it is positive (Perron-Frobenius) and unique, hence
 * equal to its own translates. Each orbit O_R of occupation states under the cluster's
 * translations becomes one normalised state |R> = |O_R|^(-1/2) sum_{g in O_R} |g>, so the
 * dimension drops by about N. With R' = rep(R^i) the orbit of R with site i flipped,
 *
 *   <R|H|R> = E_diag(R),   <R|H|R'> = -alpha sqrt(|O_R| / |O_R'|) per flip i of R,
 *
 * (symmetric: |O_R| #{i: R^i in O_R'} = |O_R'| #{i: R'^i in O_R}). A table rep(s) over all 2^N
 * states (4 bytes each) makes the product O(N D_sym). Amplitudes in the full basis are
 * psi(g) = psi_R / sqrt(|O_R|) for g in O_R.
 */
import type { Cluster } from '../cluster/cluster.ts';

export interface TranslationBasis {
  readonly dimension: number;
  /** Representative state of each orbit. */
  readonly reps: Uint32Array;
  /** sqrt |O_R| per orbit. */
  readonly sqrtSize: Float64Array;
  /** Orbit index of every one of the 2^N states. */
  readonly orbitOf: Int32Array;
}

/** Site permutations of the cluster's translations, or null if V_ij is not invariant under them. */
export function clusterTranslations(c: Cluster): Int32Array[] | null {
  if (c.kind !== 'periodic') return null;
  const N = c.N, out: Int32Array[] = [];
  for (let ty = 0; ty < c.Ly; ty++) {
    for (let tx = 0; tx < c.Lx; tx++) {
      const p = new Int32Array(N);
      for (let s = 0; s < N; s++) p[s] = ((s % c.Lx + tx) % c.Lx) + c.Lx * ((Math.floor(s / c.Lx) + ty) % c.Ly);
      out.push(p);
    }
  }
  const scale = Math.max(1, ...Array.from(c.V, Math.abs));
  for (const p of out) {
    for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) {
      if (Math.abs(c.V[p[i] * N + p[j]] - c.V[i * N + j]) > 1e-12 * scale) return null;
    }
  }
  return out;
}

/** Orbits of all 2^N states under the translations. */
export function translationBasis(N: number, translations: Int32Array[]): TranslationBasis {
  const D = 2 ** N, orbitOf = new Int32Array(D).fill(-1);
  const reps: number[] = [], sizes: number[] = [];
  const image = (s: number, p: Int32Array) => {
    let t = 0;
    for (let r = s; r !== 0; r &= r - 1) t |= 1 << p[31 - Math.clz32(r & -r)];
    return t >>> 0;
  };
  for (let s = 0; s < D; s++) {
    if (orbitOf[s] >= 0) continue;
    const k = reps.length;
    let size = 0;
    for (const p of translations) {
      const g = image(s, p);
      if (orbitOf[g] < 0) { orbitOf[g] = k; size++; }
    }
    reps.push(s); sizes.push(size);
  }
  return { dimension: reps.length, reps: Uint32Array.from(reps), sqrtSize: Float64Array.from(sizes, Math.sqrt), orbitOf };
}

/** y = H(alpha) x in the k = 0 sector; diag holds E_diag of each representative. */
export function translationProduct(b: TranslationBasis, N: number, diag: Float64Array, alpha: number): (x: Float64Array, y: Float64Array) => void {
  const { reps, sqrtSize, orbitOf, dimension: D } = b;
  return (x, y) => {
    for (let k = 0; k < D; k++) {
      const s = reps[k];
      let off = 0;
      for (let i = 0; i < N; i++) { const t = orbitOf[(s ^ (1 << i)) >>> 0]; off += x[t] / sqrtSize[t]; }
      y[k] = diag[k] * x[k] - alpha * sqrtSize[k] * off;
    }
  };
}

/** The full-basis vector psi(g) = psi_R / sqrt |O_R|. */
export function expandToFull(b: TranslationBasis, psi: Float64Array): Float64Array {
  const out = new Float64Array(b.orbitOf.length);
  for (let s = 0; s < out.length; s++) { const k = b.orbitOf[s]; out[s] = psi[k] / b.sqrtSize[k]; }
  return out;
}
