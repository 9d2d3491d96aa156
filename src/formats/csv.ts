/**
 * The one CSV writer and reader of the project (RFC 4180, Shafranovich 2005): one header
 * row naming every column, one record a line, a field quoted when it holds a comma, a
 * quote or a line break, quotes doubled. Numbers are written at full precision
 * (String(x), which round-trips a double exactly); a non-finite number or a missing value
 * is an empty field. The CLI's files, the page's exports and merge all go through here,
 * so a text field such as `crystal:1,0` can never add a column.
 */

/** One value of a table cell. */
export type Cell = number | string | null | undefined;

/** A table: named columns, rows of cells in column order. */
export interface Table {
  columns: string[];
  rows: Cell[][];
}

/** One field: numbers at full precision, text quoted when it holds , " or a line break. */
export function csvField(v: Cell): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  return /[",\n\r]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

/** One record (no line end). */
export function csvLine(cells: readonly Cell[]): string {
  return cells.map(csvField).join(',');
}

/** The table as CSV text: header and rows, each line ending in \n. */
export function toCSV(t: Table): string {
  return [csvLine(t.columns), ...t.rows.map(csvLine)].join('\n') + '\n';
}

/**
 * Split one CSV record (a line without its line end) into its fields, undoing the quoting
 * of csvField. Returns null for a record whose quotes do not close (a torn line).
 */
export function parseCsvLine(line: string): string[] | null {
  const out: string[] = [];
  let i = 0;
  for (;;) {
    if (line[i] === '"') {
      let field = '';
      i++;
      for (;;) {
        const q = line.indexOf('"', i);
        if (q < 0) return null;
        field += line.slice(i, q);
        if (line[q + 1] === '"') { field += '"'; i = q + 2; continue; }
        i = q + 1;
        break;
      }
      out.push(field);
      if (i === line.length) return out;
      if (line[i] !== ',') return null;
      i++;
    } else {
      const c = line.indexOf(',', i);
      if (c < 0) { out.push(line.slice(i)); return out; }
      out.push(line.slice(i, c));
      i = c + 1;
    }
  }
}

/** The table as an array of objects keyed by column. */
export function toRecords(t: Table): Record<string, Cell>[] {
  return t.rows.map((r) => Object.fromEntries(t.columns.map((c, i) => [c, r[i] ?? null])));
}
