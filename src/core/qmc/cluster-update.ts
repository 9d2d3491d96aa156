/**
 * Multibranch cluster update of the transverse-field term (Sandvik, Phys. Rev. E 68,
 * 056701 (2003)), with a Metropolis acceptance for bonds whose weights are not symmetric
 * (Merali, De Vlugt and Melko, SciPost Phys. Core 7, 016 (2024)).
 *
 * A cluster grows through every leg of a diagonal bond or field operator and along the
 * site lines, and ends at site operators (each of their two legs belongs to its own
 * cluster). Flipping a cluster flips the occupation on all its legs; a site operator with
 * one leg in the cluster turns from constant into flip or back (both weigh alpha), so the
 * weight changes only through the diagonal operators inside:
 *   R = prod_{b in cluster} W_b(1 - n_i, 1 - n_j) / W_b(n_i, n_j),
 * and each cluster is flipped with probability min(1, R). The decomposition into clusters
 * does not depend on the spins, so the flips are independent Metropolis moves.
 */
import { type SseConfig, BOND, CONST, EMPTY, FIELD, FLIP } from './operator-string.ts';
import type { SseTerms } from './sse-terms.ts';
import type { VertexLinks } from './vertex-links.ts';

export interface ClusterScratch {
  visited: Uint8Array;
  queue: Int32Array;
}

/** Scratch storage for strings of up to L slots. */
export function clusterScratch(L: number): ClusterScratch {
  return { visited: new Uint8Array(4 * L), queue: new Int32Array(4 * L) };
}

/** Build every cluster once and flip each with probability min(1, R); returns the number flipped. */
export function clusterUpdate(c: SseConfig, t: SseTerms, v: VertexLinks, s: ClusterScratch, rng: () => number): number {
  if (s.visited.length < 4 * c.L) { s.visited = new Uint8Array(4 * c.L); s.queue = new Int32Array(4 * c.L); }
  const { visited, queue } = s;
  visited.fill(0, 0, 4 * c.L);
  const { kind, cls } = c, { link, spin } = v;
  const bondW = t.bondW, fieldW = t.fieldW;
  let flipped = 0;
  for (let p = 0; p < c.L; p++) {
    const k = kind[p];
    if (k === EMPTY) continue;
    const legs = k === BOND ? 4 : 3;
    for (let leg = 0; leg < legs; leg++) {
      if (k !== BOND && leg === 1) continue;
      const start = 4 * p + leg;
      if (visited[start]) continue;
      let head = 0, tail = 0, ratio = 1;
      queue[tail++] = start; visited[start] = 1;
      while (head < tail) {
        const w = queue[head++], q = w >> 2, kq = kind[q];
        if (kq === BOND || kq === FIELD) {
          if ((w & 3) === 0) {
            if (kq === BOND) {
              const b = 4 * cls[q], si = spin[4 * q], sj = spin[4 * q + 1];
              ratio *= bondW[b + 2 * (1 - si) + (1 - sj)] / bondW[b + 2 * si + sj];
            } else {
              ratio *= fieldW[1 - spin[4 * q]] / fieldW[spin[4 * q]];
            }
          }
          const base = 4 * q;
          for (let l = 0; l < 4; l++) {
            if (kq !== BOND && (l & 1)) continue;
            if (!visited[base + l]) { visited[base + l] = 1; queue[tail++] = base + l; }
          }
        }
        const nx = link[w];
        if (!visited[nx]) { visited[nx] = 1; queue[tail++] = nx; }
      }
      if (ratio >= 1 || rng() < ratio) {
        flipped++;
        for (let h = 0; h < tail; h++) {
          const w = queue[h], q = w >> 2;
          spin[w] ^= 1;
          if (kind[q] === CONST) kind[q] = FLIP; else if (kind[q] === FLIP) kind[q] = CONST;
        }
      }
    }
  }
  return flipped;
}
