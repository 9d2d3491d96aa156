/**
 * The model flags every engine command shares, and their translation into ModelParams by
 * the project's one entry parser (src/core/scan/model-entries.ts, which the page's form
 * uses too). Interaction strength, detuning and pump have no defaults: a result should
 * never rest on a value the user did not choose. Flags that do not apply to the chosen
 * interaction are refused rather than ignored.
 */
import { InputError } from '../core/input-error.ts';
import { LATTICE_NAMES } from '../core/lattice/geometry.ts';
import { INTERACTION_SHAPES, type InteractionSpec } from '../core/interaction/potential.ts';
import type { ModelParams } from '../core/model.ts';
import type { AxisName } from '../core/scan/axes.ts';
import { parseModelEntries, type ModelEntries, type ModelEntry } from '../core/scan/model-entries.ts';
import { int, type FlagSpec, type ParsedArgs } from './flags.ts';

export const MODEL_FLAGS: readonly FlagSpec[] = [
  { name: 'lattice', kind: 'string', value: LATTICE_NAMES.join('|'), def: 'chain', help: 'lattice of the emitters' },
  { name: 'interaction', kind: 'string', value: INTERACTION_SHAPES.join('|'), def: 'vdw', help: 'interaction shape: nn (V1, V2), vdw V1/r^6, dipolar V1/r^3, softcore V0/(1+(r/Rc)^6)' },
  { name: 'rb', kind: 'number', value: 'Rb', help: 'blockade radius (units of a) with V(Rb) = 2g; vdw and dipolar' },
  { name: 'v1', kind: 'number', value: 'V1', help: 'strength at r = a (units of g); nn, vdw, dipolar (instead of --rb)' },
  { name: 'v2', kind: 'number', value: 'V2', def: '0', help: 'next-nearest strength of the nn shape' },
  { name: 'v0', kind: 'number', value: 'V0', help: 'plateau height of the softcore shape' },
  { name: 'rc', kind: 'number', value: 'Rc', help: 'core radius of the softcore shape (units of a)' },
  { name: 'range', kind: 'number', value: 'rmax|inf', def: 'inf', help: 'drop pairs farther apart than rmax (inf: the full converged lattice sum)' },
  { name: 'detuning', kind: 'number', value: 'delta', help: 'cavity detuning from the emitter line (units of g)' },
  { name: 'mu', kind: 'number', value: 'mu', help: 'chemical potential of excitations, below the detuning' },
  { name: 'density', kind: 'number', value: 'rho', help: 'fixed excitation density rho = alpha^2 + <n> (instead of --mu)' },
  { name: 'temperature', kind: 'number', value: 'T', def: '0', help: 'temperature (units of g)' },
  { name: 'max-cell', kind: 'int', value: 'Mmax', def: '12 (1D), 8 (2D)', help: 'largest supercell (sublattices) searched' },
  { name: 'cell', kind: 'int', value: 'M', help: 'only supercells of exactly M sites (e.g. 1: the uniform state)' },
  { name: 'seed', kind: 'int', value: 'n', def: '1', help: 'seed of the random starts' },
];

const ENTRY_FLAGS: readonly ModelEntry[] = [
  'lattice', 'interaction', 'rb', 'v1', 'v2', 'v0', 'rc', 'range', 'detuning', 'mu', 'density', 'temperature', 'max-cell', 'cell',
];

/** The model entries among the flags (as typed). */
function entriesOf(a: ParsedArgs): ModelEntries {
  const e: ModelEntries = {};
  for (const f of ENTRY_FLAGS) {
    const v = a.flags.get(f);
    if (typeof v === 'string') e[f] = v;
  }
  return e;
}

/** Parse the entries; the first problem is thrown as an InputError naming its flag. */
function parse(a: ParsedArgs, axes: readonly AxisName[]): ModelParams {
  const r = parseModelEntries(entriesOf(a), { axes, name: (f) => `--${f}`, who: a.command });
  if (!r.params) {
    const p = r.problems[0];
    throw new InputError(p.message, p.field);
  }
  return r.params;
}

/**
 * ModelParams from the flags. `axes` are the parameters a scan sets per point: their flags
 * must be absent, and they count as given.
 */
export function modelFromArgs(a: ParsedArgs, axes: readonly AxisName[] = []): ModelParams {
  return parse(a, axes);
}

/** The seed flag (default 1). */
export function seedFromArgs(a: ParsedArgs): number {
  return int(a, 'seed') ?? 1;
}

/**
 * The InteractionSpec of the interaction flags (the ed and vmc commands, which take no
 * detuning or pump of their own): parsed as the full model with a stand-in pump.
 */
export function interactionFromArgs(a: ParsedArgs, axes: readonly AxisName[] = []): InteractionSpec {
  const e = entriesOf(a);
  const r = parseModelEntries({ lattice: e.lattice, interaction: e.interaction, rb: e.rb, v1: e.v1, v2: e.v2, v0: e.v0, rc: e.rc, range: e.range },
    { axes: [...axes, 'mu', 'detuning'], name: (f) => `--${f}`, who: a.command });
  if (!r.params) throw new InputError(r.problems[0].message, r.problems[0].field);
  return r.params.interaction;
}
