// The real CLI as a subprocess, as a user runs it: the plain JavaScript build
// (dist/cli/atlas.mjs, built here first by scripts/build-cli.mjs) with its built worker.
// Exit codes, exactly one line on stderr for bad input, no stack trace; an --out path that
// cannot be written refused before any work; a closed output pipe ending the process
// quietly; Ctrl-C (also under `npm run`, which delivers it twice), SIGTERM and SIGHUP writing
// the finished points with 128 + the signal's number. Behavioural checks (common practice,
// no source: the exit codes are the shell's convention for a process ended by a signal).
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const MODEL = ['--rb', '1.3', '--detuning', '3'];
/** 80000 points: minutes of work, so every run below is stopped long before the end. */
const BIG_MAP = ['map', '--x', 'mu=-1..2.5x400', '--y', 'rb=1..1.6x200', '--detuning', '3', '--workers', '2'];
let tmp = '';

interface Run { code: number | null; out: string; err: string }

/**
 * Run the built CLI (`node <dir>/atlas.mjs argv`), or with `npm` as a user types it
 * (`npm run -s atlas -- argv`, in a process group of its own). `onErr` sees stderr as it
 * grows and may act on the child (send a signal); `onOut` the same for stdout.
 */
function atlas(argv: string[], opts: {
  dir?: string; cwd?: string; npm?: boolean;
  onErr?: (err: string, child: ChildProcess) => void;
  onOut?: (out: string, child: ChildProcess) => void;
} = {}): Promise<Run> {
  return new Promise((resolve) => {
    const env = { ...process.env, ATLAS_PROGRESS: '0' };
    const child = opts.npm
      ? spawn('npm', ['run', '-s', 'atlas', '--', ...argv], { cwd: root, env, detached: true })
      : spawn(process.execPath, [join(opts.dir ?? join(root, 'dist', 'cli'), 'atlas.mjs'), ...argv], { cwd: opts.cwd ?? root, env });
    let out = '', err = '';
    child.stdout.on('data', (d: Buffer) => { out += d.toString(); opts.onOut?.(out, child); });
    child.stdout.on('error', () => undefined); // closed by onOut on purpose
    child.stderr.on('data', (d: Buffer) => { err += d.toString(); opts.onErr?.(err, child); });
    // never left running by a failed check: the big maps below would take minutes
    const guard = setTimeout(() => (opts.npm ? process.kill(-child.pid!, 'SIGKILL') : child.kill('SIGKILL')), 60_000);
    child.on('close', (code) => { clearTimeout(guard); resolve({ code, out, err }); });
  });
}

/**
 * Once the first progress line shows the pool running, send `signal` to the child, or to
 * its whole process group (as a terminal's Ctrl-C reaches npm and the CLI both, and npm
 * then forwards a second copy to the CLI).
 */
function stopWith(signal: NodeJS.Signals, group = false) {
  let sent = false;
  return (err: string, child: ChildProcess) => {
    if (sent || !/ points/.test(err)) return;
    sent = true;
    if (group) process.kill(-child.pid!, signal);
    else child.kill(signal);
  };
}

/** The CSV of a stopped map: header and whole rows only, more than none and fewer than all. */
function expectPartialMap(csv: string): number {
  const lines = csv.trimEnd().split('\n');
  const head = lines[0].split(',');
  expect(head.slice(0, 5)).toEqual(['ix', 'iy', 'mu', 'rb', 'phase']);
  expect(lines.length).toBeGreaterThan(1);
  expect(lines.length).toBeLessThan(80001);
  for (const l of lines.slice(1)) expect(l.split(',').length).toBe(head.length);
  return lines.length - 1;
}

beforeAll(() => {
  execFileSync(process.execPath, ['scripts/build-cli.mjs', '--quiet'], { cwd: root });
  tmp = mkdtempSync(join(tmpdir(), 'atlas-process-'));
});
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('atlas as a process (the built CLI)', () => {
  it('bad input: one line, exit code 2, for several kinds at once', async () => {
    const cases: [string[], RegExp][] = [
      [['solve', ...MODEL, '--mu', '0', '--bogus', '1'], /unknown flag --bogus/],
      [['solve', ...MODEL, '--mu=3.5'], /must be below the detuning/],
      [['map', ...MODEL, '--x', 'mu=0:1:x'], /count must be a whole number/],
      [['fly'], /unknown command 'fly'/],
    ];
    const runs = await Promise.all(cases.map(([argv]) => atlas(argv)));
    runs.forEach((r, i) => {
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      const lines = r.err.trimEnd().split('\n');
      expect(lines.length).toBe(1);
      expect(lines[0]).toMatch(cases[i][1]);
    });
  });

  it('the build needs neither TypeScript nor node_modules: a copy of dist/cli alone runs a map in its workers', async () => {
    const alone = join(tmp, 'alone');
    execFileSync('mkdir', ['-p', alone]);
    for (const f of ['atlas.mjs', 'engine-worker-node.mjs']) copyFileSync(join(root, 'dist', 'cli', f), join(alone, f));
    // 40 points are 3 segments of at most 16: two workers both start
    const r = await atlas(['map', ...MODEL, '--x', 'mu=-1..0.5x40', '--workers', '2', '--max-cell', '4'], { dir: alone, cwd: alone });
    expect(r.err).toMatch(/map: 40 of 40 points .* on 2 workers/);
    expect(r.code).toBe(0);
    const rows = r.out.trimEnd().split('\n');
    expect(rows.length).toBe(41);
    // mu = -1 < 0: no excitation is worth its energy, the empty state (closed form, V >= 0)
    expect(rows[1].split(',').slice(0, 4)).toEqual(['0', '0', '-1', 'empty']);
  });

  it('solve --json prints one JSON object and exits 0', async () => {
    const r = await atlas(['solve', ...MODEL, '--mu', '0.5', '--max-cell', '4', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).phase).toBeTypeOf('string');
  });

  it('an --out that cannot be written is refused at once, before any work, with one line and exit code 2', async () => {
    const cases: [string, RegExp][] = [
      [join(tmp, 'missing', 'map.csv'), /cannot write .*missing\/map\.csv: the folder .*missing does not exist/],
      [tmp, /cannot write .*: it is a folder/],
      // sysfs takes no new files, even from root (a chmod'ed folder would not stop root)
      ['/sys/atlas-map.csv', /cannot write \/sys\/atlas-map\.csv: it is read-only/],
    ];
    const runs = await Promise.all(cases.map(([out]) => atlas([...BIG_MAP, '--out', out])));
    runs.forEach((r, i) => {
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      const lines = r.err.trimEnd().split('\n');
      expect(lines).toHaveLength(1); // no progress line: the pool never started
      expect(lines[0]).toMatch(cases[i][1]);
    });
    expect(existsSync(join(tmp, 'missing'))).toBe(false);
    expect(readdirSync(tmp).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('a closed output pipe ends the process quietly with 141 (128 + SIGPIPE), no stack trace', async () => {
    // ~2000 rows of ~90 bytes: far more than a pipe holds, so writing meets the closed end
    const r = await atlas(['map', ...MODEL, '--x', 'mu=-1..2.5x2000', '--cell', '1', '--workers', '2'], {
      onOut: (_out, child) => child.stdout?.destroy(),
    });
    expect(r.code).toBe(141);
    expect(r.err).not.toMatch(/EPIPE|Error|\n\s+at /);
    expect(r.out.startsWith('ix,iy,mu,')).toBe(true);
  });

  it('Ctrl-C under npm run (the signal arrives twice) writes the finished points as CSV and exits 130', async () => {
    const r = await atlas(BIG_MAP, { npm: true, onErr: stopWith('SIGINT', true) });
    expect(r.code).toBe(130);
    const m = /interrupted: wrote the (\d+) finished of 80000 points to stdout/.exec(r.err);
    expect(m).not.toBeNull();
    expect(expectPartialMap(r.out)).toBe(Number(m![1]));
  });

  it('SIGTERM (a scheduler at the wall-time limit) writes the finished points to --out and exits 143; the old file is replaced whole', async () => {
    const file = join(tmp, 'term.csv');
    writeFileSync(file, 'an older result\n');
    const r = await atlas([...BIG_MAP, '--out', file], { onErr: stopWith('SIGTERM') });
    expect(r.code).toBe(143);
    const m = /interrupted: wrote the (\d+) finished of 80000 points to .*term\.csv/.exec(r.err);
    expect(m).not.toBeNull();
    expect(r.out).toBe('');
    expect(expectPartialMap(readFileSync(file, 'utf8'))).toBe(Number(m![1]));
    expect(readdirSync(tmp).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('SIGHUP writes the finished points and exits 129', async () => {
    const r = await atlas(BIG_MAP, { onErr: stopWith('SIGHUP') });
    expect(r.code).toBe(129);
    expect(r.err).toMatch(/interrupted: wrote the \d+ finished of 80000 points to stdout/);
    expectPartialMap(r.out);
  });

  it('SIGKILL midway leaves an existing --out file as it was (the run writes beside it and renames at the end)', async () => {
    const file = join(tmp, 'kill.csv');
    writeFileSync(file, 'an older result\n');
    const r = await atlas([...BIG_MAP, '--out', file], { onErr: stopWith('SIGKILL') });
    expect(r.code).toBeNull(); // ended by the signal
    expect(readFileSync(file, 'utf8')).toBe('an older result\n');
  });
});
