/**
 * Flags of the correlated commands (ed, vmc): the cluster (a periodic --size, or a user's
 * array from --sites file.csv with an optional --spacing in um), the interaction (shared
 * with the mean-field commands), mu, and the photon: a fixed --alpha, or --detuning for a
 * self-consistent alpha.
 */
import { InputError } from '../core/input-error.ts';
import { LATTICE_NAMES, type LatticeName } from '../core/lattice/geometry.ts';
import { type ClusterSpec, parseClusterSize } from '../core/cluster/spec.ts';
import { parseSiteCsv } from '../core/cluster/site-array.ts';
import { has, num, str, type FlagSpec, type ParsedArgs } from './flags.ts';
import { MODEL_FLAGS, interactionFromArgs } from './model-flags.ts';
import type { CliIo } from './io.ts';

const SHARED = ['lattice', 'interaction', 'rb', 'v1', 'v2', 'v0', 'rc', 'range'];

export const CLUSTER_FLAGS: readonly FlagSpec[] = [
  ...MODEL_FLAGS.filter((f) => SHARED.includes(f.name)),
  { name: 'size', kind: 'string', value: 'L|LXxLY', help: 'periodic cluster: L sites of a ring, or Lx x Ly cells (e.g. 4x4)' },
  { name: 'sites', kind: 'string', value: 'file.csv', help: 'a user array instead: one "x,y" per line (units of a, or um with --spacing), open boundaries' },
  { name: 'spacing', kind: 'number', value: 'um', help: 'lattice spacing a in micrometres: --sites coordinates are then in um' },
  { name: 'mu', kind: 'number', value: 'mu', help: 'chemical potential of excitations (units of g)' },
  { name: 'alpha', kind: 'number', value: 'alpha', help: 'fixed coherent photon amplitude alpha >= 0 (<a> = sqrt(N) alpha)' },
  { name: 'detuning', kind: 'number', value: 'delta', help: 'cavity detuning; without --alpha, alpha is found self-consistently' },
];

/** The cluster of the flags. */
export function clusterFromArgs(a: ParsedArgs, io: CliIo): ClusterSpec {
  const lat = (str(a, 'lattice') ?? 'chain') as LatticeName;
  if (!LATTICE_NAMES.includes(lat)) throw new InputError(`unknown lattice '${lat}' (use ${LATTICE_NAMES.join(', ')})`, 'lattice');
  const interaction = interactionFromArgs(a);
  const size = str(a, 'size'), sites = str(a, 'sites');
  if ((size === undefined) === (sites === undefined)) {
    throw new InputError(`${a.command} needs --size (a periodic cluster, e.g. 12 or 4x4) or --sites file.csv (your array), one of them`, 'size');
  }
  if (sites !== undefined) return { kind: 'array', lattice: lat, positions: parseSiteCsv(io.readText(sites), num(a, 'spacing')), interaction };
  if (has(a, 'spacing')) throw new InputError('--spacing applies to --sites coordinates in um; a --size cluster is in units of a', 'spacing');
  return { kind: 'periodic', lattice: lat, size: parseClusterSize(size as string), interaction };
}

/** mu, and the photon: a fixed alpha and/or the detuning. */
export function photonFromArgs(a: ParsedArgs): { mu: number; alpha?: number; delta?: number } {
  const mu = num(a, 'mu');
  if (mu === undefined) throw new InputError(`${a.command} needs --mu (the chemical potential of excitations)`, 'mu');
  const alpha = num(a, 'alpha'), delta = num(a, 'detuning');
  if (alpha === undefined && delta === undefined) {
    throw new InputError(`${a.command} needs --alpha (a fixed photon amplitude) or --detuning (alpha found self-consistently)`, 'alpha');
  }
  const out: { mu: number; alpha?: number; delta?: number } = { mu };
  if (alpha !== undefined) out.alpha = alpha;
  if (delta !== undefined) out.delta = delta;
  return out;
}

/** A one-line description of the cluster for text output. */
export function clusterLabel(c: ClusterSpec): string {
  return c.kind === 'array' ? `array of ${c.positions.length / 2} sites (open boundaries)`
    : `${c.lattice} ${c.size.join('x')} (periodic)`;
}
