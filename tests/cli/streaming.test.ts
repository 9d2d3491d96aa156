// Streamed output of staircase, softlines and qmc-scan (issue 12), in this process with real
// worker threads: each writes the bytes the whole-output writers give for the same results
// computed directly on a pool (CSV byte for byte; the streamed JSON document holds the same
// values); qmc-scan --resume of a part cut mid-row equals the uninterrupted run; a stdout
// that does not drain pauses a map after one window. The reorder buffer alone: items put
// out of order come out in order.
// Check values: the in-process results of the same scans (what the earlier non-streaming
// commands printed), and the window arithmetic of map-stream.ts.
import { afterAll, describe, expect, it } from 'vitest';
import { countCursor, ReorderBuffer } from '../../src/cli/reorder-buffer.ts';
import { softlinesCsv } from '../../src/cli/softlines-stream.ts';
import { qmcScanCsv, qmcScanJson } from '../../src/cli/qmc-scan-format.ts';
import { qmcScanOnPool, scanCrossings } from '../../workers/qmc-scan.ts';
import { runScan } from '../../workers/scan-driver.ts';
import { nodeEnginePool } from '../../workers/node-spawn.ts';
import type { SoftLineResult } from '../../src/core/softmode/soft-lines.ts';
import { cli } from './test-io.ts';

const pool = nodeEnginePool(2);
afterAll(() => pool.close());

describe('the reorder buffer', () => {
  it('writes items in key order whatever order they arrive in, once each', () => {
    const out: string[] = [];
    const b = new ReorderBuffer<string>(countCursor(0, 5), (v, k) => out.push(`${k}${v}`));
    expect(b.put(2, 'c')).toBe(true);
    expect(b.put(1, 'b')).toBe(true);
    expect(out).toEqual([]);
    expect(b.put(0, 'a')).toBe(true);
    expect(out).toEqual(['0a', '1b', '2c']);
    expect(b.put(1, 'again')).toBe(false); // written before
    expect(b.put(4, 'e')).toBe(true);
    expect(b.put(4, 'twice')).toBe(false); // already waiting
    expect(b.size).toBe(1);
    b.put(3, 'd');
    expect(out).toEqual(['0a', '1b', '2c', '3d', '4e']);
    expect(b.peak).toBe(3); // 2 and 1 waiting when 0 came in
    expect(b.put(5, 'past the end')).toBe(false);
  });
});

const SOFT = ['softlines', '--x', 'mu=-1..0.9x5', '--y', 'rb=0.8..1.5x5', '--detuning', '1', '--ranges', 'nn,vdw:2', '--phases', 'condensate,normal', '--workers', '2'];

describe('softlines streams its lines in task order', () => {
  it('CSV: the bytes of the whole-output writer for the same tasks; JSON: the same results', async () => {
    const csv = await cli(SOFT);
    expect(csv.code).toBe(0);
    expect(csv.err).toMatch(/^softlines: 4 of 4 lines in .* margin evaluations\n$/);
    // the same four tasks (ranges outer, phases inner) straight on a pool
    const base = { lattice: 'chain' as const, interaction: { shape: 'vdw' as const }, mu: 0, delta: 1, T: 0 };
    const x = { name: 'mu' as const, start: -1, stop: 0.9, count: 5 }, y = { name: 'rb' as const, start: 0.8, stop: 1.5, count: 5 };
    const tasks = ['nn', 'vdw:2'].flatMap((range) => (['condensate', 'normal'] as const).map((phase) => ({ base, x, y, range, phase, tol: 1e-3 })));
    const direct = await runScan(pool, { kind: 'soft-lines', lines: tasks });
    const results = direct.results as SoftLineResult[];
    expect(csv.out).toBe(softlinesCsv(results, true));
    expect(csv.out.split('\n').length).toBeGreaterThan(20); // lines were found: the comparison compares rows
    const json = await cli([...SOFT, '--json']);
    const doc = JSON.parse(json.out);
    expect(doc.complete).toBe(true);
    expect(doc.results).toEqual(JSON.parse(JSON.stringify(results)));
    expect(doc.tol).toBe(1e-3);
    expect(json.out.split('\n').length).toBe(4 + 3); // head, one result a line, the closing line, final line end
  }, 120_000);
});

const QMC = ['qmc-scan', '--x', 'alpha=0.2..0.6x3', '--sizes', '4,6', '--interaction', 'nn', '--v1', '1', '--mu', '1', '--temperature', '0.5', '--sweeps', '200', '--bins', '8', '--workers', '2'];
const qmcReq = (shard?: { k: number; n: number }) => ({
  base: {
    cluster: { kind: 'periodic' as const, lattice: 'chain' as const, size: [2], interaction: { shape: 'nn' as const, V1: 1 } }, mu: 1, alpha: undefined as number | undefined,
  },
  sizes: [4, 6], axis: { name: 'alpha' as const, values: [0.2, 0.4, 0.6] }, shard,
});

describe('qmc-scan streams its runs in index order and resumes', () => {
  let whole = '';
  it('CSV and JSON equal the whole-output writers on the same runs', async () => {
    const r = await cli([...QMC, '--out', 'q.csv']);
    expect(r.code).toBe(0);
    whole = r.files.get('q.csv') as string;
    expect(whole.split('\n').length).toBe(1 + 6 + 1);
    // the same runs: rebuild the request the command builds from the CSV's own parameters
    const j = await cli([...QMC, '--json']);
    const doc = JSON.parse(j.out);
    expect(doc.complete).toBe(true);
    const req = { ...qmcReq(), base: { cluster: qmcReq().base.cluster, ...doc.params, lattice: undefined, interaction: undefined } };
    delete req.base.lattice;
    delete req.base.interaction;
    const points = await qmcScanOnPool(req, pool);
    expect(whole).toBe(qmcScanCsv(req, points));
    expect(doc).toEqual(JSON.parse(qmcScanJson(req, points, scanCrossings(points), true)));
    expect(doc.points.map((p: { index: number }) => p.index)).toEqual([0, 1, 2, 3, 4, 5]);
  }, 120_000);

  it('a part cut inside its fourth row, resumed, is the uninterrupted file; a foreign part is refused', async () => {
    const lines = whole.split('\n');
    const cut = lines.slice(0, 4).join('\n') + '\n' + lines[4].slice(0, 25); // header, three rows, a torn fourth
    const r = await cli([...QMC, '--out', 'q.csv', '--resume'], new Map([['q.csv', cut]]));
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/qmc-scan: 6 of 6 runs in .*\(3 read back\)/);
    expect(r.files.get('q.csv')).toBe(whole);
    const other = whole.replace('\n1,4,0.4,', '\n1,4,0.45,');
    const bad = await cli([...QMC, '--out', 'q.csv', '--resume'], new Map([['q.csv', other]]));
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/q\.csv line 3 does not continue this scan \(run \(index 1, size 4, value 0\.45\), expected \(index 1, size 4, value 0\.4\)\)/);
  }, 120_000);
});

const STAIR = ['staircase', '--mu=-0.5..3x36', '--interaction', 'nn', '--v1', '1', '--detuning', '50', '--max-cell', '4', '--workers', '2'];

describe('staircase streams its points, plateaus at the end', () => {
  it('JSON: one point a line in mu order, then the plateaus of the scan run directly; text: the table', async () => {
    const r = await cli([...STAIR, '--json']);
    expect(r.code).toBe(0);
    const lines = r.out.split('\n');
    expect(lines.length).toBe(1 + 36 + 1 + 1);
    expect(lines[37]).toMatch(/^\],"plateaus":\[.*\],"complete":true\}$/);
    const doc = JSON.parse(r.out);
    const plan = { base: { lattice: 'chain' as const, interaction: { shape: 'nn' as const, V1: 1 }, delta: 50, T: 0, maxCell: 4, mu: 0 }, x: { name: 'mu' as const, start: -0.5, stop: 3, count: 36, values: Array.from({ length: 36 }, (_, i) => -0.5 + (3.5 * i) / 35) }, seed: 1 };
    const direct = await runScan(pool, { kind: 'staircase', plan: { ...plan, base: { ...plan.base, ...doc.params } }, gridEdges: false });
    expect(doc.points).toEqual(JSON.parse(JSON.stringify(direct.points.map((p) => p.state))));
    expect(doc.plateaus).toEqual(JSON.parse(JSON.stringify(direct.plateaus)));
    expect(doc.plateaus.map((p: { fraction: string }) => p.fraction)).toEqual(['0/1', '1/2', '1/1']);
    const t = await cli(STAIR);
    expect(t.out).toMatch(/^mu -0\.5 \.\. 3 in 36 points; edges bisected to 1e-9\nfraction  muLow +muHigh +width +points\n0\/1 +<= -0\.5 +-0\.0199899\d* /);
  }, 120_000);
});

describe('backpressure: a stdout that does not drain pauses the map', () => {
  it('one window (16 segments) is written, no more, until stdout drains; then the whole map', async () => {
    // 100 x 20 at T > 0, dense: rows of 7 segments (15, 15, 14, 14, 14, 14, 14 points)
    const MAP = ['map', '--x', 'mu=-1..2x100', '--y', 'rb=1..1.5x20', '--detuning', '3', '--temperature', '0.05', '--max-cell', '2', '--dense', '--workers', '2'];
    const free = await cli(MAP);
    expect(free.code).toBe(0);
    let out = '', calls = 0, release = () => undefined as void;
    const gate = new Promise<void>((resolve) => { release = resolve; });
    const run = cli(MAP, new Map(), undefined, {
      stdout: (t) => void (out += t),
      stdoutDrained: () => (++calls === 1 ? Promise.resolve() : gate),
    });
    const rows = () => out.split('\n').length - 2;
    // the writer flushes at 64 KiB: wait for the first window's rows to be computed, then look
    for (let i = 0; i < 200 && calls < 2; i++) await new Promise((r) => setTimeout(r, 50));
    await new Promise((r) => setTimeout(r, 1500));
    expect(calls).toBe(2); // the scan asked again before a second window, and waits
    expect(rows()).toBeLessThanOrEqual(230); // 2 rows of 100 + 15 + 15: nothing beyond the first window
    release();
    const r = await run;
    expect(r.code).toBe(0);
    expect(out).toBe(free.out);
    expect(rows()).toBe(2000);
  }, 120_000);

  it('the adaptive map: its first band (16 rows) is written, no more, until stdout drains; then the whole map', async () => {
    const MAP = ['map', '--x', 'mu=-1..2x100', '--y', 'rb=1..1.5x50', '--detuning', '3', '--max-cell', '2', '--workers', '2'];
    const free = await cli(MAP);
    expect(free.code).toBe(0);
    let out = '', calls = 0, release = () => undefined as void;
    const gate = new Promise<void>((resolve) => { release = resolve; });
    const run = cli(MAP, new Map(), undefined, {
      stdout: (t) => void (out += t),
      stdoutDrained: () => (++calls === 1 ? Promise.resolve() : gate),
    });
    const rows = () => Math.max(0, out.split('\n').length - 2);
    for (let i = 0; i < 400 && calls < 2; i++) await new Promise((r) => setTimeout(r, 50));
    await new Promise((r) => setTimeout(r, 1500));
    expect(calls).toBe(2); // the scan asked again before its second band, and waits
    expect(rows()).toBeLessThanOrEqual(1600); // rows 0..15 at most (the writer flushes every 64 KiB)
    release();
    const r = await run;
    expect(r.code).toBe(0);
    expect(out).toBe(free.out);
    expect(rows()).toBe(5000);
  }, 120_000);
});

// --resume of staircase and softlines, in this process on parts cut as a killed run leaves
// them (a torn last line): the uninterrupted run's bytes (common practice, no source:
// resuming must not change a byte), and a part of another scan refused naming its line.
describe('staircase and softlines continue a part cut short', () => {
  const STEP = ['staircase', '--mu=-0.5..3x60', '--interaction', 'nn', '--v1', '1', '--detuning', '50', '--max-cell', '4', '--workers', '2', '--json', '--out', 's.json'];
  it('staircase JSON: cut inside its 24th point, resumed, the whole document; a table cannot resume', async () => {
    const whole = await cli(STEP);
    expect(whole.code).toBe(0);
    const full = whole.files.get('s.json') as string;
    const lines = full.split('\n');
    expect(lines.length).toBe(1 + 60 + 1 + 1);
    // head, 23 whole points and a torn 24th (it lies in the second segment of the line)
    const cut = lines.slice(0, 24).join('\n') + '\n' + lines[24].slice(0, 50);
    const r = await cli([...STEP, '--resume'], new Map([['s.json', cut]]));
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/staircase: 60 of 60 points in .*\(23 read back\)/);
    expect(r.files.get('s.json') === full).toBe(true);
    // an interrupted part (its closing line says not complete) continues the same way
    const stopped = lines.slice(0, 31).join('\n') + '\n],"plateaus":null,"complete":false}\n';
    expect((await cli([...STEP, '--resume'], new Map([['s.json', stopped]]))).files.get('s.json') === full).toBe(true);
    const other = await cli([...STEP.map((a) => (a === '--mu=-0.5..3x60' ? '--mu=-0.5..3x61' : a)), '--resume'], new Map([['s.json', cut]]));
    expect(other.code).toBe(2);
    expect(other.err).toMatch(/s\.json line 3 does not continue this scan \(mu -0\.44\d*, expected -0\.4416/);
    const table = await cli([...STEP.filter((a) => a !== '--json'), '--resume']);
    expect(table.code).toBe(2);
    expect(table.err).toMatch(/staircase --resume needs --json/);
  }, 120_000);

  const LINES = ['softlines', '--x', 'mu=-1..0.9x5', '--y', 'rb=0.8..1.5x5', '--detuning', '1', '--ranges', 'nn,vdw:1,vdw:2', '--phases', 'condensate,normal', '--workers', '2', '--out', 'l'];
  it('softlines CSV cut inside a task and JSON cut inside a line, resumed: the whole files; other ranges refused', async () => {
    const whole = await cli(LINES);
    expect(whole.code).toBe(0);
    const full = whole.files.get('l') as string;
    const rows = full.split('\n');
    // the rows of the third task (range vdw:1, phase condensate) start where its line 0 point 0 is
    const third = rows.findIndex((r) => r.startsWith('vdw:1,condensate,0,0,'));
    expect(third).toBeGreaterThan(2);
    const cut = rows.slice(0, third + 2).join('\n') + '\n' + rows[third + 2].slice(0, 12);
    const r = await cli([...LINES, '--resume'], new Map([['l', cut]]));
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/softlines: 6 of 6 lines in .*\(2 read back\)/); // the third task may be cut short: traced again
    expect(r.files.get('l') === full).toBe(true);
    const bad = await cli([...LINES.map((a) => (a === 'nn,vdw:1,vdw:2' ? 'vdw:1,nn,vdw:2' : a)), '--resume'], new Map([['l', cut]]));
    expect(bad.code).toBe(2);
    // a CSV part names no parameters: its rows are checked to follow the tasks in order
    expect(bad.err).toMatch(/^atlas: l line \d+ does not continue this scan \(range vdw:1, phase condensate, line 0, point 0 does not follow the tasks in order\)/);
    const map = await cli([...LINES, '--resume'], new Map([['l', 'ix,iy,mu,rb,phase\n0,0,-1,0.8,empty\n']]));
    expect(map.err).toMatch(/^atlas: l line 1 does not continue this scan \(its header differs from this scan's: 'ix,iy,mu,rb,phase' against 'range,phase,line,point,x,y,k,kind,jump'\)/);
    const js = await cli([...LINES, '--json']);
    const doc = js.files.get('l') as string;
    const jl = doc.split('\n');
    expect(jl.length).toBe(1 + 6 + 1 + 1);
    const jr = await cli([...LINES, '--json', '--resume'], new Map([['l', jl.slice(0, 4).join('\n') + '\n' + jl[4].slice(0, 30)]]));
    expect(jr.err).toMatch(/\(3 read back\)/);
    expect(jr.files.get('l') === doc).toBe(true);
  }, 120_000);
});
