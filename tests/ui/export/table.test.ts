/**
 * CSV as RFC 4180 writes it (Shafranovich, RFC 4180, 2005): one header row, fields with a
 * comma, quote or line break quoted, quotes doubled; numbers at full precision.
 */
import { describe, it, expect } from 'vitest';
import { toCSV, toRecords } from '../../../src/ui/export/table.ts';
import { cliLine, shellWord } from '../../../src/ui/export/cli-command.ts';

describe('tables', () => {
  it('writes RFC 4180 CSV', () => {
    const csv = toCSV({ columns: ['a', 'b,c'], rows: [[1 / 3, 'x "y"'], [null, 'plain']] });
    expect(csv).toBe(`a,"b,c"\n${String(1 / 3)},"x ""y"""\n,plain\n`);
  });

  it('records are keyed by column', () => {
    expect(toRecords({ columns: ['a', 'b'], rows: [[1, 'z']] })).toEqual([{ a: 1, b: 'z' }]);
  });
});

describe('command lines', () => {
  it('quotes only what a POSIX shell would split or expand', () => {
    expect(shellWord('mu=-1:2.9:64')).toBe('mu=-1:2.9:64');
    expect(shellWord("it's here")).toBe(`'it'\\''s here'`);
    expect(cliLine('map', ['--x', 'mu=-1:2:3'])).toBe('npm run -s atlas -- map --x mu=-1:2:3');
  });
});
