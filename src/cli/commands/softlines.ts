/**
 * `softlines`: soft-mode lines over a plane of two parameters, for several interaction
 * ranges at once, in the worker pool (one task per range and followed phase). Each line is
 * traced by bisection and continuation from a seed grid (src/core/softmode), and every
 * point carries the softest wavevector k* there. CSV (one row a point) or JSON, streamed
 * in task order (softlines-stream.ts).
 */
import { InputError } from '../../core/input-error.ts';
import { CLI_AXIS_FORM, parseAxis } from '../../core/scan/axes.ts';
import { checkPlane, planePoint, type PlaneAxis, type PlaneAxisName } from '../../core/softmode/plane.ts';
import type { FollowedPhase } from '../../core/softmode/own-solution.ts';
import type { SoftLineRequest } from '../../core/softmode/soft-lines.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, num, str, type FlagSpec, type ParsedArgs } from '../flags.ts';
import { MODEL_FLAGS, modelFromArgs } from '../model-flags.ts';
import { SCAN_FLAGS } from '../scan-run.ts';
import { streamSoftlines } from '../softlines-stream.ts';
import { OUTPUT_FLAGS } from './solve.ts';
import { OUT_FLAG, RESUME_FLAG, streamOutput } from './output.ts';

export { softlinesCsv } from '../softlines-stream.ts';

export const DEFAULT_RANGES = 'nn,vdw:1,vdw:2,vdw:3,vdw:inf,dipolar';

const FLAGS: readonly FlagSpec[] = [
  { name: 'x', kind: 'string', value: CLI_AXIS_FORM, help: 'first axis: mu, detuning, temperature, rb or v1; N = seed-grid nodes' },
  { name: 'y', kind: 'string', value: CLI_AXIS_FORM, help: 'second axis (as --x)' },
  { name: 'ranges', kind: 'string', value: 'list', def: DEFAULT_RANGES, help: 'interactions to compare: nn, vdw[:rmax], dipolar[:rmax], softcore[:rmax]; rmax a number or inf' },
  { name: 'phases', kind: 'string', value: 'list', def: 'condensate,normal', help: 'phases followed: condensate (uniform), normal (uniform, no photon), crystal:1,0,... (1D pattern)' },
  { name: 'tol', kind: 'number', value: 'tol', def: '1e-3', help: 'accuracy of the lines as a fraction of each axis span' },
  OUT_FLAG,
  RESUME_FLAG,
];

export const softlinesCommand: Command = {
  name: 'softlines',
  summary: 'soft-mode lines over a plane of two parameters, several interaction ranges at once',
  usage: 'softlines --x name=START..STOPxN --y name=START..STOPxN [--ranges list] [--phases list] [model flags]',
  description:
    'For each interaction range and followed phase, the lines in the (x, y) plane where that\n' +
    "phase's own mean-field solution first becomes unstable: the uniform condensate going soft\n" +
    'towards a density wave at k*, the normal state (empty, filled, thermal) towards condensation\n' +
    'at k = 0 or a density wave. The stability margin (lowest eigenvalue of 1 - chi0 U(k) over the\n' +
    'zone) is found on a seed grid of count x count nodes, its sign changes are bisected and the\n' +
    'lines followed by continuation to --tol. Ranges share the strength of --rb (or --v1): vdw and\n' +
    'dipolar take Rb with V(Rb) = 2, nn takes V1 (or 2 Rb^6, the vdw value at r = 1). Prints CSV\n' +
    'rows range,phase,line,point,x,y,k (kx,ky in 2D),kind,jump or JSON with --json, each range and phase\n' +
    'written as soon as it and those before it are traced; --resume continues a part left by Ctrl-C,\n' +
    'SIGTERM or a killed run, tracing only the ranges and phases not finished.',
  flags: [...FLAGS, ...MODEL_FLAGS, ...SCAN_FLAGS.filter((f) => f.name !== 'cold'), ...OUTPUT_FLAGS, HELP_FLAG],
  examples: [
    'softlines --x mu=-1..0.9x9 --y rb=0.8..1.5x9 --detuning 1 --ranges nn,vdw:2,vdw:inf,dipolar --phases condensate',
    'softlines --x mu=-1.5..0.5x9 --y temperature=0..1x9 --rb 1 --detuning 1 --phases normal --json',
  ],
  async run(args, io) {
    const [x, y] = (['x', 'y'] as const).map((k) => planeAxis(args, k));
    checkPlane(x, y);
    const base = modelFromArgs(args, [x.name, y.name]);
    const tol = num(args, 'tol') ?? 1e-3;
    if (!(tol > 0 && tol <= 0.1)) throw new InputError(`--tol must be in (0, 0.1], got ${tol}`, 'tol');
    const ranges = (str(args, 'ranges') ?? DEFAULT_RANGES).split(',').map((s) => s.trim()).filter(Boolean);
    if (ranges.length === 0) throw new InputError('--ranges is empty', 'ranges');
    const point = { lattice: base.lattice, interaction: base.interaction, mu: base.mu ?? 0, delta: base.delta, T: base.T };
    // Refuse a bad range (or one missing its strength) before any work: resolve it at a corner.
    for (const r of ranges) planePoint(point, r, x, x.start, y, y.start);
    const phases = (str(args, 'phases') ?? 'condensate,normal').split(',').map((s) => s.trim()).filter(Boolean);
    const followed = parsePhases(phases, base.lattice);
    const tasks: SoftLineRequest[] = [];
    for (const range of ranges) for (const phase of followed) tasks.push({ base: point, x, y, range, phase, tol });
    // each task's lines are written as it and those before it finish (softlines-stream.ts)
    const job = { tasks, base, x, y, tol, json: bool(args, 'json') };
    return streamOutput(io, args, (target) => streamSoftlines(io, args, job, target), { unit: 'lines' });
  },
};

function planeAxis(args: ParsedArgs, flag: 'x' | 'y'): PlaneAxis {
  const s = str(args, flag);
  if (!s) throw new InputError(`softlines needs --${flag} name=START..STOPxN`, flag);
  const a = parseAxis(s, flag);
  return { name: a.name as PlaneAxisName, start: a.start, stop: a.stop, count: a.count };
}

/** Followed phases from their names; crystal:1,0,0 is a 1D pattern (cell = its length). */
export function parsePhases(names: string[], lat: string): FollowedPhase[] {
  return names.map((n) => {
    if (n === 'condensate' || n === 'normal') return n;
    const m = /^crystal:([01](,[01])*)$/.exec(n);
    if (m && lat === 'chain') {
      const pattern = m[1].split(',').map(Number);
      return { cell: { a: pattern.length, b: 0, c: 1 }, pattern };
    }
    throw new InputError(`unknown phase '${n}' (use condensate, normal, or crystal:1,0,... on the chain)`, 'phases');
  });
}
