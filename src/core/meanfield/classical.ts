/**
 * Classical lattice gas in one supercell (the alpha = 0, T = 0 limit of the mean field):
 * occupations n_s in {0, 1} per sublattice, energy per site
 *
 *   e(n) = -mu (1/M) sum_s n_s + (1/(2M)) sum_st J_st(0) n_s n_t .
 *
 * At fixed filling p/M the mu term is constant, so the classical ground state of each
 * filling is the pattern minimising n^T J n; found here by brute force over all 2^M
 * patterns in Gray-code order (one flip per step, the energy updated in O(M)).
 * Also the generalised Wigner lattice of a 1D fraction p/q: sites floor(j q/p),
 * j = 0..p-1 (Hubbard, Phys. Rev. B 17, 494 (1978); Pokrovsky and Uimin, J. Phys. C 11,
 * 3535 (1978)), the ground state for any convex repulsion.
 */

/** Largest M brute-forced (2^12 = 4096 patterns). */
export const BRUTE_FORCE_LIMIT = 12;

const minimaCache = new WeakMap<Float64Array, Uint8Array[]>();

/**
 * For each number of occupied sublattices p = 0..M, one pattern minimising n^T J n
 * (first found in Gray-code order on ties). J row-major M x M, M <= BRUTE_FORCE_LIMIT.
 * Cached per J array.
 */
export function classicalMinima(J: Float64Array, M: number): Uint8Array[] {
  const hit = minimaCache.get(J);
  if (hit) return hit;
  if (M > BRUTE_FORCE_LIMIT) throw new Error(`brute force limited to M <= ${BRUTE_FORCE_LIMIT}`);
  const best = new Float64Array(M + 1).fill(Infinity);
  const arg = new Int32Array(M + 1);
  const h = new Float64Array(M); // h = J n
  let mask = 0, count = 0, E = 0;
  best[0] = 0; arg[0] = 0;
  const total = 1 << M;
  for (let k = 1; k < total; k++) {
    // Gray code: flip the lowest set bit of k.
    const s = 31 - Math.clz32(k & -k);
    const on = (mask >> s) & 1;
    if (on) {
      E += -2 * h[s] + J[s * M + s];
      for (let t = 0; t < M; t++) h[t] -= J[t * M + s];
      count--;
    } else {
      E += 2 * h[s] + J[s * M + s];
      for (let t = 0; t < M; t++) h[t] += J[t * M + s];
      count++;
    }
    mask ^= 1 << s;
    if (E < best[count] - 1e-12 * Math.abs(E)) { best[count] = E; arg[count] = mask; }
  }
  const out: Uint8Array[] = [];
  for (let p = 0; p <= M; p++) {
    const n = new Uint8Array(M);
    for (let s = 0; s < M; s++) n[s] = (arg[p] >> s) & 1;
    out.push(n);
  }
  minimaCache.set(J, out);
  return out;
}

/** Generalised Wigner lattice of p particles in period q: sites floor(j q / p). */
export function wignerLattice(p: number, q: number): Uint8Array {
  const n = new Uint8Array(q);
  for (let j = 0; j < p; j++) n[Math.floor((j * q) / p)] = 1;
  return n;
}
