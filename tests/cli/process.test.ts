// The real CLI as a subprocess through tsx, as a user runs it: exit codes, exactly one
// line on stderr for bad input, no stack trace, and Ctrl-C (SIGINT) during a map writing
// valid CSV of the finished points with exit code 130. Behavioural checks (common
// practice, no source).
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { cliProcess } from './test-io.ts';

const MODEL = ['--rb', '1.3', '--detuning', '3'];

describe('atlas as a process', () => {
  it('bad input: one line, exit code 2, for several kinds at once', async () => {
    const cases: [string[], RegExp][] = [
      [['solve', ...MODEL, '--mu', '0', '--bogus', '1'], /unknown flag --bogus/],
      [['solve', ...MODEL, '--mu=3.5'], /must be below the detuning/],
      [['map', ...MODEL, '--x', 'mu=0:1:x'], /count must be a whole number/],
      [['fly'], /unknown command 'fly'/],
    ];
    const runs = await Promise.all(cases.map(([argv]) => cliProcess(argv)));
    runs.forEach((r, i) => {
      expect(r.code).toBe(2);
      expect(r.out).toBe('');
      const lines = r.err.trimEnd().split('\n');
      expect(lines.length).toBe(1);
      expect(lines[0]).toMatch(cases[i][1]);
    });
  });

  it('solve --json prints one JSON object and exits 0', async () => {
    const r = await cliProcess(['solve', ...MODEL, '--mu', '0.5', '--max-cell', '4', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).phase).toBeTypeOf('string');
  });

  it('Ctrl-C during a map writes the finished points as CSV and exits 130', async () => {
    const root = fileURLToPath(new URL('../..', import.meta.url));
    const child = spawn(process.execPath, ['--import', 'tsx', 'src/cli/main.ts', 'map', '--x', 'mu=-1:2.5:400', '--y', 'rb=1:1.6:200',
      '--detuning', '3', '--workers', '2'], { cwd: root, env: { ...process.env, ATLAS_PROGRESS: '0' } });
    let out = '', err = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => {
      err += d.toString();
      // the first progress line means the pool is running: interrupt it
      if (/ points/.test(err) && !child.killed) child.kill('SIGINT');
    });
    const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
    expect(code).toBe(130);
    expect(err).toMatch(/interrupted: wrote the \d+ finished of 80000 points to stdout/);
    const lines = out.trimEnd().split('\n');
    const head = lines[0].split(',');
    expect(head.slice(0, 5)).toEqual(['ix', 'iy', 'mu', 'rb', 'phase']);
    expect(lines.length).toBeGreaterThan(1);
    expect(lines.length).toBeLessThan(80001);
    for (const l of lines.slice(1)) expect(l.split(',').length).toBe(head.length);
  });
});
