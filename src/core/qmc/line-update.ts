/**
 * Line (segment) updates, the local off-diagonal move that keeps working under strong
 * blockade where multibranch clusters grow over the whole string (Merali, De Vlugt and
 * Melko, SciPost Phys. Core 7, 016 (2024)).
 *
 * On one site's imaginary-time line the site operators (constant or flip) cut the line into
 * segments. Flipping the occupation along one segment turns both of its end operators from
 * constant into flip or back (equal weights alpha) and changes the weight of every diagonal
 * operator inside through that site's leg:
 *   R = prod_{b in segment} W_b(n with this site flipped) / W_b(n),
 * accepted with probability min(1, R). A line without site operators is flipped whole,
 * which at alpha = 0 (no site operators at all) is the classical single-site move that an
 * operator string otherwise lacks. A line without any operator is free (R = 1) and is set
 * to either occupation with probability 1/2.
 */
import type { SseConfig } from './operator-string.ts';
import { SLOT } from './slots.ts';
import type { SseTerms } from './sse-terms.ts';
import type { VertexLinks } from './vertex-links.ts';

export interface LineScratch {
  line: Int32Array;
  cuts: Int32Array;
}

// Slot kinds as local constants: imported bindings cost a check on every read in hot loops.
const { CONST: SLOT_CONST, FIELD: SLOT_FIELD, FLIP: SLOT_FLIP } = SLOT;

/** Scratch storage for lines of up to L vertices. */
export function lineScratch(L: number): LineScratch {
  return { line: new Int32Array(L), cuts: new Int32Array(L) };
}

/** W(with the site on leg v flipped) / W for the diagonal operator owning below leg v. */
function legRatio(c: SseConfig, t: SseTerms, spin: Uint8Array, v: number): number {
  const q = v >> 2;
  if (c.kind[q] === SLOT_FIELD) return t.fieldW[1 - spin[v]] / t.fieldW[spin[v]];
  const x = 4 * c.cls[q] + 2 * spin[4 * q] + spin[4 * q + 1];
  return (v & 1) === 0 ? t.flipI[x] : t.flipJ[x];
}

/** Try every segment of every site's line once; free sites get a random occupation. Returns accepted flips. */
export function lineUpdate(c: SseConfig, t: SseTerms, v: VertexLinks, s: LineScratch, rng: () => number): number {
  const { link, spin, first } = v;
  const kind = c.kind;
  let accepted = 0;
  for (let i = 0; i < c.N; i++) {
    const f = first[i];
    if (f < 0) { c.state[i] = rng() < 0.5 ? 0 : 1; continue; }
    // The line in time order: below legs of the vertices on site i.
    let m = 0, nc = 0;
    for (let w = f; ;) {
      if (m >= s.line.length) { s.line = grow(s.line); s.cuts = grow(s.cuts); }
      const k = kind[w >> 2];
      if (k === SLOT_CONST || k === SLOT_FLIP) s.cuts[nc++] = m;
      s.line[m++] = w;
      w = link[w + 2];
      if (w === f) break;
    }
    const line = s.line;
    if (nc === 0) {
      let ratio = 1;
      for (let h = 0; h < m; h++) ratio *= legRatio(c, t, spin, line[h]);
      if (ratio >= 1 || rng() < ratio) {
        for (let h = 0; h < m; h++) { spin[line[h]] ^= 1; spin[line[h] + 2] ^= 1; }
        accepted++;
      }
      continue;
    }
    for (let a = 0; a < nc; a++) {
      const start = s.cuts[a], end = s.cuts[(a + 1) % nc];
      let ratio = 1;
      for (let h = (start + 1) % m; h !== end; h = (h + 1) % m) ratio *= legRatio(c, t, spin, line[h]);
      if (!(ratio >= 1 || rng() < ratio)) continue;
      for (let h = (start + 1) % m; h !== end; h = (h + 1) % m) { spin[line[h]] ^= 1; spin[line[h] + 2] ^= 1; }
      const ps = line[start] >> 2, pe = line[end] >> 2;
      spin[line[start] + 2] ^= 1; kind[ps] = kind[ps] === SLOT_CONST ? SLOT_FLIP : SLOT_CONST;
      spin[line[end]] ^= 1; kind[pe] = kind[pe] === SLOT_CONST ? SLOT_FLIP : SLOT_CONST;
      accepted++;
    }
  }
  return accepted;
}

function grow(a: Int32Array): Int32Array {
  const b = new Int32Array(2 * a.length + 16);
  b.set(a);
  return b;
}

