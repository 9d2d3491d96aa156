/**
 * Joining the n parts of a sharded scan: every part 1..n must be present once, belong to
 * the same scan (fingerprint and grid), and hold exactly the points its shard computes
 * (an interrupted part holds fewer and is refused). The rows come back ordered by point
 * index, as one unsharded scan would have written them.
 */
import { InputError } from '../input-error.ts';
import { shardIndices } from './shards.ts';

/** What a shard's output says about itself. */
export interface ShardMeta {
  k: number;
  n: number;
  /** Fingerprint of the scan (scanFingerprint). */
  scan: string;
  nx: number;
  ny: number;
}

/** One part as read back: its metadata and its rows keyed by point index. */
export interface ShardPart<R> {
  /** Where it came from (a file name), for messages. */
  source: string;
  meta: ShardMeta;
  rows: { index: number; row: R }[];
}

/** Merge the parts into the rows of the full scan, ordered by index; InputError on any gap. */
export function mergeShards<R>(parts: readonly ShardPart<R>[]): R[] {
  if (parts.length === 0) throw new InputError('merge needs the output files of the shards', 'merge');
  const first = parts[0];
  const { n, scan, nx, ny } = first.meta;
  const byK = new Map<number, ShardPart<R>>();
  for (const part of parts) {
    const m = part.meta;
    if (m.n !== n) {
      throw new InputError(`${part.source} is part of a ${m.n}-part scan, ${first.source} of a ${n}-part scan`, 'merge');
    }
    if (m.scan !== scan || m.nx !== nx || m.ny !== ny) {
      throw new InputError(`${part.source} belongs to a different scan than ${first.source} (fingerprint ${m.scan} vs ${scan})`, 'merge');
    }
    const twin = byK.get(m.k);
    if (twin) throw new InputError(`shard ${m.k}/${n} is given twice (${twin.source} and ${part.source})`, 'merge');
    byK.set(m.k, part);
  }
  const missing: number[] = [];
  for (let k = 1; k <= n; k++) if (!byK.has(k)) missing.push(k);
  if (missing.length > 0) {
    const names = missing.slice(0, 10).map((k) => `${k}/${n}`).join(', ') + (missing.length > 10 ? ', ...' : '');
    throw new InputError(
      missing.length === 1 ? `shard ${names} is missing` : `${missing.length} shards are missing: ${names}`, 'merge');
  }
  const out = new Array<R>(nx * ny);
  for (let k = 1; k <= n; k++) {
    const part = byK.get(k) as ShardPart<R>;
    const expected = shardIndices(nx, ny, { k, n });
    const own = new Set(expected);
    const seen = new Set<number>();
    for (const { index, row } of part.rows) {
      if (!own.has(index)) throw new InputError(`${part.source} holds point ${index}, which is not part of shard ${k}/${n}`, 'merge');
      if (seen.has(index)) throw new InputError(`${part.source} holds point ${index} twice`, 'merge');
      seen.add(index);
      out[index] = row;
    }
    if (seen.size !== expected.length) {
      throw new InputError(`shard ${k}/${n} (${part.source}) is incomplete: ${seen.size} of ${expected.length} points`, 'merge');
    }
  }
  return out;
}
