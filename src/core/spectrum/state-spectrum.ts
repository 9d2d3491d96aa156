/**
 * Spectrum and stability of a solved point, as the `spectrum` command and the page ask for
 * it: the mean-field state (solveGroundState; p.cell restricts it to supercells of that
 * size, e.g. 1 for the uniform condensate where it is not the ground state), its branches
 * along the zone path with the stability margin at each path point, and its softest mode
 * over the zone. Plain data in and out.
 */
import { solveGroundState, type SolveResult } from '../meanfield/ground-state.ts';
import type { ModelParams } from '../model.ts';
import { background, inputFromState } from './background.ts';
import { fluctuationSpectrum, type Spectrum } from './spectrum.ts';
import { softestMode, marginsAt, type SoftMode, type SoftestOptions } from '../softmode/softest.ts';
import { zonePath } from './zone-path.ts';

/** A spectrum request as plain data (what the engine worker's spectrum.spectrum takes). */
export interface SpectrumRequest {
  params: ModelParams;
  seed?: number;
  /** Points along the zone path (default 129). */
  points?: number;
}

export interface StateSpectrumOptions {
  seed?: number;
  /** Points along the zone path (default 129). */
  points?: number;
  zone?: SoftestOptions;
}

export interface StateSpectrum extends Spectrum {
  state: SolveResult;
  /** Lowest eigenvalue of the stability matrix at each path point (aligned with branches). */
  margins: number[];
  softMode: SoftMode;
}

/** Solve p and expand about the state found. */
export function stateSpectrum(p: ModelParams, o: StateSpectrumOptions = {}): StateSpectrum {
  const state = solveGroundState(p, { seed: o.seed });
  const bg = background(inputFromState(state, p));
  const sp = fluctuationSpectrum(bg, { points: o.points });
  const margins = marginsAt(bg, zonePath(bg.l, o.points ?? 129).k);
  const { evaluations: _e, ...softMode } = softestMode(bg, o.zone);
  return { state, ...sp, margins, softMode };
}
