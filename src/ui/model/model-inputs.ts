/**
 * From the form's strings to the engine's ModelParams, checking as the user types.
 * Each entry is parsed on its own first (so the message sits beside the field that is
 * wrong), then the whole model goes through the core's validateModel and
 * resolvePotential, whose InputError names the field (mu >= delta, a missing Rb, ...).
 */
import { InputError } from '../../core/input-error.ts';
import { type ModelParams, validateModel } from '../../core/model.ts';
import { lattice as latticeOf, type LatticeName } from '../../core/lattice/geometry.ts';
import { type InteractionSpec, type InteractionShape, resolvePotential } from '../../core/interaction/potential.ts';
import type { ModelInputs, ModelKey } from '../state/app-state.ts';

export type FieldErrors = Partial<Record<ModelKey, string>>;

export interface ParsedModel {
  params: ModelParams | null;
  errors: FieldErrors;
}

/** Parse a number as typed ("1e-3", "-2", " 3 "); NaN for anything else. */
export function parseNumber(text: string): number {
  const t = text.trim().replace('\u2212', '-');
  if (t === '' || !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return NaN;
  return Number(t);
}

/** The InputError field names the core uses, mapped to the form's keys. */
const FIELD_OF: Record<string, ModelKey> = {
  lattice: 'lattice', interaction: 'interaction', detuning: 'detuning', temperature: 'temperature',
  mu: 'mu', density: 'density', 'max-cell': 'max-cell', cell: 'max-cell', rb: 'rb', v1: 'v1', v2: 'v2',
  v0: 'v0', rc: 'rc', range: 'range',
};

/** The interaction spec the form describes (numbers unchecked). */
export function interactionOf(m: ModelInputs, overrideRange?: string): InteractionSpec {
  const shape = m.interaction as InteractionShape;
  const rangeText = (overrideRange ?? m.range).trim().toLowerCase();
  const rmax = rangeText === '' || rangeText === 'inf' ? undefined : parseNumber(rangeText);
  switch (shape) {
    case 'nn': return { shape, V1: parseNumber(m.v1), V2: parseNumber(m.v2 || '0'), rmax };
    case 'softcore': return { shape, V0: parseNumber(m.v0), Rc: parseNumber(m.rc), rmax };
    default:
      return m.strength === 'v1' ? { shape, V1: parseNumber(m.v1), rmax } : { shape, Rb: parseNumber(m.rb), rmax };
  }
}

/** The entries a model of this shape and pump actually uses. */
export function activeKeys(m: ModelInputs): ModelKey[] {
  const keys: ModelKey[] = ['lattice', 'interaction'];
  if (m.interaction === 'nn') keys.push('v1', 'v2');
  else if (m.interaction === 'softcore') keys.push('v0', 'rc');
  else keys.push('strength', m.strength === 'v1' ? 'v1' : 'rb');
  keys.push('range', 'detuning', 'pump', m.pump === 'density' ? 'density' : 'mu', 'temperature', 'max-cell');
  return keys;
}

/** Parse and validate the form. */
export function parseModel(m: ModelInputs): ParsedModel {
  const errors: FieldErrors = {};
  const numeric: ModelKey[] = ['rb', 'v1', 'v2', 'v0', 'rc', 'detuning', 'mu', 'density', 'temperature', 'max-cell'];
  const active = activeKeys(m);
  for (const k of numeric) {
    if (!active.includes(k)) continue;
    if (k === 'v2' && m.v2.trim() === '') continue;
    if (!Number.isFinite(parseNumber(m[k]))) errors[k] = m[k].trim() === '' ? 'a number is needed here' : `"${m[k]}" is not a number`;
  }
  const r = m.range.trim().toLowerCase();
  if (r !== '' && r !== 'inf' && !(parseNumber(r) > 0)) errors.range = 'range must be a distance > 0 (in a), or empty for the full sum';
  if (Object.keys(errors).length) return { params: null, errors };
  const params: ModelParams = {
    lattice: m.lattice as LatticeName,
    interaction: interactionOf(m),
    delta: parseNumber(m.detuning),
    T: parseNumber(m.temperature),
    maxCell: parseNumber(m['max-cell']),
    ...(m.pump === 'density' ? { rho: parseNumber(m.density) } : { mu: parseNumber(m.mu) }),
  };
  try {
    validateModel(params);
    resolvePotential(params.interaction, latticeOf(params.lattice));
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    const key = FIELD_OF[e.field ?? ''] ?? (m.pump === 'density' ? 'density' : 'mu');
    return { params: null, errors: { [key]: e.message } };
  }
  return { params, errors };
}
