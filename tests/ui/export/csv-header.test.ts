/**
 * The page's CSV files start with a comment header of every input, each line starting
 * with '#', and the body is the same RFC 4180 table as before (Shafranovich, RFC 4180,
 * 2005). pandas.read_csv(path, comment='#') treats '#' anywhere in a line as the start of
 * a comment and ignores lines that are wholly comment (pandas documentation, IO tools,
 * `comment` parameter); that reading is emulated here line by line.
 */
import { describe, it, expect } from 'vitest';
import { demoState, MODEL_KEYS } from '../../../src/ui/state/app-state.ts';
import { commentedCsv, inputHeader } from '../../../src/ui/export/csv-header.ts';
import { parseCsvLine, toCSV, type Table } from '../../../src/formats/csv.ts';

/** What pandas reads with comment='#': each line cut at its first '#', lines left empty dropped. */
function pandasLines(text: string): string[] {
  return text.split('\n').map((l) => { const at = l.indexOf('#'); return at < 0 ? l : l.slice(0, at); }).filter((l) => l !== '');
}

const table: Table = { columns: ['mu', 'phase', 'fraction', 'note'], rows: [[-0.5, 'density-wave', '1/2', 'crystal:1,0'], [1 / 3, 'supersolid', null, 'say "hi"']] };

describe('CSV comment header', () => {
  const s = demoState();
  s.atlas.point = '1.5,1.9';
  const header = inputHeader(s, 'phase-map', { command: 'npm run -s atlas -- map --x mu=-1:2.9:64\nnpm run -s atlas -- map --x rb=1:2:3', written: new Date(Date.UTC(2026, 0, 2, 3, 4, 5)), rows: 2 });
  const text = commentedCsv(table, header);
  const lines = text.split('\n');

  it('every header line starts with #, and the body after it is the table as before', () => {
    const body = lines.findIndex((l) => !l.startsWith('#'));
    expect(body).toBe(header.length);
    expect(lines.slice(body).join('\n')).toBe(toCSV(table));
    // as pandas reads it: the same lines as the plain CSV, field for field
    const read = pandasLines(text);
    expect(read).toEqual(toCSV(table).trimEnd().split('\n'));
    expect(parseCsvLine(read[1])).toEqual(['-0.5', 'density-wave', '1/2', 'crystal:1,0']);
  });

  it('names every model input, the view\'s inputs, the command and the write time', () => {
    // an empty entry is written as (blank), so the line says it was empty rather than lost
    for (const k of MODEL_KEYS) expect(lines).toContain(`#   ${k} = ${s.model[k] || '(blank)'}`);
    for (const [k, v] of Object.entries(s.atlas)) expect(lines).toContain(`#   ${k} = ${v || '(blank)'}`);
    expect(lines).toContain('#   npm run -s atlas -- map --x rb=1:2:3');
    expect(lines).toContain('# written 2026-01-02T03:04:05.000Z');
  });

  it('keeps # out of the data and line breaks out of the header', () => {
    const t: Table = { columns: ['a#b', 'c'], rows: [['x#1', 2], ['no mark', 3]] };
    const s2 = demoState();
    s2.model.range = 'one\ntwo';
    const out = commentedCsv(t, inputHeader(s2, 'table'));
    const data = out.split('\n').filter((l) => !l.startsWith('#'));
    for (const l of data) expect(l).not.toContain('#');
    expect(data[1]).toBe('x\uff031,2');
    // a typed line break folds into the comment line instead of starting a data line
    expect(out).toContain('#   range = one two\n');
    expect(pandasLines(out)).toHaveLength(3);
  });
});
