// The commands run in this process (real worker threads for the scans): solve's JSON and
// its internal consistency, map's CSV and JSON shapes, shard + merge = the whole map, and
// one-line errors with exit code 2 for every kind of bad input. Consistency relations are
// those of DESIGN.md (rho = alpha^2 + mean_s m_s); they hold to rounding (1e-12 absolute:
// a few ulps of quantities of order one), no external source needed.
import { describe, expect, it } from 'vitest';
import { cli } from './test-io.ts';
import { COMMANDS } from '../../src/cli/commands/index.ts';
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';
import { PHASE_LABELS } from '../../src/core/meanfield/state.ts';

const MODEL = ['--rb', '1.3', '--detuning', '3', '--max-cell', '6'];

function oneLineError(r: { code: number; err: string }, pattern: RegExp): void {
  expect(r.code).toBe(2);
  expect(r.err.endsWith('\n')).toBe(true);
  expect(r.err.trimEnd().split('\n').length).toBe(1);
  expect(r.err).toMatch(/^atlas: /);
  expect(r.err).not.toMatch(/\n\s+at /);
  expect(r.err).toMatch(pattern);
}

describe('solve', () => {
  it.each([['-0.5'], ['0'], ['0.8'], ['2.5']])('--json at mu = %s has every field, consistently', async (mu) => {
    const r = await cli(['solve', ...MODEL, '--mu', mu, '--json']);
    expect(r.code).toBe(0);
    const s = JSON.parse(r.out);
    for (const k of ['phase', 'fraction', 'cellSize', 'sublatticeDensities', 'emitterDensity', 'photonDensity',
      'excitationDensity', 'grandPotential', 'mu']) expect(s).toHaveProperty(k);
    expect(PHASE_LABELS).toContain(s.phase);
    expect(s.mu).toBe(Number(mu));
    expect(s.sublatticeDensities.length).toBe(s.cellSize);
    const mean = s.sublatticeDensities.reduce((a: number, b: number) => a + b, 0) / s.cellSize;
    expect(Math.abs(s.emitterDensity - mean)).toBeLessThan(1e-12);
    expect(Math.abs(s.photonDensity - s.alpha ** 2)).toBeLessThan(1e-12);
    expect(Math.abs(s.excitationDensity - (s.alpha ** 2 + s.emitterDensity))).toBeLessThan(1e-12);
    if (s.fraction !== null) expect(s.fraction).toMatch(/^\d+\/\d+$/);
    // the CLI prints exactly what the engine returns
    const direct = solveGroundState(s.params, { seed: 1 });
    expect(s.grandPotential).toBe(direct.grandPotential);
    expect(s.phase).toBe(direct.phase);
  });

  it('prints a table for people, with the 1D finite-temperature caveat on crystals', async () => {
    const r = await cli(['solve', '--rb', '1.5', '--detuning', '3', '--mu', '0.5', '--temperature', '0.02', '--max-cell', '4']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^phase\s+density wave 1\/\d/m);
    expect(r.out).toMatch(/grand potential/);
    expect(r.out).toMatch(/note: in 1D no density wave survives at T > 0/);
  });
});

describe('map', () => {
  const mapArgs = ['map', '--x', 'mu=-1..2.5x9', '--y', 'rb=1..1.4x2', '--detuning', '3', '--max-cell', '6', '--workers', '2'];

  it('writes CSV: a header naming every column, one row a point', async () => {
    const r = await cli(mapArgs);
    expect(r.code).toBe(0);
    const lines = r.out.trimEnd().split('\n');
    const head = lines[0].split(',');
    expect(head.slice(0, 4)).toEqual(['ix', 'iy', 'mu', 'rb']);
    for (const c of ['phase', 'fraction', 'cellSize', 'photonDensity', 'emitterDensity', 'excitationDensity', 'grandPotential', 'sublatticeDensities']) {
      expect(head).toContain(c);
    }
    expect(head.filter((c) => c === 'mu').length).toBe(1);
    expect(lines.length).toBe(1 + 9 * 2);
    for (const l of lines.slice(1)) expect(l.split(',').length).toBe(head.length);
    expect(lines[1].split(',').slice(0, 4).map(Number)).toEqual([0, 0, -1, 1]);
    expect(r.err).toMatch(/^map: 18 of 18 points in .* on 2 workers; \d+ points solved for 18 pixels \(\d+ for the pixels, \d+ confirming boundaries\)\n$/);
  });

  it('writes JSON with the axes and one object a point', async () => {
    const r = await cli([...mapArgs, '--json']);
    const doc = JSON.parse(r.out);
    expect(doc.complete).toBe(true);
    expect(doc.x.values.length).toBe(9);
    expect(doc.points.length).toBe(18);
    expect(doc.points[17]).toMatchObject({ ix: 8, iy: 1, mu: 2.5, rb: 1.4 });
  });

  it('shards merged back equal the unsharded map, in CSV and in JSON', async () => {
    const full = await cli(mapArgs);
    for (const fmt of [[], ['--json']]) {
      const files = new Map<string, string>();
      for (let k = 1; k <= 3; k++) {
        const r = await cli([...mapArgs, ...fmt, '--shard', `${k}/3`, '--out', `p${k}`], files);
        expect(r.code).toBe(0);
        expect(r.out).toBe('');
      }
      const m = await cli(['merge', 'p3', 'p1', 'p2', '--out', 'all'], files);
      expect(m.code).toBe(0);
      if (fmt.length === 0) expect(files.get('all')).toBe(full.out);
      else expect(JSON.parse(files.get('all') as string).points).toEqual(JSON.parse((await cli([...mapArgs, '--json'])).out).points);
      const missing = await cli(['merge', 'p1', 'p3'], files);
      oneLineError(missing, /shard 2\/3 is missing/);
    }
  });

  it('refuses an incomplete part and parts of different scans', async () => {
    const files = new Map<string, string>();
    for (let k = 1; k <= 2; k++) await cli([...mapArgs, '--shard', `${k}/2`, '--out', `p${k}`], files);
    files.set('cut', (files.get('p2') as string).trimEnd().split('\n').slice(0, -1).join('\n') + '\n');
    oneLineError(await cli(['merge', 'p1', 'cut'], files), /shard 2\/2 \(cut\) is incomplete/);
    await cli([...mapArgs, '--seed', '2', '--shard', '2/2', '--out', 'q2'], files);
    oneLineError(await cli(['merge', 'p1', 'q2'], files), /belongs to a different scan/);
    oneLineError(await cli(['merge', 'p1', 'nofile'], files), /cannot read nofile/);
  });

  it('on an interrupt writes the finished part as valid CSV and exits 130', async () => {
    const r = await cli(mapArgs, new Map(), AbortSignal.abort());
    expect(r.code).toBe(130);
    expect(r.out.split('\n')[0]).toMatch(/^ix,iy,mu,rb,phase/);
    expect(r.err).toMatch(/interrupted: wrote the 0 finished of 18 points to stdout/);
  });
});

describe('bad input: one line on stderr, exit code 2', () => {
  it.each([
    [['solve', ...MODEL, '--mu', '0', '--frobnicate'], /unknown flag --frobnicate/],
    [['solve', ...MODEL, '--mu', 'NaN'], /--mu must be a finite number, got 'NaN'/],
    [['solve', ...MODEL, '--mu', '0', '--temperature', '-0.1'], /temperature must be >= 0/],
    [['solve', ...MODEL, '--mu', '3'], /mu = 3 must be below the detuning 3/],
    [['solve', '--rb', '1.3', '--detuning', '3', '--mu', '0', '--max-cell', '99'], /max-cell must be an integer 1\.\.32/],
    [['map', ...MODEL.slice(2), '--x', 'mu=0..1x0', '--y', 'rb=1..2x2'], /empty range \(count 0\)/],
    [['map', ...MODEL, '--x', 'mu=0..1x3', '--shard', '2of4'], /--shard must be k\/n/],
    [['map', ...MODEL, '--x', 'mu=0..1x3', '--shard', '5/4'], /part 5 is outside 1\.\.4/],
    [['map', ...MODEL, '--x', 'mu=0..4x3'], /mu = 4 must be below the detuning 3/],
    [['map', ...MODEL, '--x', 'mu=0..1x3', '--y', 'density=0..1x3'], /both set the pump/],
    [['map', ...MODEL], /map needs --x/],
    [['map', ...MODEL, '--mu', '0', '--x', 'mu=0..1x3'], /--mu conflicts with the mu axis/],
    [['merge'], /merge needs the shard files/],
    [['solver'], /unknown command 'solver'/],
    [[], /no command given/],
  ])('%j', async (argv, msg) => {
    oneLineError(await cli(argv), msg);
  });
});

describe('help', () => {
  // Each example in --help must be valid input. Scans get an interrupt that has already
  // fired, so they validate every point and stop at once (exit 130, not 2).
  // Examples that read a user's own file (merge, --sites my-array.csv) are left out.
  const examples = COMMANDS.filter((c) => !c.positional)
    .flatMap((c) => (c.examples ?? []).filter((e) => !/\.csv\b/.test(e)).map((e) => [e]));
  it.each(examples)('example "%s" is valid input', async (example) => {
    const argv = example.split(/\s+/);
    const r = await cli(argv, new Map(), argv[0] === 'solve' ? undefined : AbortSignal.abort());
    expect(r.err).not.toMatch(/^atlas: (?!interrupted$)/m);
    expect([0, 130]).toContain(r.code);
  });

  it('top level lists every command', async () => {
    const r = await cli(['--help']);
    expect(r.code).toBe(0);
    for (const c of COMMANDS) expect(r.out).toContain(c.name);
  });

  it.each(COMMANDS.map((c) => [c.name]))('%s --help documents every flag', async (name) => {
    const c = COMMANDS.find((x) => x.name === name)!;
    const r = await cli([name, '--help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Usage: /);
    for (const f of c.flags) expect(r.out).toContain(`--${f.name}`);
  });
});
