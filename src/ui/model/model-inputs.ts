/**
 * From the form's strings to the engine's ModelParams, checking as the user types. The
 * form's fields carry the CLI's flag names, so the entries go through the same parser as
 * the flags (src/core/scan/model-entries.ts): every problem sits beside its field. Then
 * the whole model goes through the core's validateModel and resolvePotential, whose
 * InputError names the field (mu >= delta, a missing Rb, ...).
 */
import { InputError } from '../../core/input-error.ts';
import { type ModelParams, validateModel } from '../../core/model.ts';
import { lattice as latticeOf } from '../../core/lattice/geometry.ts';
import { resolvePotential } from '../../core/interaction/potential.ts';
import { AXIS_ENTRIES, parseEntryNumber, parseModelEntries, type ModelEntries, type ModelEntry } from '../../core/scan/model-entries.ts';
import type { AxisName } from '../../core/scan/axes.ts';
import type { ModelInputs, ModelKey } from '../state/app-state.ts';

export type FieldErrors = Partial<Record<ModelKey, string>>;

export interface ParsedModel {
  params: ModelParams | null;
  errors: FieldErrors;
}

/** Parse a number as typed ("1e-3", "-2", " 3 "); NaN for anything else. */
export const parseNumber = parseEntryNumber;

/** The InputError field names the core uses, mapped to the form's keys. */
const FIELD_OF: Record<string, ModelKey> = {
  lattice: 'lattice', interaction: 'interaction', detuning: 'detuning', temperature: 'temperature',
  mu: 'mu', density: 'density', 'max-cell': 'max-cell', cell: 'max-cell', rb: 'rb', v1: 'v1', v2: 'v2',
  v0: 'v0', rc: 'rc', range: 'range',
};

/** The entries a model of this shape and pump actually uses. */
export function activeKeys(m: ModelInputs): ModelKey[] {
  const keys: ModelKey[] = ['lattice', 'interaction'];
  if (m.interaction === 'nn') keys.push('v1', 'v2');
  else if (m.interaction === 'softcore') keys.push('v0', 'rc');
  else keys.push('strength', m.strength === 'v1' ? 'v1' : 'rb');
  keys.push('range', 'detuning', 'pump', m.pump === 'density' ? 'density' : 'mu', 'temperature', 'max-cell');
  return keys;
}

/**
 * The form as entries of the shared parser: the active fields only (the strength and pump
 * choices pick which), with an empty optional field (V2, range) left out as on the command line.
 */
export function formEntries(m: ModelInputs): ModelEntries {
  const e: ModelEntries = {};
  for (const k of activeKeys(m)) {
    if (k === 'strength' || k === 'pump') continue;
    if ((k === 'v2' || k === 'range') && m[k].trim() === '') continue;
    e[k as ModelEntry] = m[k];
  }
  return e;
}

/** Parse and validate the form. */
export function parseModel(m: ModelInputs): ParsedModel {
  const r = parseModelEntries(formEntries(m));
  if (!r.params) {
    const errors: FieldErrors = {};
    for (const p of r.problems) errors[FIELD_OF[p.field]] ??= p.message;
    return { params: null, errors };
  }
  try {
    validateModel(r.params);
    resolvePotential(r.params.interaction, latticeOf(r.params.lattice));
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    const key = FIELD_OF[e.field ?? ''] ?? (m.pump === 'density' ? 'density' : 'mu');
    return { params: null, errors: { [key]: e.message } };
  }
  return { params: r.params, errors: {} };
}

/**
 * The base of a scan over `axes`: the form's entries without those the axes set, parsed as
 * the CLI parses its flags for the same scan (so the page's plan, and the params in its
 * export, are the CLI's). Null while an entry is wrong.
 */
export function scanBase(m: ModelInputs, axes: readonly AxisName[]): ModelParams | null {
  const e = formEntries(m);
  for (const a of axes) for (const k of AXIS_ENTRIES[a]) delete e[k];
  return parseModelEntries(e, { axes }).params;
}
