/**
 * The cluster a correlated calculation runs on, as plain data that crosses to a worker:
 * a periodic cluster of the lattice (`size` [L] or [Lx, Ly]) or a user's array of positions
 * (units of a, open boundaries). `buildCluster` turns it into a Cluster.
 */
import { InputError } from '../input-error.ts';
import { LATTICE_NAMES, type LatticeName, lattice } from '../lattice/geometry.ts';
import type { InteractionSpec } from '../interaction/potential.ts';
import type { Cluster } from './cluster.ts';
import { periodicCluster } from './periodic-cluster.ts';
import { arrayCluster } from './site-array.ts';

export type ClusterSpec =
  | { kind: 'periodic'; lattice: LatticeName; size: number[]; interaction: InteractionSpec }
  | { kind: 'array'; lattice: LatticeName; positions: number[]; interaction: InteractionSpec };

/** Build the cluster of a spec, refusing bad sizes, lattices or positions with an InputError. */
export function buildCluster(spec: ClusterSpec): Cluster {
  if (!LATTICE_NAMES.includes(spec.lattice)) {
    throw new InputError(`unknown lattice ${String(spec.lattice)} (use ${LATTICE_NAMES.join(', ')})`, 'lattice');
  }
  if (spec.kind === 'array') return arrayCluster(spec.lattice, spec.positions, spec.interaction);
  const dim = lattice(spec.lattice).dim;
  const size = spec.size;
  if (dim === 1 && size.length !== 1) throw new InputError(`a chain takes one size L, got ${size.join('x')} (a 2D cluster needs --lattice square or triangular)`, 'size');
  if (dim === 2 && size.length !== 2) throw new InputError(`the ${spec.lattice} lattice takes a size Lx x Ly, got ${size.join('x')}`, 'size');
  return periodicCluster(spec.lattice, size[0], dim === 1 ? 1 : size[1], spec.interaction);
}

/** Parse a size "12" or "4x4" (as typed on the command line). */
export function parseClusterSize(text: string): number[] {
  const parts = text.trim().toLowerCase().split('x');
  const out = parts.map((p) => (/^\d+$/.test(p.trim()) ? Number(p.trim()) : NaN));
  if (out.length > 2 || out.some((v) => !Number.isInteger(v))) {
    throw new InputError(`size must be L (chain) or Lx x Ly such as 4x4, got "${text}"`, 'size');
  }
  return out;
}
