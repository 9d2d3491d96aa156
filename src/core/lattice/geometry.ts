/**
 * Bravais lattices of the model, lengths in units of the lattice spacing a
 * (nearest-neighbour distance 1). Vectors are stored as [x, y]; the chain lies on x.
 *
 * Primitive vectors a1, a2 and reciprocal vectors b1, b2 with a_i . b_j = 2 pi delta_ij.
 */
export type LatticeName = 'chain' | 'square' | 'triangular';

export const LATTICE_NAMES: readonly LatticeName[] = ['chain', 'square', 'triangular'];

export type Vec2 = readonly [number, number];

export interface Lattice {
  readonly name: LatticeName;
  /** Spatial dimension d (1 for the chain). */
  readonly dim: 1 | 2;
  readonly a1: Vec2;
  readonly a2: Vec2;
  readonly b1: Vec2;
  readonly b2: Vec2;
  /** Area (2D) or length (1D) of the primitive cell. */
  readonly cellVolume: number;
  /** Distance of the next-nearest-neighbour shell (the V2 shell of the nn shape). */
  readonly nextNearest: number;
  /** Number of nearest neighbours. */
  readonly coordination: number;
}

const S3 = Math.sqrt(3);

const LATTICES: Record<LatticeName, Lattice> = {
  chain: {
    name: 'chain', dim: 1, a1: [1, 0], a2: [0, 1], b1: [2 * Math.PI, 0], b2: [0, 2 * Math.PI],
    cellVolume: 1, nextNearest: 2, coordination: 2,
  },
  square: {
    name: 'square', dim: 2, a1: [1, 0], a2: [0, 1], b1: [2 * Math.PI, 0], b2: [0, 2 * Math.PI],
    cellVolume: 1, nextNearest: Math.SQRT2, coordination: 4,
  },
  triangular: {
    name: 'triangular', dim: 2, a1: [1, 0], a2: [0.5, S3 / 2],
    b1: [2 * Math.PI, -2 * Math.PI / S3], b2: [0, 4 * Math.PI / S3],
    cellVolume: S3 / 2, nextNearest: S3, coordination: 6,
  },
};

/** The lattice of a given name. */
export function lattice(name: LatticeName): Lattice {
  const l = LATTICES[name];
  if (!l) throw new Error(`unknown lattice ${String(name)}`);
  return l;
}

/** Position r = i a1 + j a2 of the integer lattice point (i, j). */
export function position(l: Lattice, i: number, j: number): [number, number] {
  return [i * l.a1[0] + j * l.a2[0], i * l.a1[1] + j * l.a2[1]];
}
