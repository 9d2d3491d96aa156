// The command line reads ranges as START..STOPxN and, with a note on stderr, in the old
// start:stop:count form; both give the same points. A space before x (two arguments) is
// refused with the fix. The reference is the core's parser (src/core/scan/axes.ts,
// tested value for value in tests/core/scan/axes.test.ts): the CLI must not read ranges
// any other way. Mu values are compared exactly (the same arithmetic on the same numbers).
import { describe, expect, it } from 'vitest';
import { cli } from './test-io.ts';

const model = ['--interaction', 'nn', '--v1', '1', '--detuning', '50', '--max-cell', '2'];

describe('range syntax on the command line', () => {
  it('the new and the old form give the same staircase points; only the old one gets a note', async () => {
    const fresh = await cli(['staircase', '--mu=-0.5..1x4', ...model, '--json']);
    const old = await cli(['staircase', '--mu=-0.5:1:4', ...model, '--json']);
    expect(fresh.code).toBe(0);
    expect(old.code).toBe(0);
    const mus = (r: { out: string }) => JSON.parse(r.out).points.map((p: { mu: number }) => p.mu);
    expect(mus(fresh)).toEqual([-0.5, 0, 0.5, 1]);
    expect(mus(old)).toEqual(mus(fresh));
    expect(fresh.err).not.toMatch(/note/);
    expect(old.err).toContain("atlas: note: --mu '-0.5:1:4' is the old start:stop:count form, read as -0.5..1x4 (4 points from -0.5 to 1); please write it that way.");
  });

  it('a count/step mix-up is refused with the range that was meant', async () => {
    const r = await cli(['staircase', '--mu', '0:0.1:1', ...model]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/If 0\.1 was meant as a step from 0 to 1, write 0\.\.1x11\./);
  });

  it('a range split at the space is refused with the fix', async () => {
    const r = await cli(['staircase', '--mu', '-0.5..1', 'x4', ...model]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/unexpected argument 'x4' for staircase: a range is one argument/);
  });

  it('help shows the form', async () => {
    const r = await cli(['map', '--help']);
    expect(r.out).toContain('--x name=START..STOPxN');
    expect(r.out).not.toContain('start:stop:count\n');
  });
});
