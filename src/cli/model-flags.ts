/**
 * The model flags every engine command shares, and their translation into ModelParams
 * (src/core/model.ts). Interaction strength, detuning and pump have no defaults: a result
 * should never rest on a value the user did not choose. Flags that do not apply to the
 * chosen interaction are refused rather than ignored.
 */
import { InputError } from '../core/input-error.ts';
import { LATTICE_NAMES, type LatticeName } from '../core/lattice/geometry.ts';
import { INTERACTION_SHAPES, type InteractionShape, type InteractionSpec } from '../core/interaction/potential.ts';
import { defaultMaxCell, type ModelParams } from '../core/model.ts';
import type { AxisName } from '../core/scan/axes.ts';
import { has, int, num, str, type FlagSpec, type ParsedArgs } from './flags.ts';

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

/** Flags fixed by an axis: the axis value replaces them, so giving both is refused. */
const AXIS_FLAGS: Record<AxisName, string[]> = {
  rb: ['rb', 'v1'], v1: ['rb', 'v1'], mu: ['mu', 'density'], density: ['mu', 'density'],
  detuning: ['detuning'], temperature: ['temperature'],
};

/**
 * ModelParams from the flags. `axes` are the parameters a scan sets per point: their flags
 * must be absent, and they count as given.
 */
export function modelFromArgs(a: ParsedArgs, axes: readonly AxisName[] = []): ModelParams {
  for (const ax of axes) {
    for (const f of AXIS_FLAGS[ax]) {
      if (has(a, f)) throw new InputError(`--${f} conflicts with the ${ax} axis of the scan; leave it out`, f);
    }
  }
  const lat = (str(a, 'lattice') ?? 'chain') as LatticeName;
  if (!LATTICE_NAMES.includes(lat)) throw new InputError(`unknown lattice '${lat}' (use ${LATTICE_NAMES.join(', ')})`, 'lattice');
  const interaction = interactionFromArgs(a, axes);
  const delta = num(a, 'detuning');
  if (delta === undefined && !axes.includes('detuning')) throw new InputError(`${a.command} needs --detuning (the cavity detuning delta, units of g)`, 'detuning');
  const mu = num(a, 'mu'), rho = num(a, 'density');
  const pumpAxis = axes.includes('mu') || axes.includes('density');
  if (!pumpAxis && mu === undefined && rho === undefined) {
    throw new InputError(`${a.command} needs --mu (chemical potential) or --density (excitation density)`, 'mu');
  }
  if (mu !== undefined && rho !== undefined) throw new InputError('give --mu or --density, not both', 'mu');
  const maxCell = int(a, 'max-cell') ?? defaultMaxCell(lat);
  const p: ModelParams = { lattice: lat, interaction, delta: delta ?? 0, T: num(a, 'temperature') ?? 0, maxCell };
  if (mu !== undefined) p.mu = mu;
  if (rho !== undefined) p.rho = rho;
  const cell = int(a, 'cell');
  if (cell !== undefined) p.cell = cell;
  return p;
}

/** The seed flag (default 1). */
export function seedFromArgs(a: ParsedArgs): number {
  return int(a, 'seed') ?? 1;
}

/** The InteractionSpec of the interaction flags (also used by the ed and vmc commands). */
export function interactionFromArgs(a: ParsedArgs, axes: readonly AxisName[] = []): InteractionSpec {
  const shape = (str(a, 'interaction') ?? 'vdw') as InteractionShape;
  if (!INTERACTION_SHAPES.includes(shape)) {
    throw new InputError(`unknown interaction '${shape}' (use ${INTERACTION_SHAPES.join(', ')})`, 'interaction');
  }
  const allowed: Record<InteractionShape, string[]> = {
    nn: ['v1', 'v2'], vdw: ['rb', 'v1'], dipolar: ['rb', 'v1'], softcore: ['v0', 'rc'],
  };
  for (const f of ['rb', 'v1', 'v2', 'v0', 'rc']) {
    if (has(a, f) && !allowed[shape].includes(f)) {
      throw new InputError(`--${f} does not apply to the ${shape} interaction (it takes ${allowed[shape].map((x) => '--' + x).join(', ')})`, f);
    }
  }
  const spec: InteractionSpec = { shape };
  const rmax = num(a, 'range', true);
  if (rmax !== undefined) {
    if (!(rmax > 0)) throw new InputError(`--range must be > 0 (or inf), got ${rmax}`, 'range');
    if (rmax !== Infinity) spec.rmax = rmax;
  }
  const strengthAxis = axes.includes('rb') || axes.includes('v1');
  if (shape === 'softcore') {
    spec.V0 = num(a, 'v0');
    spec.Rc = num(a, 'rc');
    if (spec.V0 === undefined || spec.Rc === undefined) throw new InputError('the softcore interaction needs --v0 and --rc', spec.V0 === undefined ? 'v0' : 'rc');
    return spec;
  }
  const V1 = num(a, 'v1'), Rb = num(a, 'rb');
  if (V1 !== undefined) spec.V1 = V1;
  if (Rb !== undefined) spec.Rb = Rb;
  if (shape === 'nn') {
    const V2 = num(a, 'v2');
    if (V2 !== undefined) spec.V2 = V2;
    if (V1 === undefined && !strengthAxis) throw new InputError('the nn interaction needs --v1', 'v1');
  } else if (V1 === undefined && Rb === undefined && !strengthAxis) {
    throw new InputError(`the ${shape} interaction needs --rb (blockade radius) or --v1`, 'rb');
  }
  return spec;
}
