/**
 * The byte layout of a map file as it is streamed, one point a line, so a file cut short
 * is a prefix of the finished one and `--resume` can continue it:
 *
 * CSV: [shard tag line] + column header, then one row a point (the one map table,
 * src/formats/map-columns.ts; the same bytes as mapCsv).
 * JSON: a streamed document, one point a line:
 *
 *     {"shard":...,"x":{...},"y":...,"params":{...},"points":[
 *     {"ix":0,"iy":0,...}
 *     ,{"ix":1,"iy":0,...}
 *     ],"complete":true}
 *
 * (a comma opens every point line after the first, so the closing line is the same
 * whatever came before; `"complete": false` closes a part stopped by Ctrl-C or SIGTERM).
 * It parses as one JSON value, as the earlier single-line document did.
 */
import type { ScanPoint } from '../core/scan/grid.ts';
import { csvLine } from '../formats/csv.ts';
import { mapColumns, mapJsonPoint, mapTable, paramsJson, shardTag, type MapHeader } from '../formats/map-columns.ts';

export type MapFormat = 'csv' | 'json';

/** How one map's file is laid out. */
export interface MapLayout {
  format: MapFormat;
  /** Everything before the first point (ends with a line end). */
  head: string;
  /** The number of lines of head. */
  headLines: number;
  /** One point's line without line end or JSON's leading comma. */
  row(pt: ScanPoint): string;
  /** Separator before a point line: ',' in JSON after the first point. */
  separator(rowsBefore: number): string;
  /** Everything after the last point. */
  tail(complete: boolean): string;
}

/** The JSON closing line. */
export function jsonTail(complete: boolean): string {
  return `],"complete":${complete}}\n`;
}

/** The JSON head of a map file (shard null: the merged or unsharded map). */
export function jsonHead(doc: { shard: unknown; x: unknown; y: unknown; params: unknown }): string {
  return JSON.stringify({ shard: doc.shard, x: doc.x, y: doc.y, params: doc.params }).slice(0, -1) + ',"points":[\n';
}

/** The layout of a map with this header in this format. */
export function mapLayout(h: MapHeader, format: MapFormat): MapLayout {
  if (format === 'csv') {
    return {
      format, head: shardTag(h.shard) + csvLine(mapColumns(h)) + '\n', headLines: h.shard ? 2 : 1,
      // one line a row: a line break inside an error message would open a quoted field across lines
      row: (pt) => csvLine(mapTable(h, [pt.error === undefined ? pt : { ...pt, error: pt.error.replace(/\s*[\r\n]+\s*/g, ' ') }]).rows[0]),
      separator: () => '',
      tail: () => '',
    };
  }
  return {
    format, head: jsonHead({ shard: h.shard, x: h.x, y: h.y ?? null, params: paramsJson(h.params) }), headLines: 1,
    row: (pt) => JSON.stringify(mapJsonPoint(h, pt)),
    separator: (before) => (before > 0 ? ',' : ''),
    tail: jsonTail,
  };
}
