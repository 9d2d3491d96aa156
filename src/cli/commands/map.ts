/**
 * `map`: the mean-field phase over a grid of one or two parameters, in the worker pool,
 * as CSV (default) or JSON, to stdout or --out. `--shard k/n` computes the k-th of n
 * interleaved parts (src/core/scan/shards.ts) for a batch system's job array; `merge`
 * joins them. Ctrl-C writes the finished points and exits 130.
 */
import { InputError } from '../../core/input-error.ts';
import { CLI_AXIS_FORM, parseAxis, type AxisName } from '../../core/scan/axes.ts';
import { checkAxes, gridShape, type ScanPlan } from '../../core/scan/grid.ts';
import { parseShard, scanFingerprint } from '../../core/scan/shards.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, str, type FlagSpec } from '../flags.ts';
import { MODEL_FLAGS, modelFromArgs, seedFromArgs } from '../model-flags.ts';
import { mapHeader } from '../map-output.ts';
import { streamMap } from '../map-stream.ts';
import { SCAN_FLAGS, validatePlan } from '../scan-run.ts';
import { OUTPUT_FLAGS } from './solve.ts';
import { OUT_FLAG, RESUME_FLAG, streamOutput } from './output.ts';
import { mapMode } from '../map-adaptive.ts';

const AXIS_HELP = 'rb, v1, mu, density, detuning or temperature';

const MAP_FLAGS: readonly FlagSpec[] = [
  { name: 'x', kind: 'string', value: CLI_AXIS_FORM, help: `first axis (${AXIS_HELP}): N points from START to STOP, both ends included (mu=-1..3.9x200; the old start:stop:count is still read, with a note); continuation runs along it` },
  { name: 'y', kind: 'string', value: CLI_AXIS_FORM, help: 'second axis (optional: one row)' },
  { name: 'shard', kind: 'string', value: 'k/n', help: 'compute only the k-th of n interleaved parts (join them with merge); a shard is adaptive over its own segments, without boundary lines' },
  { name: 'dense', kind: 'bool', help: 'solve every pixel (the check of the adaptive map: same pixels, more solves, no boundary lines)' },
  { name: 'boundaries', kind: 'string', value: 'file', help: 'write the boundary lines as CSV (one row a vertex: line, vertex, phase_a, phase_b, firstOrder, densityJump, axis values)', writes: true },
  OUT_FLAG,
  RESUME_FLAG,
];

/** Largest map accepted in one run (shard anything bigger). */
export const MAX_MAP_POINTS = 4_000_000;

export const mapCommand: Command = {
  name: 'map',
  summary: 'phases over a grid of one or two parameters (CSV or JSON), shardable',
  usage: 'map --x name=START..STOPxN [--y name=START..STOPxN] [model flags] [--shard k/n] [--out file]',
  description:
    'Solves the mean-field ground state at every point of a grid over one or two parameters\n' +
    `(${AXIS_HELP}; evenly spaced, start and stop included)\n` +
    'in a pool of worker threads: the adaptive map by default (regions whose corners are one crystal\n' +
    'are certified and filled exactly as a dense solve prints them, boundaries between crystals\n' +
    'located in closed form; docs/certified-maps.md), every pixel with --dense. Prints CSV with a header naming every column, one row a point\n' +
    '(ix, iy, the axis values, then the state), or JSON with --json. The model flags fix\n' +
    'everything the axes do not.\n' +
    'For a cluster: run each of n parts with --shard k/n (k = 1..n) as one job of a job array,\n' +
    'each with its own --out, then join the parts with merge. Rows are written as they finish, in\n' +
    'point order. Ctrl-C or SIGTERM writes the finished points; --resume continues such a part (or\n' +
    'one killed outright) and computes only what is missing.\n' +
    'A point that cannot be solved (or runs past --point-budget) is written with its reason in the\n' +
    'error column (empty for solved points) and the other points are still computed.\n' +
    'JSON ends with solves (points really solved: total, pixels, boundaries), notes (why a map\n' +
    'is not adaptive or not certified: --dense, T > 0, a temperature or density axis; a shard) and the boundary\n' +
    'lines {phases, points, firstOrder, densityJump}; --boundaries file writes the lines as CSV.',
  flags: [...MAP_FLAGS, ...MODEL_FLAGS, ...SCAN_FLAGS, ...OUTPUT_FLAGS, HELP_FLAG],
  examples: [
    'map --x mu=-1..2.5x200 --y rb=1..2x100 --detuning 3 --out map.csv',
    'map --x mu=-1..3.9x200 --y rb=1..2.5x200 --detuning 4 --json --boundaries lines.csv --out map.json',
    'map --x mu=-1..2.5x200 --y temperature=0..0.5x50 --interaction nn --v1 2 --detuning 3 --json',
    'map --x mu=-1..2.5x400 --y rb=1..2x400 --detuning 3 --shard 3/16 --out part-3.csv',
    'map --x mu=-1..2.5x400 --y rb=1..2x400 --detuning 3 --shard 3/16 --out part-3.csv --resume',
  ],
  async run(args, io) {
    const xs = str(args, 'x');
    if (!xs) throw new InputError('map needs --x name=START..STOPxN', 'x');
    const x = parseAxis(xs, 'x');
    const ys = str(args, 'y');
    const y = ys ? parseAxis(ys, 'y') : undefined;
    checkAxes(x, y);
    const axes: AxisName[] = y ? [x.name, y.name] : [x.name];
    const base = modelFromArgs(args, axes);
    const plan: ScanPlan = { base, x, y, seed: seedFromArgs(args) };
    const { nx, ny, points } = gridShape(plan);
    if (points > MAX_MAP_POINTS) throw new InputError(`the map has ${points} points, above ${MAX_MAP_POINTS}; split it with --shard`, 'x');
    const shardText = str(args, 'shard');
    const shard = shardText ? parseShard(shardText) : undefined;
    validatePlan(plan);
    const header = mapHeader(plan, shard ? { ...shard, scan: scanFingerprint(plan), nx, ny } : null);
    // rows are written as they finish, in point order; --resume continues a part (map-stream.ts)
    const mode = mapMode(plan, shard, bool(args, 'dense'));
    const boundaries = str(args, 'boundaries');
    if (boundaries && (!mode.adaptive || shard)) throw new InputError(`--boundaries: this map locates no boundary lines (${shard ? 'a shard locates none: run the map unsharded' : mode.notes[0]})`, 'boundaries');
    const job = {
      plan, shard, header, format: bool(args, 'json') ? 'json' as const : 'csv' as const, continuation: !bool(args, 'cold'),
      label: shard ? `map ${shard.k}/${shard.n}` : 'map', mode, ...(boundaries ? { boundaries } : {}),
    };
    return streamOutput(io, args, (target) => streamMap(io, args, job, target));
  },
};
