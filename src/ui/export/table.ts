/**
 * A view's numbers as a table, written as CSV or JSON records by the project's one CSV
 * writer (src/formats/csv.ts, shared with the CLI).
 */
export { type Cell, type Table, toCSV, toRecords } from '../../formats/csv.ts';
