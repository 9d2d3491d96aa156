/**
 * A quantum Monte Carlo line scan as a list of independent runs: for each cluster size L
 * (a ring of L sites, or an L x L torus) and each value of one axis, one QMC request.
 * Points are numbered size-major, index = iSize * count + ix; a point's seed comes from the
 * scan seed, its size and ix (pointSeed), so it does not depend on the other sizes, the
 * worker count or the sharding. `--shard k/n` takes the points with index mod n = k - 1.
 *
 * Axes: mu, temperature (T), detuning (delta: alpha self-consistent), alpha (fixed photon
 * amplitude), rb (V(Rb) = 2: vdw, dipolar) and v1 (the strength at r = a), each written
 * name=START..STOPxN (or the old name=start:stop:count) with evenly spaced values (src/core/scan/axes.ts).
 */
import { InputError } from '../src/core/input-error.ts';
import { lattice } from '../src/core/lattice/geometry.ts';
import { CLI_AXIS_FORM, parseRange, rangeValues } from '../src/core/scan/axes.ts';
import { pointSeed } from '../src/core/scan/grid.ts';
import type { QmcRequest } from '../src/core/qmc/quantum-monte-carlo.ts';
import { MAX_TORUS_SITES } from '../src/core/qmc/torus.ts';
import type { QmcAxisName, QmcScanRequest } from './protocol.ts';

export const QMC_AXES: readonly QmcAxisName[] = ['mu', 'temperature', 'detuning', 'alpha', 'rb', 'v1'];

/** Most points one qmc-scan may hold (sizes x axis values). */
export const MAX_QMC_SCAN_POINTS = 10_000;

/** Parse `name=START..STOPxN` with a QMC axis name. */
export function parseQmcAxis(text: string): QmcScanRequest['axis'] {
  const eq = text.indexOf('=');
  const name = (eq < 0 ? '' : text.slice(0, eq).trim().toLowerCase()) as QmcAxisName;
  if (!QMC_AXES.includes(name)) {
    throw new InputError(`--x must be ${CLI_AXIS_FORM} with name one of ${QMC_AXES.join(', ')}, got '${text}'`, 'x');
  }
  return { name, values: rangeValues(parseRange(text.slice(eq + 1), `--x ${name}`)) };
}

/** Parse sizes `16,32,64`: distinct integers L >= 2, ascending. */
export function parseSizes(text: string): number[] {
  const sizes = text.split(',').map((s) => s.trim()).map((s) => (/^\d+$/.test(s) ? Number(s) : NaN));
  if (sizes.length === 0 || sizes.some((L) => !Number.isInteger(L) || L < 2)) {
    throw new InputError(`--sizes must be cluster sizes L >= 2 separated by commas (like 16,32,64), got '${text}'`, 'sizes');
  }
  if (new Set(sizes).size !== sizes.length) throw new InputError(`--sizes lists a size twice: '${text}'`, 'sizes');
  return [...sizes].sort((a, b) => a - b);
}

/** A copy of the request with one axis value applied. */
export function applyQmcAxis(req: QmcRequest, name: QmcAxisName, value: number): QmcRequest {
  const q: QmcRequest = { ...req };
  const interaction = { ...req.cluster.interaction };
  switch (name) {
    case 'mu': q.mu = value; break;
    case 'temperature':
      if (req.ground) throw new InputError('the temperature axis does not go with --ground', 'x');
      q.temperature = value;
      break;
    case 'detuning':
      if (req.alpha !== undefined) throw new InputError('the detuning axis finds alpha self-consistently: leave out --alpha', 'x');
      q.delta = value;
      break;
    case 'alpha': q.alpha = value; break;
    case 'rb':
      if (interaction.shape !== 'vdw' && interaction.shape !== 'dipolar') throw new InputError(`the rb axis needs the vdw or dipolar interaction, not ${interaction.shape}`, 'x');
      interaction.Rb = value; delete interaction.V1;
      break;
    case 'v1':
      if (interaction.shape === 'softcore') throw new InputError('the v1 axis does not apply to the softcore interaction', 'x');
      interaction.V1 = value; delete interaction.Rb;
      break;
  }
  q.cluster = { ...req.cluster, interaction };
  return q;
}

/** One run of the scan. */
export interface QmcScanTask {
  index: number;
  size: number;
  ix: number;
  value: number;
  request: QmcRequest;
}

/** The runs of the scan (of its shard), in index order. */
export function qmcScanTasks(req: QmcScanRequest): QmcScanTask[] {
  const { base, sizes, axis, shard } = req;
  const cluster = base.cluster;
  if (cluster.kind !== 'periodic') throw new InputError('qmc-scan runs periodic clusters of several sizes (--sizes), not a --sites array', 'sizes');
  const dim = lattice(cluster.lattice).dim;
  const n = axis.values.length;
  if (sizes.length * n > MAX_QMC_SCAN_POINTS) throw new InputError(`the scan has ${sizes.length * n} points, above ${MAX_QMC_SCAN_POINTS}; split it with --shard`, 'x');
  const out: QmcScanTask[] = [];
  sizes.forEach((L, is) => {
    if (L ** dim > MAX_TORUS_SITES) throw new InputError(`size ${L} gives ${L ** dim} sites, above the limit of ${MAX_TORUS_SITES}`, 'sizes');
    const sized: QmcRequest = { ...base, cluster: { ...cluster, size: dim === 1 ? [L] : [L, L] } };
    axis.values.forEach((value, ix) => {
      const index = is * n + ix;
      if (shard && index % shard.n !== shard.k - 1) return;
      const seed = pointSeed(pointSeed(base.seed ?? 1, L), ix);
      out.push({ index, size: L, ix, value, request: { ...applyQmcAxis(sized, axis.name, value), seed } });
    });
  });
  return out;
}
