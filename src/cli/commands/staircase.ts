/**
 * `staircase`: a mu scan at fixed other parameters and its density plateaus (DESIGN.md,
 * "Plateaus and the staircase"): every incompressible interval with its exact fraction,
 * muLow, muHigh and width. The scan runs in the worker pool with continuation along mu;
 * the edges are then bisected to 1e-9 (one worker task a plateau) unless --grid-edges.
 */
import { InputError } from '../../core/input-error.ts';
import { parseRange, rangeValues } from '../../core/scan/axes.ts';
import type { ScanPlan, ScanPoint } from '../../core/scan/grid.ts';
import { paramsJson } from '../../core/scan/map-columns.ts';
import type { Plateau } from '../../core/meanfield/plateaus.ts';
import { EDGE_TOL } from '../../../workers/scans/staircase-scan.ts';
import { HELP_FLAG, type Command } from '../command.ts';
import { bool, str, type FlagSpec, type ParsedArgs } from '../flags.ts';
import { MODEL_FLAGS, modelFromArgs, seedFromArgs } from '../model-flags.ts';
import { SCAN_FLAGS, staircaseWithProgress, validatePlan } from '../scan-run.ts';
import { stateNotes } from '../state-format.ts';
import { OUTPUT_FLAGS } from './solve.ts';
import { finishOutput, OUT_FLAG } from './output.ts';

const STAIRCASE_FLAGS: readonly FlagSpec[] = [
  ...MODEL_FLAGS.filter((f) => f.name !== 'mu' && f.name !== 'density'),
  { name: 'mu', kind: 'string', value: 'start:stop:count', help: 'the chemical potentials scanned (required)' },
  { name: 'grid-edges', kind: 'bool', help: 'report plateau edges at the grid points (skip the bisection)' },
  OUT_FLAG, ...SCAN_FLAGS, ...OUTPUT_FLAGS, HELP_FLAG,
];

export const staircaseCommand: Command = {
  name: 'staircase',
  summary: 'a mu scan and its density plateaus (fraction, muLow, muHigh, width)',
  usage: 'staircase --mu=start:stop:count --detuning delta [--rb Rb | --v1 V1 ...] [flags]',
  description:
    'Scans the chemical potential at fixed interaction, detuning and temperature and finds the\n' +
    'plateaus of the emitter filling: intervals where the state is incompressible (no condensate,\n' +
    'every sublattice empty or filled), each with its exact fraction p/q (q <= --max-cell), its\n' +
    `edges muLow, muHigh (bisected to ${EDGE_TOL} unless --grid-edges) and width. Empty and filled\n` +
    'appear as 0/1 and 1/1; "open" marks an edge at the end of the scan. --json prints\n' +
    '{ "plateaus": [...], "points": [...] } with every scan state (a failed point as { mu, error }).',
  flags: STAIRCASE_FLAGS,
  examples: [
    'staircase --mu=-0.5:2.5:400 --rb 1.6 --detuning 20',
    'staircase --mu=0:3:300 --interaction dipolar --rb 1.2 --detuning 10 --json',
  ],
  async run(args, io) {
    const muText = str(args, 'mu');
    if (!muText) throw new InputError('staircase needs --mu=start:stop:count', 'mu');
    const range = parseRange(muText, '--mu');
    const rest: ParsedArgs = { ...args, flags: new Map([...args.flags].filter(([k]) => k !== 'mu')) };
    const base = modelFromArgs(rest, ['mu']);
    const plan: ScanPlan = { base, x: { name: 'mu', ...range, values: rangeValues(range) }, seed: seedFromArgs(args) };
    validatePlan(plan);
    const gridEdges = bool(args, 'grid-edges');
    const { points, total, result } = await staircaseWithProgress(io, args, plan, gridEdges);
    const complete = result !== null;
    const plateaus = result?.plateaus ?? null;
    for (const e of result?.edgeErrors ?? []) io.stderr(`staircase: an edge bisection failed, grid edges kept: ${e}\n`);
    const text = bool(args, 'json')
      ? JSON.stringify({ complete, params: paramsJson(base), plateaus, points: points.map((p) => p.state ?? { mu: plan.x.values[p.ix], error: p.error }) }) + '\n'
      : staircaseText(plan, points, plateaus, complete && (result?.refined ?? false));
    return finishOutput(io, args, text, { complete, points, total });
  },
};

const f = (x: number) => Number(x.toPrecision(10)).toString();

/** The plateau table for people. */
function staircaseText(plan: ScanPlan, points: ScanPoint[], plateaus: Plateau[] | null, refined: boolean): string {
  const x = plan.x;
  const head = `mu ${f(x.start)} .. ${f(x.stop)} in ${x.count} points; edges ${refined ? `bisected to ${EDGE_TOL}` : 'at grid points (within one step)'}\n`;
  if (!plateaus) return head + `scan interrupted: ${points.length} of ${x.count} points finished, no plateaus computed\n`;
  const rows = plateaus.map((p) => [p.fraction, p.openLow ? `<= ${f(p.muLow)}` : f(p.muLow), p.openHigh ? `>= ${f(p.muHigh)}` : f(p.muHigh),
    p.openLow || p.openHigh ? `>= ${f(p.width)}` : f(p.width), String(p.points)]);
  const table = [['fraction', 'muLow', 'muHigh', 'width', 'points'], ...rows];
  const w = table[0].map((_, j) => Math.max(...table.map((r) => r[j].length)));
  const notes = new Set(points.flatMap((p) => (p.state ? stateNotes(plan.base, p.state) : [])));
  const failed = points.filter((p) => p.error !== undefined).map((p) => `note: mu = ${f(x.values[p.ix])} could not be solved: ${p.error}\n`);
  return head + table.map((r) => r.map((c, j) => c.padEnd(w[j])).join('  ').trimEnd() + '\n').join('') +
    (plateaus.length === 0 ? 'no plateau in this range\n' : '') + [...notes].map((n) => `note: ${n}\n`).join('') + failed.join('');
}
