/**
 * `staircase`: a mu scan at fixed other parameters and its density plateaus (DESIGN.md,
 * "Plateaus and the staircase"): every incompressible interval with its exact fraction,
 * muLow, muHigh and width. The scan runs in the worker pool with continuation along mu;
 * the edges are then bisected to 1e-9 (one worker task a plateau) unless --grid-edges.
 */
import { InputError } from '../../core/input-error.ts';
import { CLI_RANGE_FORM, parseRange, rangeValues } from '../../core/scan/axes.ts';
import type { ScanPlan } from '../../core/scan/grid.ts';
import { EDGE_TOL } from '../../../workers/scans/staircase-scan.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, str, type FlagSpec, type ParsedArgs } from '../flags.ts';
import { MODEL_FLAGS, modelFromArgs, seedFromArgs } from '../model-flags.ts';
import { SCAN_FLAGS, validatePlan } from '../scan-run.ts';
import { streamStaircase } from '../staircase-stream.ts';
import { OUTPUT_FLAGS } from './solve.ts';
import { OUT_FLAG, RESUME_FLAG, streamOutput } from './output.ts';

const STAIRCASE_FLAGS: readonly FlagSpec[] = [
  ...MODEL_FLAGS.filter((f) => f.name !== 'mu' && f.name !== 'density'),
  { name: 'mu', kind: 'string', value: CLI_RANGE_FORM, help: 'the chemical potentials scanned (required): N points from START to STOP, both ends included (-0.5..2.5x400; the old start:stop:count is still read, with a note)' },
  { name: 'grid-edges', kind: 'bool', help: 'report plateau edges at the grid points (skip the bisection)' },
  OUT_FLAG, RESUME_FLAG, ...SCAN_FLAGS, ...OUTPUT_FLAGS, HELP_FLAG,
];

export const staircaseCommand: Command = {
  name: 'staircase',
  summary: 'a mu scan and its density plateaus (fraction, muLow, muHigh, width)',
  usage: 'staircase --mu=START..STOPxN --detuning delta [--rb Rb | --v1 V1 ...] [flags]',
  description:
    'Scans the chemical potential at fixed interaction, detuning and temperature and finds the\n' +
    'plateaus of the emitter filling: intervals where the state is incompressible (no condensate,\n' +
    'every sublattice empty or filled), each with its exact fraction p/q (q <= --max-cell), its\n' +
    `edges muLow, muHigh (bisected to ${EDGE_TOL} unless --grid-edges) and width. Empty and filled\n` +
    'appear as 0/1 and 1/1; "open" marks an edge at the end of the scan. --json prints\n' +
    '{ "params": ..., "points": [...], "plateaus": [...], "complete": true } with every scan state (a failed\n' +
    'point as { mu, error }), streamed one point a line in mu order as the scan finishes them;\n' +
    '--resume continues such a part left by Ctrl-C, SIGTERM or a killed run (--json only).',
  flags: STAIRCASE_FLAGS,
  examples: [
    'staircase --mu=-0.5..2.5x400 --rb 1.6 --detuning 20',
    'staircase --mu=0..3x300 --interaction dipolar --rb 1.2 --detuning 10 --json',
  ],
  async run(args, io) {
    const muText = str(args, 'mu');
    if (!muText) throw new InputError('staircase needs --mu=START..STOPxN', 'mu');
    const range = parseRange(muText, '--mu');
    const rest: ParsedArgs = { ...args, flags: new Map([...args.flags].filter(([k]) => k !== 'mu')) };
    const base = modelFromArgs(rest, ['mu']);
    const plan: ScanPlan = { base, x: { name: 'mu', ...range, values: rangeValues(range) }, seed: seedFromArgs(args) };
    validatePlan(plan);
    // the table is written at the end: only a JSON part has points on disk to continue
    if (bool(args, 'resume') && !bool(args, 'json')) throw new InputError('staircase --resume needs --json (the plateau table is written only at the end: there is nothing to continue)', 'resume');
    const gridEdges = bool(args, 'grid-edges');
    // points stream in mu order, the plateaus close the output (staircase-stream.ts)
    return streamOutput(io, args, (target) => streamStaircase(io, args, plan, gridEdges, bool(args, 'json'), target));
  },
};
