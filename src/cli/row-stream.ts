/**
 * Rows of a task scan (staircase points, soft-mode lines, QMC runs) written in task order
 * as the tasks finish, through the reorder buffer (reorder-buffer.ts), one row a line, so
 * a file cut short is a prefix of the finished one. JSON output is a streamed document as
 * the map's (map-layout.ts): a head line opening the array, one element a line with a
 * comma before every element after the first, and a closing line carrying what is known
 * only at the end (`"complete"`, a staircase's plateaus, a QMC scan's crossings):
 *
 *     {"params":{...},...,"points":[
 *     {...}
 *     ,{...}
 *     ],"crossings":[...],"complete":true}
 */
import type { OutputTarget } from './stream-writer.ts';
import { countCursor, ReorderBuffer } from './reorder-buffer.ts';

/** The head line of a streamed JSON document: `fields`, then `"<key>":[` and a line end. */
export function jsonDocHead(fields: Record<string, unknown>, key: string): string {
  const open = JSON.stringify(fields).slice(0, -1);
  return `${open}${open.length > 1 ? ',' : ''}${JSON.stringify(key)}:[\n`;
}

/** The closing line: `]`, then `fields` in order, `}` and a line end. */
export function jsonDocTail(fields: Record<string, unknown>): string {
  return ']' + Object.entries(fields).map(([k, v]) => `,${JSON.stringify(k)}:${JSON.stringify(v)}`).join('') + '}\n';
}

/** Writes the rows of tasks first..end-1 to a target in task order, whatever order they finish in. */
export class TaskRows<T> {
  /** Rows in the output (those before `first` included). */
  rows: number;
  private readonly cursor;
  private readonly buffer: ReorderBuffer<T>;

  /**
   * `rowsOf` turns a finished task into its lines (none, one, or many; no line ends);
   * `json` puts a comma before every row after the first; `rowsBefore` rows are already
   * in the output (a resumed part).
   */
  constructor(target: OutputTarget, first: number, end: number, rowsOf: (item: T, task: number) => readonly string[], json: boolean, rowsBefore = 0) {
    this.rows = rowsBefore;
    this.cursor = countCursor(first, end);
    this.buffer = new ReorderBuffer<T>(this.cursor, (item, task) => {
      for (const row of rowsOf(item, task)) {
        target.write((json && this.rows > 0 ? ',' : '') + row + '\n');
        this.rows++;
      }
    });
  }

  /** Task `task` finished with `item` (written now if every earlier task is). */
  put(task: number, item: T): void {
    this.buffer.put(task, item);
  }

  /** Tasks written, counted from 0 (the first task not yet written). */
  get tasksDone(): number {
    return this.cursor.at;
  }

  /** The most finished tasks that waited at once for an earlier one. */
  get peakWaiting(): number {
    return this.buffer.peak;
  }
}
