/**
 * The page's CSV files: a comment header naming every input of the view, then the table
 * as the project's one CSV writer writes it (src/formats/csv.ts). Every header line
 * starts with '#', so `pandas.read_csv(path, comment='#')` skips the header and reads the
 * same table as before. pandas cuts a line at a '#' anywhere (a comment may follow data),
 * so no '#' may stand in the data: a '#' in a text cell is written as U+FF03 (the
 * full-width number sign), which reads the same and is not the ASCII comment mark.
 */
import { type Cell, type Table, toCSV } from '../../formats/csv.ts';
import { type AppState, MODEL_KEYS } from '../state/app-state.ts';
import { encodeState } from '../state/url-codec.ts';

/** The comment mark of the header (pandas' `comment` argument). */
export const COMMENT = '#';

/** One header line: '# ' and the text with its line breaks folded into spaces. */
export function commentLine(text: string): string {
  return `${COMMENT} ${text.replace(/\s*[\r\n]+\s*/g, ' ')}`.trimEnd();
}

/** A cell with any '#' replaced by U+FF03, so no data field holds the comment mark. */
export function noCommentMark(c: Cell): Cell {
  return typeof c === 'string' && c.includes(COMMENT) ? c.replace(/#/g, '\uff03') : c;
}

/** An entry as typed, '(blank)' when empty. */
const shown = (v: string) => (v.trim() === '' ? '(blank)' : v);

/** The header lines (without '# '): what the file is, when it was written, every input, the command. */
export function inputHeader(s: AppState, item: string, opts: { command?: string; written?: Date; rows?: number } = {}): string[] {
  const out = [`blockade-atlas ${s.view} view, ${item}${opts.rows !== undefined ? `, ${opts.rows} rows` : ''}`];
  if (opts.written) out.push(`written ${opts.written.toISOString()}`);
  out.push('model inputs (as typed in the model form; names are the command line flags):');
  for (const k of MODEL_KEYS) out.push(`  ${k} = ${shown(s.model[k])}`);
  out.push(`${s.view} view inputs:`);
  for (const [k, v] of Object.entries(s[s.view])) out.push(`  ${k} = ${shown(v)}`);
  if (s.lab && Object.values(s.lab).some((v) => v.trim() !== '')) {
    out.push('lab operating point marked on the figures (model units):');
    for (const [k, v] of Object.entries(s.lab)) out.push(`  ${k} = ${shown(v)}`);
  }
  if (opts.command) {
    out.push('command line for the same numbers:');
    for (const line of opts.command.split('\n')) if (line.trim()) out.push(`  ${line.trim()}`);
  }
  out.push(`page address of this state: ?${encodeState(s)}`);
  out.push("read with pandas.read_csv(path, comment='#')");
  return out;
}

/** The table as CSV under a comment header; the body is toCSV of the table with '#' kept out of the cells. */
export function commentedCsv(t: Table, header: string[]): string {
  const clean: Table = { columns: t.columns.map((c) => noCommentMark(c) as string), rows: t.rows.map((r) => r.map(noCommentMark)) };
  return header.map(commentLine).join('\n') + '\n' + toCSV(clean);
}
