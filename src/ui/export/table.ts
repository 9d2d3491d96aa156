/**
 * A view's numbers as a table: named columns of numbers or strings, written as CSV
 * (RFC 4180 quoting, one header row naming every column, one row a point) or as JSON.
 */

export type Cell = number | string | null | undefined;

export interface Table {
  columns: string[];
  rows: Cell[][];
}

/** One CSV field: numbers at full precision, text quoted when it holds , " or a newline. */
function csvField(v: Cell): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  return /[",\n\r]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

/** The table as CSV text (header + rows, newline-terminated). */
export function toCSV(t: Table): string {
  return [t.columns.map(csvField).join(','), ...t.rows.map((r) => r.map(csvField).join(','))].join('\n') + '\n';
}

/** The table as an array of objects keyed by column. */
export function toRecords(t: Table): Record<string, Cell>[] {
  return t.rows.map((r) => Object.fromEntries(t.columns.map((c, i) => [c, r[i] ?? null])));
}
