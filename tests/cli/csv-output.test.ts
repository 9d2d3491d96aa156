// The one CSV writer (RFC 4180, Shafranovich 2005) under the CLI's outputs: a text field
// with a comma stays one field, the reader undoes the writer, and a map row of a failed
// point carries its reason in the error column. Exact equality (common practice, no source).
import { describe, expect, it } from 'vitest';
import { csvLine, parseCsvLine } from '../../src/formats/csv.ts';
import { mapCsv, mapHeader } from '../../src/formats/map-columns.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';
import { softlinesCsv } from '../../src/cli/commands/softlines.ts';
import type { SoftLineResult } from '../../src/core/softmode/soft-lines.ts';

describe('CSV', () => {
  it('reads back what it writes, quotes and commas included', () => {
    const cells = ['crystal:1,0', 'say "hi"', '', 'plain', 1 / 3];
    expect(parseCsvLine(csvLine(cells))).toEqual(['crystal:1,0', 'say "hi"', '', 'plain', String(1 / 3)]);
    expect(parseCsvLine('a,"b')).toBeNull(); // a torn record
  });

  it('softlines with a crystal phase writes as many fields as its header', () => {
    const r = {
      range: 'vdw:2', phase: 'crystal:1,0', evaluations: 1,
      lines: [{ points: [{ x: 0.5, y: 1.25, k: Math.PI, kind: 'density', jump: false }] }],
    } as unknown as SoftLineResult;
    const [head, row] = softlinesCsv([r], true).trimEnd().split('\n');
    expect(head.split(',').length).toBe(9);
    expect(parseCsvLine(row)).toEqual(['vdw:2', 'crystal:1,0', '0', '0', '0.5', '1.25', '3.14159265359', 'density', '0']);
  });

  it('a failed map point is a row with empty state fields and its reason', () => {
    const plan = { base: { lattice: 'chain' as const, interaction: { shape: 'vdw' as const, Rb: 1.5 }, delta: 3, T: 0, maxCell: 4 },
      x: parseAxis('mu=2..3x2', 'x'), seed: 1 };
    const text = mapCsv(mapHeader(plan), [{ index: 1, ix: 1, iy: 0, error: 'mu = 3 must be below the detuning, a, b' }]);
    const [head, row] = text.trimEnd().split('\n');
    const names = head.split(',');
    const f = parseCsvLine(row)!;
    expect(f.length).toBe(names.length);
    expect(f[names.indexOf('mu')]).toBe('3');
    expect(f[names.indexOf('phase')]).toBe('');
    expect(f[names.indexOf('error')]).toBe('mu = 3 must be below the detuning, a, b');
  });
});
