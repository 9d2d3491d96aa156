/**
 * The reorder buffer of every streamed scan (map, staircase, softlines, qmc-scan): items
 * finish on the pool in any order and are written in the order of one uninterrupted run.
 * Items are keyed by a number that increases along that order (a point index, a task
 * index); a cursor names the key expected next. An item that arrives early waits here until
 * every earlier one has been written. The buffer itself does not bound how many wait: the
 * caller does, by how much work it hands out at once (map-stream.ts: two windows of
 * segments; the task scans: their task count).
 */

/** The keys in write order: the one expected next (undefined past the last), and a step. */
export interface KeyCursor {
  readonly key: number | undefined;
  advance(): void;
}

/** Keys first, first + 1, ..., end - 1 (a task list in order). */
export function countCursor(first: number, end: number): KeyCursor & { readonly at: number } {
  let at = first;
  return {
    get key() {
      return at < end ? at : undefined;
    },
    get at() {
      return at;
    },
    advance() {
      if (at < end) at++;
    },
  };
}

/** Waiting items by key, emitted in cursor order as soon as each one's turn comes. */
export class ReorderBuffer<T> {
  private readonly waiting = new Map<number, T>();
  /** The most items that ever waited at once (for the memory benchmark and tests). */
  peak = 0;

  constructor(private readonly cursor: KeyCursor, private readonly emit: (item: T, key: number) => void) {}

  /**
   * Accept the item of `key`. False (item dropped) when that key was written before or is
   * already waiting (a resumed segment computed again from its start delivers its head twice).
   */
  put(key: number, item: T): boolean {
    const at = this.cursor.key;
    if (at === undefined || key < at || this.waiting.has(key)) return false;
    this.waiting.set(key, item);
    this.peak = Math.max(this.peak, this.waiting.size);
    // each turn removes one waiting item: at most waiting.size turns
    for (let k = this.cursor.key; k !== undefined && this.waiting.has(k); k = this.cursor.key) {
      const v = this.waiting.get(k) as T;
      this.waiting.delete(k);
      this.cursor.advance();
      this.emit(v, k);
    }
    return true;
  }

  /** Items waiting now. */
  get size(): number {
    return this.waiting.size;
  }
}

/** Wait until `target` can take more output, or `signal` is aborted (a blocked stdout must not hold off Ctrl-C). */
export function readyOrAborted(target: { ready(): Promise<void> }, signal: AbortSignal): Promise<void> {
  if (signal.aborted) return Promise.resolve();
  let onAbort = () => undefined as void;
  const aborted = new Promise<void>((resolve) => {
    onAbort = () => resolve();
    signal.addEventListener('abort', onAbort, { once: true });
  });
  return Promise.race([target.ready(), aborted]).finally(() => signal.removeEventListener('abort', onAbort));
}
