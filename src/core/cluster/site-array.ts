/**
 * A user's own finite array of emitters (a planned tweezer pattern) with open boundaries.
 *
 * CSV text, one site per line as `x,y`; blank lines and lines starting with `#` are skipped,
 * and a first line `x,y` is taken as a header. The two numbers may also be separated by
 * spaces or tabs (`x y`), or by a semicolon (`x;y`, as spreadsheets write CSV where the
 * decimal mark is a comma: in such a file a comma inside a number is its decimal mark).
 * The first line that is not blank or a comment fixes the separator for the whole file. Coordinates are in units of the lattice
 * spacing a, or in micrometres when a spacing (um) is given: r = (x, y) / spacing.
 *
 *   V_ij = V(|r_i - r_j|) (with the range cut), d_ij = |r_i - r_j|, no periodic images.
 *
 * Structure-factor momenta: the grid k = 2 pi (m1 / nx, m2 / ny), m_a folded into
 * (-n_a/2, n_a/2], of the smallest box of unit spacing holding the array (n_a = extent + 1,
 * rounded; at most MAX_BOX points), which are the cluster momenta when the array is a full rectangle of the square
 * lattice; ny = 1 when all sites lie on one line y = const.
 */
import { InputError, requireFinite } from '../input-error.ts';
import { type LatticeName, lattice } from '../lattice/geometry.ts';
import { type InteractionSpec, pairValue, resolvePotential } from '../interaction/potential.ts';
import { type Cluster, MAX_CLUSTER_SITES, distanceShells } from './cluster.ts';

/**
 * Closest pair separation taken (units of a): 0.05. The pair potentials of the model (r^-6,
 * r^-3, the soft core) hold only outside the overlap of the two Rydberg electron clouds (the
 * LeRoy radius, 2 sqrt(<r^2>) ~ 2 n^2 a0 ~ 0.5 um at n = 70), a few hundredths of a tweezer
 * spacing of 3-10 um; closer emitters are outside the model. Numerically V(0.05) = 6.4e7 V1
 * for vdw, and Lanczos resolves energies of order g only to eps |H| (~1e-8 at V1 = 1);
 * at 1e-3 a (V ~ 1e18 V1) the ED energy was wrong, closer it was NaN.
 */
export const MIN_SEPARATION = 0.05;

/** Largest box of unit spacing around the array (sites of its momentum grid): 1e6. */
export const MAX_BOX = 1e6;

type Separator = ';' | ',' | ' ';

/** The separator a line uses: a semicolon (commas are then decimal marks), else a comma, else spaces. */
function separatorOf(line: string): Separator {
  return line.includes(';') ? ';' : line.includes(',') ? ',' : ' ';
}

/** The fields of one line split at the file's separator. */
function splitSiteLine(line: string, sep: Separator): string[] {
  if (sep === ';') return line.split(';').map((f) => f.trim().replace(',', '.'));
  if (sep === ',') return line.split(',').map((f) => f.trim());
  return line.split(/\s+/);
}

/** Parse CSV text of `x,y` lines into positions [x0, y0, x1, y1, ...] in units of a. */
export function parseSiteCsv(text: string, spacing?: number): number[] {
  if (spacing !== undefined) {
    requireFinite(spacing, 'spacing');
    if (!(spacing > 0)) throw new InputError(`spacing must be > 0 (micrometres), got ${spacing}`, 'spacing');
  }
  const scale = spacing ?? 1;
  const out: number[] = [];
  const lines = text.split(/\r?\n/);
  let seenData = false;
  let sep: Separator | undefined;
  for (let n = 0; n < lines.length; n++) {
    const line = lines[n].trim();
    if (line === '' || line.startsWith('#')) continue;
    sep ??= separatorOf(line);
    const fields = splitSiteLine(line, sep);
    if (!seenData && fields.length === 2 && fields[0].toLowerCase() === 'x' && fields[1].toLowerCase() === 'y') {
      seenData = true;
      continue;
    }
    seenData = true;
    if (fields.length !== 2) {
      throw new InputError(`sites line ${n + 1}: expected two numbers x,y (separated by a comma, a semicolon or spaces), got "${line}"`, 'sites');
    }
    const xy = fields.map((f, a) => {
      const v = f === '' ? NaN : Number(f);
      if (!Number.isFinite(v)) throw new InputError(`sites line ${n + 1}: ${a ? 'y' : 'x'} is not a number: "${f}"`, 'sites');
      return v / scale;
    });
    out.push(xy[0], xy[1]);
  }
  if (out.length === 0) throw new InputError('sites: the CSV holds no sites (expected x,y lines)', 'sites');
  return out;
}

/** The open-boundary cluster of the given positions (units of a). */
export function arrayCluster(name: LatticeName, positions: readonly number[], interaction: InteractionSpec): Cluster {
  const l = lattice(name);
  if (positions.length % 2 !== 0) throw new InputError('sites: positions must come in x,y pairs', 'sites');
  const N = positions.length / 2;
  if (N < 1) throw new InputError('sites: the array holds no sites', 'sites');
  if (N > MAX_CLUSTER_SITES) throw new InputError(`sites: ${N} sites exceed the limit of ${MAX_CLUSTER_SITES}`, 'sites');
  for (const v of positions) if (!Number.isFinite(v)) throw new InputError('sites: coordinates must be finite numbers', 'sites');
  const pot = resolvePotential(interaction, l);
  const pos = Float64Array.from(positions);
  const V = new Float64Array(N * N), distance = new Float64Array(N * N);
  for (let i = 0; i < N; i++) {
    for (let j = i + 1; j < N; j++) {
      const r = Math.hypot(pos[2 * j] - pos[2 * i], pos[2 * j + 1] - pos[2 * i + 1]);
      if (!(r >= MIN_SEPARATION)) {
        throw new InputError(
          `sites ${i + 1} (${pos[2 * i]}, ${pos[2 * i + 1]}) and ${j + 1} (${pos[2 * j]}, ${pos[2 * j + 1]}) are ${r} a apart, closer than ${MIN_SEPARATION} a: the pair potential does not hold inside the overlap of the Rydberg orbits`, 'sites');
      }
      distance[i * N + j] = distance[j * N + i] = r;
      V[i * N + j] = V[j * N + i] = pairValue(pot, r);
    }
  }
  const { shells, shellOf } = distanceShells(N, distance);
  const { momenta, momentumLabels } = boxMomenta(pos);
  return { kind: 'array', lattice: name, N, Lx: N, Ly: 1, positions: pos, V, distance, shells, shellOf, momenta, momentumLabels };
}

/** The momentum grid of the smallest unit-spacing box holding the sites. */
function boxMomenta(pos: Float64Array): { momenta: Float64Array; momentumLabels: Int32Array } {
  const N = pos.length / 2;
  let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
  for (let i = 0; i < N; i++) {
    x0 = Math.min(x0, pos[2 * i]); x1 = Math.max(x1, pos[2 * i]);
    y0 = Math.min(y0, pos[2 * i + 1]); y1 = Math.max(y1, pos[2 * i + 1]);
  }
  const nx = Math.max(1, Math.round(x1 - x0) + 1), ny = Math.max(1, Math.round(y1 - y0) + 1);
  if (!(nx * ny <= MAX_BOX)) {
    throw new InputError(
      `sites: the array spans ${x1 - x0} x ${y1 - y0} lattice spacings; its momentum grid of ${nx} x ${ny} exceeds the limit of ${MAX_BOX} points (give coordinates in units of a, or the spacing in um)`, 'sites');
  }
  const fold = (m: number, n: number) => (m > n / 2 ? m - n : m);
  const momenta = new Float64Array(2 * nx * ny), momentumLabels = new Int32Array(2 * nx * ny);
  for (let b = 0; b < ny; b++) {
    for (let a = 0; a < nx; a++) {
      const q = b * nx + a, m1 = fold(a, nx), m2 = fold(b, ny);
      momenta[2 * q] = (2 * Math.PI * m1) / nx;
      momenta[2 * q + 1] = (2 * Math.PI * m2) / ny;
      momentumLabels[2 * q] = m1; momentumLabels[2 * q + 1] = m2;
    }
  }
  return { momenta, momentumLabels };
}
