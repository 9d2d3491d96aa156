/**
 * The linked vertex list of an operator string (Sandvik, Phys. Rev. E 68, 056701 (2003)):
 * slot p owns legs 4p..4p+3, leg 4p + 0 below and 4p + 2 above on site i, 4p + 1 and
 * 4p + 3 on site j of a bond. link[v] is the next leg along the same site's imaginary-time
 * line (an above leg links to the next below leg, periodically), spin[v] the occupation on
 * leg v. Site and field operators use legs 0 and 2 only. Off-diagonal updates act on the
 * spins and the operator kinds, and the state at the start of the string is read back from
 * the first leg of each site's line. The same pass counts what the estimators need
 * (sse-sample.ts): the operators, the flip operators, and sum_p N(p), sum_p N(p)^2 over the
 * excitation numbers N(p) of the propagated states.
 */
import type { SseConfig } from './operator-string.ts';
import { SLOT } from './slots.ts';

export interface VertexLinks {
  link: Int32Array;
  spin: Uint8Array;
  /** First below leg on site i, or -1 when no operator acts on it. */
  readonly first: Int32Array;
  readonly last: Int32Array;
  /** Working copy of the state while propagating. */
  readonly current: Uint8Array;
  /** Counts of the last pass: operators, flips, N at p = 0, sum_p N(p), sum_p N(p)^2. */
  readonly counts: { operators: number; flips: number; start: number; sum: number; sum2: number };
}

// Slot kinds as local constants: imported bindings cost a check on every read in hot loops.
const { EMPTY: SLOT_EMPTY, BOND: SLOT_BOND, FLIP: SLOT_FLIP } = SLOT;

/** Storage for N sites and L slots. */
export function vertexLinks(N: number, L: number): VertexLinks {
  return {
    link: new Int32Array(4 * L), spin: new Uint8Array(4 * L), first: new Int32Array(N), last: new Int32Array(N), current: new Uint8Array(N),
    counts: { operators: 0, flips: 0, start: 0, sum: 0, sum2: 0 },
  };
}

/** Fill the links and leg spins of configuration c (grows the storage with c.L). */
export function linkVertices(c: SseConfig, v: VertexLinks): VertexLinks {
  if (v.link.length < 4 * c.L) { v.link = new Int32Array(4 * c.L); v.spin = new Uint8Array(4 * c.L); }
  const { link, spin, first, last, current } = v;
  const { kind, siteA, siteB } = c;
  first.fill(-1); last.fill(-1);
  current.set(c.state);
  let Ncur = 0, operators = 0, flips = 0, sum = 0, sum2 = 0;
  for (let i = 0; i < c.N; i++) Ncur += current[i];
  const start = Ncur;
  const connect = (i: number, below: number, above: number) => {
    const l = last[i];
    if (l >= 0) { link[l] = below; link[below] = l; } else first[i] = below;
    last[i] = above;
  };
  for (let p = 0; p < c.L; p++) {
    const k = kind[p];
    if (k === SLOT_EMPTY) continue;
    const v0 = 4 * p, i = siteA[p];
    operators++; sum += Ncur; sum2 += Ncur * Ncur;
    spin[v0] = current[i];
    if (k === SLOT_FLIP) { flips++; Ncur += current[i] ? -1 : 1; current[i] ^= 1; }
    spin[v0 + 2] = current[i];
    connect(i, v0, v0 + 2);
    if (k === SLOT_BOND) {
      const j = siteB[p];
      spin[v0 + 1] = spin[v0 + 3] = current[j];
      connect(j, v0 + 1, v0 + 3);
    }
  }
  for (let i = 0; i < c.N; i++) {
    if (first[i] >= 0) { link[first[i]] = last[i]; link[last[i]] = first[i]; }
  }
  const n = v.counts;
  n.operators = operators; n.flips = flips; n.start = start; n.sum = sum; n.sum2 = sum2;
  return v;
}

/** The state at the start of the string after off-diagonal updates: the first leg's spin. */
export function readBackState(c: SseConfig, v: VertexLinks): void {
  for (let i = 0; i < c.N; i++) if (v.first[i] >= 0) c.state[i] = v.spin[v.first[i]];
}
