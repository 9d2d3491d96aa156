/**
 * The whole wire contract between the page or the CLI and the engine workers: requests
 * and results as plain data (structured-clone safe: numbers, strings, arrays, plain
 * objects; no classes, no functions except Comlink-proxied callbacks). Types only.
 *
 * Two levels: the engine's methods (one worker call each: a point, a run of points, one
 * plateau's edges, a spectrum, a soft-mode trace, ED, a VMC segment), and scans
 * (ScanKinds), which the scan driver (scan-driver.ts) cuts into such calls on the pool.
 * The same scan request gives the same answer from the page and from the CLI.
 */
import type { ModelParams } from '../src/core/model.ts';
import type { MeanFieldState } from '../src/core/meanfield/state.ts';
import type { SolveResult } from '../src/core/meanfield/ground-state.ts';
import type { Plateau } from '../src/core/meanfield/plateaus.ts';
import type { ScanPlan, ScanPoint, Segment } from '../src/core/scan/grid.ts';
import type { Shard } from '../src/core/scan/shards.ts';
import type { Boundary } from '../src/core/scan/boundaries.ts';
import type { AdaptivePixel, ColdPoint, FilledPoint } from '../src/core/scan/certified-fill.ts';
import type { PackedSegment } from '../src/core/scan/segment-pixels.ts';
import type { PhaseMargin, PhaseMarginOptions } from '../src/core/scan/phase-margin.ts';
import type { SpectrumRequest, StateSpectrum } from '../src/core/spectrum/state-spectrum.ts';
import type { SoftLineRequest, SoftLineResult } from '../src/core/softmode/soft-lines.ts';
import type { EdRequest, EdResult } from '../src/core/ed/exact-diagonalisation.ts';
import type { SegmentRequest, SegmentResult } from '../src/core/vmc/segment.ts';

export type { Boundary, AdaptivePixel, ColdPoint, FilledPoint };
export type {
  ModelParams, MeanFieldState, SolveResult, Plateau, ScanPlan, ScanPoint, Shard, PhaseMargin, PhaseMarginOptions,
  SpectrumRequest, StateSpectrum, SoftLineRequest, SoftLineResult, EdRequest, EdResult, SegmentRequest, SegmentResult,
};

// ---- engine methods -------------------------------------------------------------------

/** One mean-field point. */
export interface SolveRequest {
  params: ModelParams;
  seed?: number;
  /** A neighbouring point's state, tried as an extra start. */
  guess?: MeanFieldState;
}

/**
 * A run of points solved in order on one worker (a segment of a scan row). With
 * continuation each point after the first gets the previous solved state as its guess.
 */
export interface SolveRunRequest {
  points: ModelParams[];
  /** One seed a point (same length as points). */
  seeds: number[];
  continuation: boolean;
}

/** One point of a run: its state, or (when it could not be solved) why not, in one line. */
export interface PointOutcome {
  state?: SolveResult;
  error?: string;
}

/** Streams a run's outcomes as they finish: i is the position within the run. */
export type PointCallback<R> = (i: number, result: R) => void;

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
  plateau: Plateau;
  below?: MeanFieldState;
  above?: MeanFieldState;
  seed: number;
  /** Edge tolerance in mu (units of g). */
  muTol: number;
}

/** The spectrum about a state already solved (a clicked map point): no second solve. */
export interface StateSpectrumRequest {
  params: ModelParams;
  state: SolveResult;
  /** Points along the zone path (default 129). */
  points?: number;
}

/** The phase margin of one point (src/core/scan/phase-margin.ts), solved in a worker. */
export interface PhaseMarginRequest extends PhaseMarginOptions {
  params: ModelParams;
}

// ---- scans ----------------------------------------------------------------------------

/**
 * A map or a line: the plan's grid points, cut into row segments (src/core/scan/grid.ts),
 * each solved in order on one worker with continuation. `order` changes only the order in
 * which segments are handed out ('spread': rows coarse to fine, for a first picture),
 * never an answer.
 */
export interface MapScanRequest {
  kind: 'map';
  plan: ScanPlan;
  /** Only this part of an n-part job array. */
  shard?: Shard;
  /** Pass each state to the next point of its segment as a guess (default true). */
  continuation?: boolean;
  order?: 'rows' | 'spread';
  /**
   * true: solve every pixel (the check of the adaptive map). Default false: the adaptive map
   * (workers/scans/adaptive-map-scan.ts; docs/certified-maps.md), same pixels, fewer solves.
   */
  dense?: boolean;
  /**
   * Only these segments of the plan's grid (in this order; shard is then ignored): the CLI
   * streams a big map a window of segments at a time and resumes a part where it stopped.
   */
  segments?: Segment[];
  /**
   * Only the rows from this one on (a resumed CLI map; segments then unused). The adaptive
   * map takes whole rows, so a resumed map stays adaptive.
   */
  fromRow?: number;
}

/** The points of a map scan, ordered by index (failed points carry their error). */
export interface MapScanResult {
  points: ScanPoint[];
  /** Points really solved in full (the adaptive map; a dense map solves every pixel). */
  solves?: number;
  /** Of those, the solves that located boundaries (confirming crystal crossings). */
  boundarySolves?: number;
  /** Points solved in one cell only (a map refined without certification: T > 0, a temperature axis). */
  cellSolves?: number;
  /** Phase boundaries as polylines (src/core/scan/boundaries.ts). */
  boundaries?: Boundary[];
  /** What the adaptive map could not do here (no certification, a shard solved densely). */
  notes?: string[];
}

/** A row segment of an adaptive map, filled point by point as the dense scan would (certified-fill.ts). */
export interface FillSegmentRequest {
  /** The pixels in the compact form (segment-pixels.ts): one or more neighbouring segments of a row. */
  segment: PackedSegment;
  /** Lengths of the segments it holds, in order (default: one segment); each is filled on its own. */
  cuts?: number[];
  continuation: boolean;
}

/** Points solved without a guess (an adaptive map's refinement corners). */
export interface ColdRunRequest {
  points: ModelParams[];
  seeds: number[];
}

/** One cold point: its state with its search cell, or why it failed. */
export interface ColdOutcome {
  cold?: ColdPoint;
  error?: string;
}

/** A mu line (plan.x is the mu axis, no y) and its plateaus, edges bisected to edgeTol unless gridEdges. */
export interface StaircaseRequest {
  kind: 'staircase';
  plan: ScanPlan;
  gridEdges?: boolean;
  /** Edge tolerance of the bisection, units of g (default 1e-9). */
  edgeTol?: number;
}

export interface StaircaseResult {
  points: ScanPoint[];
  plateaus: Plateau[];
  /** Every plateau's edges were bisected (false with gridEdges or when a bisection failed). */
  refined: boolean;
  /** Why an edge bisection failed (the plateau keeps its grid edges). */
  edgeErrors: string[];
}

/** How far a point is from the nearest change of phase along mu (one worker task). */
export interface PhaseMarginScanRequest extends PhaseMarginRequest {
  kind: 'phase-margin';
}

/** Soft-mode traces, one worker task a line request (the CLI's softlines, the map's overlays). */
export interface SoftLinesScanRequest {
  kind: 'soft-lines';
  lines: SoftLineRequest[];
}

export interface SoftLinesScanResult {
  results: SoftLineResult[];
}

/**
 * Every scan kind: its request, its result, and what it streams while it runs. A new kind
 * adds an entry here and a runner in workers/scans/ (see scan-driver.ts).
 */
export interface ScanKinds {
  map: { request: MapScanRequest; result: MapScanResult; item: ScanPoint };
  staircase: { request: StaircaseRequest; result: StaircaseResult; item: ScanPoint };
  'phase-margin': { request: PhaseMarginScanRequest; result: PhaseMargin; item: never };
  'soft-lines': { request: SoftLinesScanRequest; result: SoftLinesScanResult; item: { index: number; result: SoftLineResult } };
}

export type ScanKind = keyof ScanKinds;
export type ScanRequest = ScanKinds[ScanKind]['request'];
export type ScanResult<K extends ScanKind> = ScanKinds[K]['result'];
export type ScanItem<K extends ScanKind> = ScanKinds[K]['item'];

/** How a caller follows and bounds a scan (not part of the request: it changes no answer). */
export interface ScanOptions<Item> {
  signal?: AbortSignal;
  /** Each finished item (a point, a traced line) as it arrives, in completion order. */
  onItem?: (item: Item) => void;
  /** Work done and the total (points, or tasks), after each piece. */
  onProgress?: (done: number, total: number) => void;
  /** Watchdog budget of one point in ms (a task gets this times its points; default 120 s). */
  pointBudgetMs?: number;
  /** Stream each point through a Comlink callback as it finishes (default: a segment at a time). */
  streamPoints?: boolean;
  /**
   * false: keep none of the items; each goes only to onItem and the result's list is empty
   * (memory independent of the scan's size; a map keeps only the indices it delivered, to
   * drop a point that arrives twice). Default true.
   */
  keepPoints?: boolean;
  /**
   * Awaited before each band of rows of an adaptive map (the CLI: until stdout has drained),
   * so a slow reader of the output pauses the scan instead of rows queueing in memory.
   */
  ready?: () => Promise<void>;
}

// ---- quantum Monte Carlo (workers/api/qmc.ts, qmc-run.ts, qmc-scan.ts) -----------------

export type { SseChainRequest, SseChainResult } from '../src/core/qmc/sse-chain.ts';
export type { QmcRequest, QmcResult } from '../src/core/qmc/quantum-monte-carlo.ts';

/** A QMC run's progress: chains done of the chains handed out so far, and the current batch. */
export interface QmcProgress {
  done: number;
  total: number;
  stage: 'grid' | 'refine' | 'measure';
  beta: number;
}

/** Axes of a QMC line scan (workers/qmc-scan-plan.ts). */
export type QmcAxisName = 'mu' | 'temperature' | 'detuning' | 'alpha' | 'rb' | 'v1';

/** One QMC run per cluster size L (ring of L, or L x L) and axis value; `base.cluster` gives lattice and interaction. */
export interface QmcScanRequest {
  base: import('../src/core/qmc/quantum-monte-carlo.ts').QmcRequest;
  sizes: number[];
  axis: { name: QmcAxisName; values: number[] };
  /** Only the points with index mod n = k - 1. */
  shard?: { k: number; n: number };
}

/** A finished run of a scan: index = iSize * count + ix; its result, or why it failed. */
export interface QmcScanPoint {
  index: number;
  size: number;
  ix: number;
  value: number;
  result?: import('../src/core/qmc/quantum-monte-carlo.ts').QmcResult;
  error?: string;
}
