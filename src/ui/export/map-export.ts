/**
 * The phase map's export: the computed points in index order as the map table the CLI
 * writes (src/formats/map-columns.ts), so the page's CSV of a map and `map`'s output
 * are the same bytes, and its JSON the same document.
 */
import { mapHeader, mapJson, mapTable } from '../../formats/map-columns.ts';
import type { Table } from '../../formats/csv.ts';
import type { MapGrid } from '../controllers/map-scan.ts';

/** The grid's computed points as the map table. */
export function mapExportTable(g: MapGrid): Table {
  return mapTable(mapHeader(g.scanPlan), g.done());
}

/** The grid as the CLI's `map --json` document. */
export function mapExportJson(g: MapGrid): unknown {
  return JSON.parse(mapJson(mapHeader(g.scanPlan), g.done(), g.complete));
}
