// Streaming output and --resume, through the built CLI as a user runs it (dist/cli/atlas.mjs,
// built first by scripts/build-cli.mjs): a map stopped by SIGKILL, SIGTERM or Ctrl-C midway
// and continued with --resume is byte for byte the uninterrupted run, for a whole map and
// for one shard, in CSV and JSON; a torn last line is dropped; a part of another scan is
// refused; merge refuses a NaN, a non-numeric field and a row cut short, naming the line.
// The same for staircase (JSON), softlines and qmc-scan, and for every streaming command a
// run killed or failing leaves an existing --out file as it was.
// Check values: the uninterrupted run of the same command (common practice, no source:
// resuming must not change a byte), and the refusals' wording.
import { execFileSync, spawn } from 'node:child_process';
import { appendFileSync, existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli } from './test-io.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
/** 1800 points at --max-cell 4: a few seconds on two workers, long enough to stop midway. */
const MAP = ['map', '--x', 'mu=-1..2x60', '--y', 'rb=1..1.5x30', '--detuning', '3', '--max-cell', '4', '--workers', '2'];
const POINTS = 60 * 30;
let tmp = '';

interface Run { code: number | null; err: string }

/**
 * Run the built CLI; with `stop`, send that signal once the file `watch` holds more than
 * `bytes` bytes (rows are being written), polling every 50 ms, or once stderr matches
 * `err` (a progress line). Never left running: a guard kills it after 90 s.
 */
function atlas(argv: string[], stop?: { signal: NodeJS.Signals; watch?: string; bytes?: number; err?: RegExp }): Promise<Run> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [join(root, 'dist', 'cli', 'atlas.mjs'), ...argv], { cwd: tmp, env: { ...process.env, ATLAS_PROGRESS: '0' } });
    let err = '';
    let sent = false;
    child.stderr.on('data', (d: Buffer) => {
      err += d.toString();
      if (stop?.err && !sent && stop.err.test(err)) {
        sent = true;
        child.kill(stop.signal);
      }
    });
    child.stdout.resume();
    const poll = stop?.watch ? setInterval(() => {
      const size = existsSync(stop.watch as string) ? statSync(stop.watch as string).size : 0;
      if (size > (stop.bytes ?? 0) && !sent) {
        sent = true;
        clearInterval(poll);
        child.kill(stop.signal);
      }
    }, 50) : undefined;
    const guard = setTimeout(() => child.kill('SIGKILL'), 90_000);
    child.on('close', (code) => {
      clearTimeout(guard);
      if (poll) clearInterval(poll);
      resolve({ code, err });
    });
  });
}

const file = (name: string) => join(tmp, name);
const lines = (name: string) => readFileSync(file(name), 'utf8').split('\n').length - 1;

beforeAll(() => {
  execFileSync(process.execPath, ['scripts/build-cli.mjs', '--quiet'], { cwd: root });
  tmp = mkdtempSync(join(tmpdir(), 'atlas-resume-'));
});
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('a map stopped midway and resumed is the uninterrupted run, byte for byte', () => {
  let whole = '';
  beforeAll(async () => {
    const r = await atlas([...MAP, '--out', 'whole.csv']);
    expect(r.code).toBe(0);
    whole = readFileSync(file('whole.csv'), 'utf8');
    expect(whole.split('\n').length - 2).toBe(POINTS); // header + rows + final line end
  }, 120_000);

  it('SIGKILL: the .partial file holds whole rows and a possibly torn one; --resume completes it', async () => {
    const r = await atlas([...MAP, '--out', 'kill.csv'], { signal: 'SIGKILL', watch: file('kill.csv.partial'), bytes: 20_000 });
    expect(r.code).toBe(null); // killed: no exit code
    expect(existsSync(file('kill.csv'))).toBe(false);
    const part = readFileSync(file('kill.csv.partial'), 'utf8');
    expect(whole.startsWith(part)).toBe(true); // a byte prefix of the finished file
    const rows = part.split('\n').length - 2;
    expect(rows).toBeGreaterThan(100);
    expect(rows).toBeLessThan(POINTS);
    const again = await atlas([...MAP, '--out', 'kill.csv', '--resume']);
    expect(again.code).toBe(0);
    expect(again.err).toMatch(/read back/);
    expect(existsSync(file('kill.csv.partial'))).toBe(false);
    expect(readFileSync(file('kill.csv'), 'utf8') === whole).toBe(true);
  }, 120_000);

  it.each([['SIGTERM', 143], ['SIGINT', 130]] as const)('%s: the finished part goes to --out (exit %i); --resume completes it', async (signal, code) => {
    const out = `${signal}.csv`;
    const r = await atlas([...MAP, '--out', out], { signal, watch: file(`${out}.partial`), bytes: 20_000 });
    expect(r.code).toBe(code);
    expect(r.err).toMatch(/continue it with --resume/);
    const part = readFileSync(file(out), 'utf8');
    expect(whole.startsWith(part)).toBe(true);
    expect(lines(out) - 1).toBeLessThan(POINTS);
    const again = await atlas([...MAP, '--out', out, '--resume']);
    expect(again.code).toBe(0);
    expect(readFileSync(file(out), 'utf8') === whole).toBe(true);
  }, 120_000);

  it('a torn last line is dropped and computed again; a finished file resumes to itself', async () => {
    const rows = whole.split('\n');
    // 250 whole rows and half of the next one, as a process killed mid-write leaves them
    writeFileSync(file('torn.csv.partial'), rows.slice(0, 251).join('\n') + '\n' + rows[251].slice(0, 30));
    const r = await atlas([...MAP, '--out', 'torn.csv', '--resume']);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/250 read back/);
    expect(readFileSync(file('torn.csv'), 'utf8') === whole).toBe(true);
    const done = await atlas([...MAP, '--out', 'torn.csv', '--resume']);
    expect(done.code).toBe(0);
    expect(done.err).toMatch(/nothing left to compute/);
    expect(readFileSync(file('torn.csv'), 'utf8') === whole).toBe(true);
  }, 120_000);

  it('a part of another scan is refused, naming the line, and left as it was', async () => {
    writeFileSync(file('other.csv'), whole.split('\n').slice(0, 40).join('\n') + '\n');
    const r = await atlas([...MAP.map((a) => (a === 'mu=-1..2x60' ? 'mu=-1..2.5x60' : a)), '--out', 'other.csv', '--resume']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/other\.csv line 3 does not continue this scan \(axis values/);
    expect(lines('other.csv')).toBe(40);
  }, 60_000);

  it('a part of a scan with the same axes but another interaction is refused where its points differ, and left as it was', async () => {
    // the unsharded CSV's head is its columns only: points that open a segment, solved
    // again, tell the scans apart (the first ones, at mu < 0, are empty in both: the same lines)
    writeFileSync(file('other-shape.csv'), whole.split('\n').slice(0, 40).join('\n') + '\n');
    const r = await atlas([...MAP, '--interaction', 'dipolar', '--out', 'other-shape.csv', '--resume']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/other-shape\.csv line \d+ does not continue this scan \(its point there differs/);
    expect(lines('other-shape.csv')).toBe(40);
  }, 60_000);
});

describe('a shard stopped by SIGKILL and resumed, in CSV and JSON', () => {
  // a map whose shard runs for a few seconds (an adaptive shard of MAP ends in half a
  // second, before the kill can arrive), and its unsharded CSV to compare the merge with
  const SHARDED = ['map', '--x', 'mu=-1..3.9x160', '--y', 'rb=1..2.5x80', '--detuning', '4', '--max-cell', '12', '--workers', '2'];
  const NX = 160, SHARDED_POINTS = 160 * 80;
  beforeAll(async () => {
    expect((await atlas([...SHARDED, '--out', 'shard-whole.csv'])).code).toBe(0);
  }, 120_000);
  it.each(['csv', 'json'])('%s: byte for byte the uninterrupted shard, and the parts merge', async (format) => {
    const json = format === 'json' ? ['--json'] : [];
    const shard = (k: number) => [...SHARDED, '--shard', `${k}/2`, ...json];
    const [a, b] = [`s1.${format}`, `s2.${format}`];
    expect((await atlas([...shard(1), '--out', `ref-${a}`])).code).toBe(0);
    const killed = await atlas([...shard(1), '--out', a], { signal: 'SIGKILL', watch: file(`${a}.partial`), bytes: 20_000 });
    expect(killed.code).toBe(null);
    expect((await atlas([...shard(1), '--out', a, '--resume'])).code).toBe(0);
    expect(readFileSync(file(a), 'utf8') === readFileSync(file(`ref-${a}`), 'utf8')).toBe(true);
    expect((await atlas([...shard(2), '--out', b])).code).toBe(0);
    expect((await atlas(['merge', a, b, '--out', `merged.${format}`])).code).toBe(0);
    const merged = readFileSync(file(`merged.${format}`), 'utf8');
    if (format === 'csv') expect(merged === readFileSync(file('shard-whole.csv'), 'utf8')).toBe(true);
    else {
      const doc = JSON.parse(merged) as { shard: null; complete: boolean; points: { ix: number; iy: number }[] };
      expect(doc.shard).toBe(null);
      expect(doc.complete).toBe(true);
      expect(doc.points.map((p) => p.iy * NX + p.ix)).toEqual(Array.from({ length: SHARDED_POINTS }, (_, i) => i));
    }
  }, 180_000);
});

describe('merge checks every value of every part', () => {
  const small = ['map', '--x', 'mu=-1..2x20', '--y', 'rb=1..1.5x3', '--detuning', '3', '--max-cell', '3', '--workers', '2'];
  let parts = new Map<string, string>();
  beforeAll(async () => {
    for (const k of [1, 2]) {
      const r = await cli([...small, '--shard', `${k}/2`, '--out', `p${k}`], parts);
      expect(r.code).toBe(0);
      parts = r.files;
    }
  }, 60_000);
  const damaged = (edit: (rows: string[]) => void) => {
    const rows = (parts.get('p2') as string).split('\n');
    edit(rows);
    return new Map([['p1', parts.get('p1') as string], ['p2', rows.join('\n')]]);
  };
  const column = (name: string) => (parts.get('p2') as string).split('\n')[1].split(',').indexOf(name);

  it('a NaN in a number column', async () => {
    const files = damaged((rows) => {
      const f = rows[4].split(',');
      f[column('grandPotential')] = 'NaN';
      rows[4] = f.join(',');
    });
    const r = await cli(['merge', 'p1', 'p2'], files);
    expect(r.code).toBe(2);
    expect(r.err).toBe("atlas: p2 line 5: grandPotential is 'NaN', not a number\n");
  });

  it('text where a number belongs, in a list column', async () => {
    const files = damaged((rows) => {
      const f = rows[6].split(',');
      f[column('sublatticeDensities')] = '1 x';
      rows[6] = f.join(',');
    });
    const r = await cli(['merge', 'p1', 'p2'], files);
    expect(r.err).toBe("atlas: p2 line 7: sublatticeDensities holds 'x', not a number\n");
  });

  it('a truncated row (cut short, no line end) and a row missing its last fields', async () => {
    const cut = damaged((rows) => {
      rows.length = rows.length - 1; // the final line end goes
      rows[rows.length - 1] = rows[rows.length - 1].slice(0, 25);
    });
    const n = (parts.get('p2') as string).split('\n').length - 1;
    const r = await cli(['merge', 'p1', 'p2'], cut);
    expect(r.code).toBe(2);
    expect(r.err).toBe(`atlas: p2 line ${n} is cut short (no line end): the part is truncated\n`);
    const short = damaged((rows) => {
      rows[3] = rows[3].split(',').slice(0, 6).join(',');
    });
    const s = await cli(['merge', 'p1', 'p2'], short);
    expect(s.err).toMatch(/^atlas: p2 line 4: 6 fields, the header has \d+ \(the row is cut short or damaged\)\n$/);
  });

  it('JSON parts: a string where a number belongs, and a line that is not whole JSON', async () => {
    let js = new Map<string, string>();
    for (const k of [1, 2]) js = (await cli([...small, '--json', '--shard', `${k}/2`, '--out', `j${k}`], js)).files;
    const rows = (js.get('j1') as string).split('\n');
    rows[3] = rows[3].replace(/"alpha":[^,]+/, '"alpha":"0.1"');
    const bad = await cli(['merge', 'j1', 'j2'], new Map([['j1', rows.join('\n')], ['j2', js.get('j2') as string]]));
    expect(bad.err).toBe('atlas: j1 line 4: alpha is "0.1", not a number\n');
    const torn = (js.get('j2') as string).split('\n');
    torn[2] = torn[2].slice(0, 40);
    const t = await cli(['merge', 'j1', 'j2'], new Map([['j1', js.get('j1') as string], ['j2', torn.join('\n')]]));
    expect(t.err).toBe('atlas: j2 line 3 is not valid JSON (cut short?)\n');
    const good = await cli(['merge', 'j2', 'j1'], js);
    expect(good.code).toBe(0);
    expect((JSON.parse(good.out) as { points: unknown[] }).points.length).toBe(60);
  }, 60_000);
});

describe('staircase, softlines and qmc-scan stopped midway and resumed; an existing file survives a failed run', () => {
  const OLD = 'an older result\n';
  const STAIR = ['staircase', '--mu=-0.5..3x5000', '--interaction', 'nn', '--v1', '1', '--detuning', '50', '--max-cell', '6', '--workers', '2', '--json'];
  let stair = '';
  beforeAll(async () => {
    expect((await atlas([...STAIR, '--out', 'stair.json'])).code).toBe(0);
    stair = readFileSync(file('stair.json'), 'utf8');
    expect(stair.split('\n').length).toBe(1 + 5000 + 1 + 1);
  }, 120_000);

  it('staircase: SIGKILL leaves the old file and a .partial; --resume completes it byte for byte', async () => {
    writeFileSync(file('sk.json'), OLD);
    const r = await atlas([...STAIR, '--out', 'sk.json'], { signal: 'SIGKILL', watch: file('sk.json.partial'), bytes: 20_000 });
    expect(r.code).toBe(null);
    expect(readFileSync(file('sk.json'), 'utf8')).toBe(OLD);
    const part = readFileSync(file('sk.json.partial'), 'utf8');
    expect(stair.startsWith(part)).toBe(true);
    expect(part.length).toBeLessThan(stair.length / 2);
    const again = await atlas([...STAIR, '--out', 'sk.json', '--resume']);
    expect(again.code).toBe(0);
    expect(again.err).toMatch(/staircase: 5000 of 5000 points in .* \(\d+ read back\)/);
    expect(existsSync(file('sk.json.partial'))).toBe(false);
    expect(readFileSync(file('sk.json'), 'utf8') === stair).toBe(true);
  }, 120_000);

  it('staircase: a part of another seed is refused, naming its head, and left as it was', async () => {
    const part = stair.split('\n').slice(0, 30).join('\n') + '\n';
    writeFileSync(file('seeded.json'), part);
    const r = await atlas([...STAIR, '--seed', '2', '--out', 'seeded.json', '--resume']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/seeded\.json line 1 does not continue this scan/);
    expect(readFileSync(file('seeded.json'), 'utf8')).toBe(part);
  }, 60_000);

  it('staircase: SIGTERM writes the finished points (exit 143); --resume completes them byte for byte', async () => {
    const r = await atlas([...STAIR, '--out', 'st.json'], { signal: 'SIGTERM', watch: file('st.json.partial'), bytes: 20_000 });
    expect(r.code).toBe(143);
    const part = readFileSync(file('st.json'), 'utf8').split('\n');
    expect(part.at(-2)).toBe('],"plateaus":null,"complete":false}');
    expect(stair.startsWith(part.slice(0, -2).join('\n') + '\n')).toBe(true);
    const again = await atlas([...STAIR, '--out', 'st.json', '--resume']);
    expect(again.code).toBe(0);
    expect(readFileSync(file('st.json'), 'utf8') === stair).toBe(true);
  }, 120_000);

  const SOFT = ['softlines', '--x', 'mu=-1..0.9x9', '--y', 'rb=0.8..1.5x9', '--detuning', '1', '--ranges', 'nn,vdw:1,vdw:2,vdw:3', '--phases', 'condensate,normal', '--workers', '2'];
  it('softlines: SIGKILL leaves the old file; SIGTERM writes the finished lines; --resume completes them byte for byte', async () => {
    expect((await atlas([...SOFT, '--out', 'soft.csv'])).code).toBe(0);
    const whole = readFileSync(file('soft.csv'), 'utf8');
    writeFileSync(file('sl.csv'), OLD);
    const killed = await atlas([...SOFT, '--out', 'sl.csv'], { signal: 'SIGKILL', err: / [2-7]\/8 lines/ });
    expect(killed.code).toBe(null);
    expect(readFileSync(file('sl.csv'), 'utf8')).toBe(OLD);
    const r = await atlas([...SOFT, '--out', 'sl.csv'], { signal: 'SIGTERM', err: / [2-7]\/8 lines/ });
    expect(r.code).toBe(143);
    expect(r.err).toMatch(/interrupted: wrote the [1-7] finished of 8 lines to sl\.csv \(continue it with --resume\)/);
    const part = readFileSync(file('sl.csv'), 'utf8');
    expect(whole.startsWith(part)).toBe(true);
    expect(part.length).toBeLessThan(whole.length);
    const again = await atlas([...SOFT, '--out', 'sl.csv', '--resume']);
    expect(again.code).toBe(0);
    expect(again.err).toMatch(/softlines: 8 of 8 lines in .*\(\d read back\)/);
    expect(readFileSync(file('sl.csv'), 'utf8') === whole).toBe(true);
  }, 120_000);

  // long enough (about 6 s idle) that the part is flushed (every second) well before the end
  const QMC = ['qmc-scan', '--x', 'alpha=0.2..0.6x8', '--sizes', '4,6,8', '--interaction', 'nn', '--v1', '1', '--mu', '1', '--temperature', '0.5', '--sweeps', '80000', '--bins', '8', '--workers', '2'];
  it('qmc-scan: SIGKILL leaves the old file and a .partial holding a prefix of whole rows; --resume completes it byte for byte', async () => {
    expect((await atlas([...QMC, '--out', 'qmc.csv'])).code).toBe(0);
    const whole = readFileSync(file('qmc.csv'), 'utf8');
    const head = whole.indexOf('\n') + 1;
    writeFileSync(file('qk.csv'), OLD);
    const r = await atlas([...QMC, '--out', 'qk.csv'], { signal: 'SIGKILL', watch: file('qk.csv.partial'), bytes: head });
    expect(r.code).toBe(null);
    expect(readFileSync(file('qk.csv'), 'utf8')).toBe(OLD);
    const part = readFileSync(file('qk.csv.partial'), 'utf8');
    expect(whole.startsWith(part)).toBe(true);
    expect(part.length).toBeLessThan(whole.length);
    const again = await atlas([...QMC, '--out', 'qk.csv', '--resume']);
    expect(again.code).toBe(0);
    expect(again.err).toMatch(/qmc-scan: 24 of 24 runs in .*\(\d+ read back\)/);
    expect(readFileSync(file('qk.csv'), 'utf8') === whole).toBe(true);
  }, 120_000);

  it('merge: a refused merge leaves the old file and no .partial', async () => {
    const small = ['map', '--x', 'mu=-1..2x20', '--y', 'rb=1..1.5x3', '--detuning', '3', '--max-cell', '3', '--workers', '2', '--shard'];
    expect((await atlas([...small, '1/2', '--out', 'm1.csv'])).code).toBe(0);
    expect((await atlas([...small, '2/2', '--out', 'm2.csv'])).code).toBe(0);
    const rows = readFileSync(file('m2.csv'), 'utf8').split('\n');
    writeFileSync(file('m2-cut.csv'), rows.slice(0, -3).join('\n') + '\n'); // its last row is missing
    writeFileSync(file('merged.csv'), OLD);
    const r = await atlas(['merge', 'm1.csv', 'm2-cut.csv', '--out', 'merged.csv']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/shard 2\/2 \(m2-cut\.csv\) is incomplete/);
    expect(readFileSync(file('merged.csv'), 'utf8')).toBe(OLD);
    expect(existsSync(file('merged.csv.partial'))).toBe(false);
  }, 60_000);
});
