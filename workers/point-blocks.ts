/**
 * Scan points packed into a few typed arrays, so a worker hands the page a whole block of
 * a map in one message whose buffers are transferred, not copied (and not one message, or
 * one structured clone of a nest of small objects, a point).
 *
 * Layout, for the k-th point of a block:
 *   ints[INTS k + 0..9]  index, ix, iy, flags, phase word, fraction word (-1: null),
 *                        cellSize, and the cell's Hermite normal form a, b, c
 *   nums[NUMS k + 0..7]  alpha, emitterDensity, photonDensity, excitationDensity,
 *                        grandPotential, mu, delta, T
 *   subl                 the sublattice densities then the coherences, M each, point after point
 *   words                the distinct phase and fraction strings the ints refer to
 * A state with anything the layout does not hold (a coexistence, an unknown field) travels
 * whole in `whole`; errors travel as [k, text]. Unpacking gives back objects equal to the
 * ones packed, with the keys in the solver's order (cell-search.ts toState).
 */
import type { ScanPoint } from '../src/core/scan/grid.ts';
import type { SolveResult } from '../src/core/meanfield/ground-state.ts';

/** Int32 slots a point. */
export const INTS = 10;
/** Float64 slots a point. */
export const NUMS = 8;

const HAS_STATE = 1, HAS_ERROR = 2, WHOLE = 4;

/** The keys the layout holds, in the solver's order. */
const STATE_KEYS = [
  'phase', 'fraction', 'cellSize', 'cell', 'sublatticeDensities', 'sublatticeCoherences', 'alpha',
  'emitterDensity', 'photonDensity', 'excitationDensity', 'grandPotential', 'mu', 'delta', 'T',
] as const;
const KEY_SET = new Set<string>(STATE_KEYS);

export interface PointBlock {
  count: number;
  ints: Int32Array;
  nums: Float64Array;
  subl: Float64Array;
  words: string[];
  /** Points whose state is sent as it is: [k, state]. */
  whole: Array<[number, SolveResult]>;
  errors: Array<[number, string]>;
}

/** True when the layout holds every field of s exactly. */
function packable(s: SolveResult): boolean {
  const keys = Object.keys(s);
  if (keys.length !== STATE_KEYS.length || !keys.every((k) => KEY_SET.has(k))) return false;
  const c = s.cell;
  return Object.keys(c).length === 3 && [c.a, c.b, c.c, s.cellSize].every((v) => Number.isInteger(v) && Math.abs(v) < 2 ** 31) &&
    Array.isArray(s.sublatticeDensities) && Array.isArray(s.sublatticeCoherences) &&
    s.sublatticeDensities.length === s.cellSize && s.sublatticeCoherences.length === s.cellSize &&
    typeof s.phase === 'string' && (s.fraction === null || typeof s.fraction === 'string');
}

/** Pack points (any order) into one block. */
export function packPoints(points: readonly ScanPoint[]): PointBlock {
  const n = points.length;
  const ints = new Int32Array(INTS * n), nums = new Float64Array(NUMS * n);
  const words: string[] = [], wordId = new Map<string, number>();
  const word = (w: string) => {
    let id = wordId.get(w);
    if (id === undefined) { id = words.length; words.push(w); wordId.set(w, id); }
    return id;
  };
  const whole: Array<[number, SolveResult]> = [], errors: Array<[number, string]> = [];
  let sublLength = 0;
  for (const p of points) if (p.state && packable(p.state)) sublLength += 2 * p.state.cellSize;
  const subl = new Float64Array(sublLength);
  let at = 0;
  points.forEach((p, k) => {
    const i = INTS * k, s = p.state;
    ints[i] = p.index; ints[i + 1] = p.ix; ints[i + 2] = p.iy;
    let flags = 0;
    if (p.error !== undefined) { flags |= HAS_ERROR; errors.push([k, p.error]); }
    if (s) {
      flags |= HAS_STATE;
      if (!packable(s)) {
        flags |= WHOLE;
        whole.push([k, s]);
      } else {
        ints[i + 4] = word(s.phase);
        ints[i + 5] = s.fraction === null ? -1 : word(s.fraction);
        ints[i + 6] = s.cellSize; ints[i + 7] = s.cell.a; ints[i + 8] = s.cell.b; ints[i + 9] = s.cell.c;
        const j = NUMS * k;
        nums[j] = s.alpha; nums[j + 1] = s.emitterDensity; nums[j + 2] = s.photonDensity; nums[j + 3] = s.excitationDensity;
        nums[j + 4] = s.grandPotential; nums[j + 5] = s.mu; nums[j + 6] = s.delta; nums[j + 7] = s.T;
        subl.set(s.sublatticeDensities, at);
        subl.set(s.sublatticeCoherences, at + s.cellSize);
        at += 2 * s.cellSize;
      }
    }
    ints[i + 3] = flags;
  });
  return { count: n, ints, nums, subl, words, whole, errors };
}

/** The buffers of a block, to transfer with it. */
export function blockBuffers(b: PointBlock): ArrayBuffer[] {
  return [b.ints.buffer, b.nums.buffer, b.subl.buffer] as ArrayBuffer[];
}

/** The points of a block, in the order packed. */
export function unpackPoints(b: PointBlock): ScanPoint[] {
  const out: ScanPoint[] = new Array(b.count);
  const whole = new Map(b.whole), errors = new Map(b.errors);
  let at = 0;
  for (let k = 0; k < b.count; k++) {
    const i = INTS * k, flags = b.ints[i + 3];
    const p: ScanPoint = { index: b.ints[i], ix: b.ints[i + 1], iy: b.ints[i + 2] };
    if (flags & HAS_STATE) {
      if (flags & WHOLE) {
        p.state = whole.get(k) as SolveResult;
      } else {
        const M = b.ints[i + 6], j = NUMS * k, fr = b.ints[i + 5];
        p.state = {
          phase: b.words[b.ints[i + 4]] as SolveResult['phase'],
          fraction: fr < 0 ? null : b.words[fr],
          cellSize: M,
          cell: { a: b.ints[i + 7], b: b.ints[i + 8], c: b.ints[i + 9] },
          sublatticeDensities: Array.from(b.subl.subarray(at, at + M)),
          sublatticeCoherences: Array.from(b.subl.subarray(at + M, at + 2 * M)),
          alpha: b.nums[j], emitterDensity: b.nums[j + 1], photonDensity: b.nums[j + 2], excitationDensity: b.nums[j + 3],
          grandPotential: b.nums[j + 4], mu: b.nums[j + 5], delta: b.nums[j + 6], T: b.nums[j + 7],
        };
        at += 2 * M;
      }
    }
    if (flags & HAS_ERROR) p.error = errors.get(k) as string;
    out[k] = p;
  }
  return out;
}
