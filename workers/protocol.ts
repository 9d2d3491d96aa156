/**
 * The wire contract between the page or the CLI and the engine workers: requests and
 * results as plain data (structured-clone safe: numbers, strings, arrays, plain objects;
 * no classes, no functions except Comlink-proxied callbacks). Types only.
 */
import type { ModelParams } from '../src/core/model.ts';
import type { MeanFieldState } from '../src/core/meanfield/state.ts';
import type { SolveResult } from '../src/core/meanfield/ground-state.ts';

export type { ModelParams, MeanFieldState, SolveResult };

/** One mean-field point. */
export interface SolveRequest {
  params: ModelParams;
  seed?: number;
  /** A neighbouring point's state, tried as an extra start. */
  guess?: MeanFieldState;
}

/**
 * A run of points solved in order on one worker (a segment of a scan row). With
 * continuation each point after the first gets the previous state as its guess.
 */
export interface SolveRunRequest {
  points: ModelParams[];
  /** One seed a point (same length as points). */
  seeds: number[];
  continuation: boolean;
}

/** Streams a run's states as they finish: i is the position within the run. */
export type PointCallback<R> = (i: number, result: R) => void;

/** A solved scan point as the pool hands it back. */
export interface ScanPointResult {
  /** iy * nx + ix. */
  index: number;
  ix: number;
  iy: number;
  state: SolveResult;
}

/** What a worker says about itself (warm-up probe). */
export interface EngineInfo {
  /** Method groups exposed (meanfield, spectrum, ...). */
  groups: string[];
}

/**
 * Refine one plateau's edges by bisection (refinePlateaus) at the base parameters with mu
 * varied: `below` / `above` are the scan states just off the plateau (absent at an end).
 */
export interface PlateauEdgeRequest {
  base: ModelParams;
  plateau: import('../src/core/meanfield/plateaus.ts').Plateau;
  below?: MeanFieldState;
  above?: MeanFieldState;
  seed: number;
  /** Edge tolerance in mu (units of g). */
  muTol: number;
}
