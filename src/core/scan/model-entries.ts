/**
 * The one parser of text entries into ModelParams, used by the CLI's model flags and by
 * the page's model form (whose entries carry the flags' names). Each entry is read on its
 * own, so every problem names its field; interaction strength, detuning and pump have no
 * defaults (a result never rests on a value the user did not choose), and entries that do
 * not apply to the chosen interaction are refused rather than ignored. The parameters a
 * scan axis sets per point must be absent and count as given (AXIS_ENTRIES).
 */
import { INTERACTION_SHAPES, type InteractionShape, type InteractionSpec } from '../interaction/potential.ts';
import { LATTICE_NAMES, type LatticeName } from '../lattice/geometry.ts';
import { defaultMaxCell, type ModelParams } from '../model.ts';
import type { AxisName } from './axes.ts';

/** Entry names: the CLI's model flags, which the form's fields are named after. */
export type ModelEntry =
  | 'lattice' | 'interaction' | 'rb' | 'v1' | 'v2' | 'v0' | 'rc' | 'range'
  | 'detuning' | 'mu' | 'density' | 'temperature' | 'max-cell' | 'cell';

/** Entries as typed; an absent entry was not given. */
export type ModelEntries = Partial<Record<ModelEntry, string>>;

/** The entries each scan axis sets (the axis value replaces them, so giving both is refused). */
export const AXIS_ENTRIES: Record<AxisName, ModelEntry[]> = {
  rb: ['rb', 'v1'], v1: ['rb', 'v1'], mu: ['mu', 'density'], density: ['mu', 'density'],
  detuning: ['detuning'], temperature: ['temperature'],
};

/** The strength entries each interaction shape takes. */
export const SHAPE_ENTRIES: Record<InteractionShape, ModelEntry[]> = {
  nn: ['v1', 'v2'], vdw: ['rb', 'v1'], dipolar: ['rb', 'v1'], softcore: ['v0', 'rc'],
};

/** One problem with the entries: the field it sits in and a one-line message. */
export interface EntryProblem {
  field: ModelEntry;
  message: string;
}

export interface ParsedEntries {
  /** The parameters, or null when any entry is wrong. */
  params: ModelParams | null;
  /** Every problem found, in reading order (the CLI reports the first). */
  problems: EntryProblem[];
}

export interface EntryOptions {
  /** Parameters a scan sets per point. */
  axes?: readonly AxisName[];
  /** How a message names an entry (CLI: `--mu`; default the bare name). */
  name?: (e: ModelEntry) => string;
  /** Who needs the entries, for "needs" messages (a command name). */
  who?: string;
}

/**
 * A number as typed: decimal or exponent form with an optional sign (a Unicode minus
 * counts as one), surrounding spaces ignored; NaN for anything else (hex, '', '1x').
 */
export function parseEntryNumber(text: string): number {
  const t = text.trim().replace('\u2212', '-');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return NaN;
  return Number(t);
}

/** Parse the entries into ModelParams, collecting every problem. */
export function parseModelEntries(e: ModelEntries, o: EntryOptions = {}): ParsedEntries {
  const axes = o.axes ?? [];
  const name = o.name ?? ((x: ModelEntry) => x);
  const who = o.who ?? 'the model';
  const problems: EntryProblem[] = [];
  const fail = (field: ModelEntry, message: string) => void problems.push({ field, message });
  const given = (f: ModelEntry) => e[f] !== undefined;
  const number = (f: ModelEntry): number | undefined => {
    const t = e[f];
    if (t === undefined) return undefined;
    const x = parseEntryNumber(t);
    if (!Number.isFinite(x)) { fail(f, `${name(f)} must be a finite number, got '${t}'`); return undefined; }
    return x;
  };
  const whole = (f: ModelEntry): number | undefined => {
    const t = e[f];
    if (t === undefined) return undefined;
    if (!/^\s*[+]?\d+\s*$/.test(t)) { fail(f, `${name(f)} must be a whole number, got '${t}'`); return undefined; }
    return Number(t);
  };
  for (const ax of axes) {
    for (const f of AXIS_ENTRIES[ax]) if (given(f)) fail(f, `${name(f)} conflicts with the ${ax} axis of the scan; leave it out`);
  }
  const lat = (e.lattice ?? 'chain').trim() as LatticeName;
  if (!LATTICE_NAMES.includes(lat)) fail('lattice', `unknown lattice '${lat}' (use ${LATTICE_NAMES.join(', ')})`);
  const interaction = interactionOf(e, axes, name, number, problems);
  const delta = number('detuning');
  if (!given('detuning') && !axes.includes('detuning')) fail('detuning', `${who} needs ${name('detuning')} (the cavity detuning delta, units of g)`);
  const mu = number('mu'), rho = number('density');
  const pumpAxis = axes.includes('mu') || axes.includes('density');
  if (!pumpAxis && !given('mu') && !given('density')) {
    fail('mu', `${who} needs ${name('mu')} (chemical potential) or ${name('density')} (excitation density)`);
  }
  if (given('mu') && given('density')) fail('mu', `give ${name('mu')} or ${name('density')}, not both`);
  const T = number('temperature');
  const maxCell = whole('max-cell');
  const cell = whole('cell');
  if (problems.length > 0 || !interaction) return { params: null, problems };
  const p: ModelParams = { lattice: lat, interaction, delta: delta ?? 0, T: T ?? 0, maxCell: maxCell ?? defaultMaxCell(lat) };
  if (mu !== undefined) p.mu = mu;
  if (rho !== undefined) p.rho = rho;
  if (cell !== undefined) p.cell = cell;
  return { params: p, problems };
}

/** The interaction entries as an InteractionSpec (null after a problem). */
function interactionOf(
  e: ModelEntries, axes: readonly AxisName[], name: (x: ModelEntry) => string,
  number: (f: ModelEntry) => number | undefined, problems: EntryProblem[],
): InteractionSpec | null {
  const fail = (field: ModelEntry, message: string) => void problems.push({ field, message });
  const shape = (e.interaction ?? 'vdw').trim() as InteractionShape;
  if (!INTERACTION_SHAPES.includes(shape)) {
    fail('interaction', `unknown interaction '${shape}' (use ${INTERACTION_SHAPES.join(', ')})`);
    return null;
  }
  const before = problems.length;
  for (const f of ['rb', 'v1', 'v2', 'v0', 'rc'] as const) {
    if (e[f] !== undefined && !SHAPE_ENTRIES[shape].includes(f)) {
      fail(f, `${name(f)} does not apply to the ${shape} interaction (it takes ${SHAPE_ENTRIES[shape].map(name).join(', ')})`);
    }
  }
  const spec: InteractionSpec = { shape };
  const rangeText = e.range?.trim().toLowerCase();
  if (rangeText !== undefined && !['', 'inf', 'infinity', 'none'].includes(rangeText)) {
    const rmax = parseEntryNumber(rangeText);
    if (!(rmax > 0)) fail('range', `${name('range')} must be > 0 (or inf), got ${e.range}`);
    else if (rmax !== Infinity) spec.rmax = rmax;
  }
  const strengthAxis = axes.includes('rb') || axes.includes('v1');
  if (shape === 'softcore') {
    spec.V0 = number('v0');
    spec.Rc = number('rc');
    if (e.v0 === undefined || e.rc === undefined) fail(e.v0 === undefined ? 'v0' : 'rc', `the softcore interaction needs ${name('v0')} and ${name('rc')}`);
  } else {
    const V1 = number('v1'), Rb = number('rb');
    if (V1 !== undefined) spec.V1 = V1;
    if (Rb !== undefined) spec.Rb = Rb;
    if (shape === 'nn') {
      const V2 = number('v2');
      if (V2 !== undefined) spec.V2 = V2;
      if (e.v1 === undefined && !strengthAxis) fail('v1', `the nn interaction needs ${name('v1')}`);
    } else if (e.v1 === undefined && e.rb === undefined && !strengthAxis) {
      fail('rb', `the ${shape} interaction needs ${name('rb')} (blockade radius) or ${name('v1')}`);
    }
  }
  return problems.length === before ? spec : null;
}
