/**
 * The whole state of the page as plain strings, exactly as typed (so an invalid entry
 * survives a reload and the URL shows what the user wrote). Model keys are the command
 * line's flag names, so the URL, the form and "copy as command" speak one language.
 * The defaults are the demo scenario: invented for this tool, not taken from any
 * experiment or publication.
 */

export const VIEWS = ['atlas', 'staircase', 'modes', 'correlated', 'planner'] as const;
export type ViewName = (typeof VIEWS)[number];

export const MODEL_KEYS = [
  'lattice', 'interaction', 'strength', 'rb', 'v1', 'v2', 'v0', 'rc', 'range',
  'detuning', 'pump', 'mu', 'density', 'temperature', 'max-cell',
] as const;
export type ModelKey = (typeof MODEL_KEYS)[number];
export type ModelInputs = Record<ModelKey, string>;

export interface AppState {
  view: ViewName;
  model: ModelInputs;
  atlas: {
    x: string; y: string; lines: string; shade: string; point: string;
    /** Colour range "lo:hi" of a continuous colouring (empty: automatic), and '1' for a log scale. */
    crange: string; clog: string;
    /** "Check this boundary" (QMC line scan): the line "x0,y0;x1,y1" in map units, sizes, points, sweeps, T, ground ('1' or ''). */
    check: string; sizes: string; cpoints: string; csweeps: string; ctemp: string; cground: string;
  };
  staircase: { mu: string; compare: string };
  modes: { points: string; cell: string };
  correlated: {
    method: string; cluster: string; size: string; alpha: string; seed: string; steps: string; samples: string; sites: string;
    /** QMC: temperature T, ground-state mode ('1' or ''), sweeps per chain, chains, points of the alpha grid. */
    temperature: string; ground: string; sweeps: string; chains: string; apoints: string;
  };
  planner: {
    c6: string; spacing: string; coupling: string; g0: string; emitters: string; splitting: string;
    detuning: string; mu: string; temperature: string; tunit: string;
    /** Losses: cavity linewidth, emitter decay and dephasing, full widths in MHz (blank: not asked). */
    kappa: string; gamma: string; dephasing: string;
    /** Standard uncertainties (one sigma) of the spacing (um), the detuning and the pump (MHz); blank = exact. */
    dspacing: string; ddetuning: string; dmu: string;
  };
  /**
   * The lab's operating point put on every view by the planner's "use these numbers", in
   * model units with its one-sigma tolerances (src/core/lab/operating-point.ts); all blank
   * when there is none. `linear` is '1' while the first-order box is a fair picture.
   */
  lab: {
    rb: string; drb: string; v1: string; dv1: string; detuning: string; ddetuning: string;
    mu: string; dmu: string; temperature: string; g: string; linear: string;
  };
}

export type SectionName = Exclude<keyof AppState, 'view'>;

/** The demo scenario (invented): a van der Waals chain with the cavity detuned above the line. */
export function demoState(): AppState {
  return {
    view: 'atlas',
    model: {
      lattice: 'chain', interaction: 'vdw', strength: 'rb', rb: '1.5', v1: '1', v2: '0', v0: '4', rc: '1.5',
      range: '', detuning: '3', pump: 'mu', mu: '1', density: '0.3', temperature: '0', 'max-cell': '12',
    },
    atlas: {
      x: 'mu=-1..2.9 x64', y: 'rb=0.8..2.4 x40', lines: 'vdw:inf', shade: 'phase', point: '', crange: '', clog: '',
      check: '', sizes: '8,12,16', cpoints: '9', csweeps: '200', ctemp: '0.05', cground: '',
    },
    staircase: { mu: '-1..2.9 x400', compare: '1' },
    modes: { points: '96', cell: '' },
    correlated: {
      method: 'ed', cluster: 'periodic', size: '12', alpha: '', seed: '7', steps: '60', samples: '4000', sites: '',
      temperature: '0.1', ground: '', sweeps: '200', chains: '2', apoints: '8',
    },
    planner: {
      c6: '140', spacing: '4', coupling: 'single', g0: '0.5', emitters: '200', splitting: '',
      detuning: '21', mu: '7', temperature: '0', tunit: 'uK', kappa: '', gamma: '', dephasing: '',
      dspacing: '0.02', ddetuning: '0.5', dmu: '0.5',
    },
    lab: emptyLab(),
  };
}

/** No operating point (the lab section all blank). */
export function emptyLab(): AppState['lab'] {
  return { rb: '', drb: '', v1: '', dv1: '', detuning: '', ddetuning: '', mu: '', dmu: '', temperature: '', g: '', linear: '' };
}

/** A deep copy (states are small plain objects of strings). */
export function cloneState(s: AppState): AppState {
  return JSON.parse(JSON.stringify(s)) as AppState;
}
