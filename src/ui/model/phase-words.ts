/**
 * A state's name in the page's words, keeping a locked filling apart from a pattern: the
 * core's `fraction` is the pattern's (occupied sublattices over M), a filling only where
 * the density is locked to it (plateauFraction, the staircase's test); elsewhere (a
 * supersolid, a density wave at T > 0) it is written "pattern p/q", never as a filling.
 * The same distinction is the `lockedFilling` field of the map's CSV and JSON.
 */
import type { MeanFieldState } from '../../core/meanfield/state.ts';
import { plateauFraction } from '../../core/meanfield/plateaus.ts';
import { PHASE_NAMES } from '../plot/phase-palette.ts';

/** "density wave, filling 1/2" (locked) or "supersolid, pattern 1/2" or "superradiant". */
export function phaseWords(s: MeanFieldState, maxCell: number): string {
  const name = PHASE_NAMES[s.phase as keyof typeof PHASE_NAMES] ?? s.phase;
  if (!s.fraction) return name;
  const locked = plateauFraction(s, maxCell);
  return locked ? `${name}, filling ${locked}` : `${name}, pattern ${s.fraction}`;
}

/** The short map label of a region: "1/2" where locked, "p 1/2" (a pattern) elsewhere. */
export function regionWord(s: MeanFieldState, maxCell: number): string {
  if (!s.fraction) return '';
  return plateauFraction(s, maxCell) ? s.fraction : `p ${s.fraction}`;
}
