/**
 * `qmc-scan`: a quantum Monte Carlo line scan over one axis for several cluster sizes, all
 * runs independent and on the pool at once (workers/qmc-scan.ts), CSV or JSON out, and the
 * Binder-cumulant crossings of consecutive sizes with their errors (the finite-size
 * location of a transition; src/core/qmc/binder-crossing.ts). `--shard k/n` takes the
 * points with index mod n = k - 1 for a job array. Rows stream in index order as runs finish;
 * Ctrl-C or SIGTERM writes the finished runs (130), --resume continues a part (qmc-scan-stream.ts).
 */
import { InputError } from '../../core/input-error.ts';
import { LATTICE_NAMES, type LatticeName } from '../../core/lattice/geometry.ts';
import { parseShard } from '../../core/scan/shards.ts';
import { CLI_AXIS_FORM, type AxisName } from '../../core/scan/axes.ts';
import { parseQmcAxis, parseSizes, qmcScanTasks } from '../../../workers/qmc-scan-plan.ts';
import type { QmcScanRequest } from '../../../workers/protocol.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, has, int, num, str, type FlagSpec } from '../flags.ts';
import { CLUSTER_FLAGS } from '../cluster-flags.ts';
import { interactionFromArgs } from '../model-flags.ts';
import { QMC_FLAGS, qmcRunFromArgs, qmcWorkers } from '../qmc-flags.ts';
import { streamQmcScan } from '../qmc-scan-stream.ts';
import { OUT_FLAG, RESUME_FLAG, streamOutput } from './output.ts';

const SCAN_FLAGS: readonly FlagSpec[] = [
  { name: 'x', kind: 'string', value: CLI_AXIS_FORM, help: 'the axis: mu, temperature, detuning, alpha, rb or v1' },
  { name: 'sizes', kind: 'string', value: 'L1,L2,...', help: 'cluster sizes: rings of L sites, or L x L tori on square and triangular lattices' },
  { name: 'shard', kind: 'string', value: 'k/n', help: 'only the points with index mod n = k - 1 (a job array\'s part k of n)' },
  { name: 'json', kind: 'bool', help: 'print JSON (points and crossings) instead of CSV' },
  OUT_FLAG,
  RESUME_FLAG,
];

/** The axis flag of each axis (it must be absent: the axis sets it). */
const AXIS_FLAG: Record<string, string> = { mu: 'mu', temperature: 'temperature', detuning: 'detuning', alpha: 'alpha', rb: 'rb', v1: 'v1' };

export const qmcScanCommand: Command = {
  name: 'qmc-scan',
  summary: 'QMC line scan over several cluster sizes with Binder crossings (CSV or JSON), shardable',
  usage: 'qmc-scan --x name=START..STOPxN --sizes L1,L2,... --mu mu (--alpha a | --detuning delta) (--temperature T | --ground) [flags]',
  description:
    'One quantum Monte Carlo run (as qmc) for each cluster size and each axis value, all independent and run\n' +
    'at once on the worker threads (--chains chains each, default 1). Prints CSV, one row a run: index, size,\n' +
    'the axis value, energy, density, sigmaX, alpha, photonDensity, orderParameter, binder, each followed by\n' +
    'its error, then phase (and the reason of a failed run), or JSON with --json. On stderr: where the Binder\n' +
    'cumulants of consecutive sizes cross along the axis, with the error propagated from the cumulants\' errors\n' +
    '(the finite-size estimate of a continuous transition). --shard k/n computes the runs with index mod n = k-1;\n' +
    'concatenate the parts\' rows (see the README). Ctrl-C writes the finished runs.',
  flags: [...SCAN_FLAGS, ...CLUSTER_FLAGS.filter((f) => !['size', 'sites', 'spacing'].includes(f.name)), ...QMC_FLAGS.filter((f) => f.name !== 'order'), HELP_FLAG],
  examples: [
    'qmc-scan --x alpha=0.1..0.4x7 --sizes 8,16,32 --interaction nn --v1 1 --mu 1 --temperature 0.05',
    'qmc-scan --x temperature=0.2..0.4x9 --sizes 8,16 --lattice square --interaction nn --v1 1 --mu 2 --alpha 0 --json',
    'qmc-scan --x mu=0..2x21 --sizes 16,32,64 --rb 1.5 --detuning 3 --ground --shard 2/8 --out part-2.csv',
  ],
  async run(args, io) {
    const xs = str(args, 'x'), ss = str(args, 'sizes');
    if (!xs) throw new InputError('qmc-scan needs --x name=START..STOPxN', 'x');
    if (!ss) throw new InputError('qmc-scan needs --sizes L1,L2,... (cluster sizes)', 'sizes');
    const axis = parseQmcAxis(xs);
    if (has(args, AXIS_FLAG[axis.name])) throw new InputError(`--${AXIS_FLAG[axis.name]} is set by the axis --x ${axis.name}: leave it out`, AXIS_FLAG[axis.name]);
    const lat = (str(args, 'lattice') ?? 'chain') as LatticeName;
    if (!LATTICE_NAMES.includes(lat)) throw new InputError(`unknown lattice '${lat}' (use ${LATTICE_NAMES.join(', ')})`, 'lattice');
    const interaction = interactionFromArgs(args, axis.name === 'rb' || axis.name === 'v1' ? [axis.name as AxisName] : []);
    const mu = num(args, 'mu') ?? (axis.name === 'mu' ? 0 : undefined);
    if (mu === undefined) throw new InputError('qmc-scan needs --mu (or --x mu=...)', 'mu');
    const alpha = num(args, 'alpha'), delta = num(args, 'detuning');
    if (alpha === undefined && delta === undefined && axis.name !== 'alpha' && axis.name !== 'detuning') {
      throw new InputError('qmc-scan needs --alpha (fixed) or --detuning (self-consistent alpha), or one of them as the axis', 'alpha');
    }
    if (!bool(args, 'ground') && !has(args, 'temperature') && axis.name !== 'temperature') {
      throw new InputError('qmc-scan needs --temperature T > 0, --ground, or --x temperature=...', 'temperature');
    }
    const workers = qmcWorkers(args, io);
    const chains = int(args, 'chains') ?? 1;
    const shardText = str(args, 'shard');
    const req: QmcScanRequest = {
      base: {
        cluster: { kind: 'periodic', lattice: lat, size: [2], interaction }, mu,
        ...(alpha !== undefined ? { alpha } : {}), ...(delta !== undefined ? { delta } : {}), ...qmcRunFromArgs(args, chains),
      },
      sizes: parseSizes(ss), axis, shard: shardText ? parseShard(shardText) : undefined,
    };
    const total = qmcScanTasks(req).length;
    const label = req.shard ? `qmc-scan ${req.shard.k}/${req.shard.n}` : 'qmc-scan';
    // each run's row is written as it and those before it finish; --resume continues a part (qmc-scan-stream.ts)
    const pool = { size: Math.min(workers, Math.max(1, total * chains)), workers };
    return streamOutput(io, args, (target) => streamQmcScan(io, req, pool, bool(args, 'json'), label, target), { unit: 'runs' });
  },
};
