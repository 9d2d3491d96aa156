/**
 * The array upload (issue 11, item 19) reads the files tweezer groups write: comma-separated
 * (as before), space- or tab-separated columns, and semicolon-separated CSV with decimal
 * commas (spreadsheets where the decimal mark is a comma). The check values are the
 * coordinates typed into each file, divided by the spacing (r = (x, y) / a, DESIGN.md).
 */
import { describe, it, expect } from 'vitest';
import { parseSiteCsv } from '../../../src/core/cluster/site-array.ts';

/** The same invented four-site square of side 4 um, at a = 4 um: (0,0), (1,0), (0,1), (1,1.5). */
const EXPECTED = [0, 0, 1, 0, 0, 1, 1, 1.5];

describe('array upload separators', () => {
  it('comma, as before', () => {
    expect(parseSiteCsv('x,y\n0,0\n4,0\n0,4\n4,6\n', 4)).toEqual(EXPECTED);
  });

  it('spaces and tabs, with a header and a comment', () => {
    expect(parseSiteCsv('# tweezer pattern\nx y\n0 0\n4\t0\n  0   4\n4 6\n', 4)).toEqual(EXPECTED);
  });

  it('semicolons, with decimal commas', () => {
    expect(parseSiteCsv('x;y\n0;0\n4,0;0\n0;4\n4;6,0\n', 4)).toEqual(EXPECTED);
    // a decimal comma that is not an integer: 2,5 um / 4 um = 0.625 a
    expect(parseSiteCsv('0;0\n2,5;0\n')).toEqual([0, 0, 2.5, 0]);
  });

  it('still refuses a line of three numbers, whichever the separator', () => {
    expect(() => parseSiteCsv('0 0\n1 2 3\n')).toThrow(/line 2: expected two numbers x,y/);
    expect(() => parseSiteCsv('0;0\n1;2;3\n')).toThrow(/line 2: expected two numbers x,y/);
  });
});

describe('array upload: one separator a file', () => {
  it('refuses a line written with another separator than the first', () => {
    // the first line fixes the comma: "1;2" is then one field (the old refusal stands)
    expect(() => parseSiteCsv('0,0\n1;2\n')).toThrow(/line 2: expected two numbers x,y/);
    expect(() => parseSiteCsv('0 0\n1,2\n')).toThrow(/line 2: expected two numbers x,y/);
  });
});
