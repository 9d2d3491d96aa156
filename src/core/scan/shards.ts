/**
 * Sharding of a scan into n interleaved parts for a batch system's job array:
 *
 *   segment s (row-major numbering, see grid.ts) belongs to shard k = (s mod n) + 1,
 *
 * so every part samples the whole map (equal cost wherever the expensive region is), and
 * a point's answer is the same whichever part computes it (segments start cold). A scan's
 * fingerprint (32-bit FNV-1a of its canonical JSON) lets merge refuse parts of other scans.
 */
import { InputError } from '../input-error.ts';
import { segments, type ScanPlan, type Segment } from './grid.ts';

export interface Shard {
  /** Part number 1..n. */
  k: number;
  n: number;
}

/** Largest shard count accepted (a job array rarely has more tasks). */
export const MAX_SHARDS = 100_000;

/** Parse `k/n` with 1 <= k <= n. */
export function parseShard(text: string): Shard {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  if (!m) throw new InputError(`--shard must be k/n (like 3/8), got '${text}'`, 'shard');
  const k = Number(m[1]), n = Number(m[2]);
  if (n < 1 || n > MAX_SHARDS) throw new InputError(`--shard: the number of parts must be 1..${MAX_SHARDS}, got ${n}`, 'shard');
  if (k < 1 || k > n) throw new InputError(`--shard: part ${k} is outside 1..${n}`, 'shard');
  return { k, n };
}

/** Shard (1..n) that computes segment id. */
export function shardOfSegment(id: number, n: number): number {
  return (id % n) + 1;
}

/** The segments of an nx x ny grid that shard k/n computes (all of them without a shard). */
export function shardSegments(nx: number, ny: number, shard?: Shard): Segment[] {
  const all = segments(nx, ny);
  return shard ? all.filter((s) => shardOfSegment(s.id, shard.n) === shard.k) : all;
}

/** Point indices (iy * nx + ix, ascending) that shard k/n computes. */
export function shardIndices(nx: number, ny: number, shard?: Shard): number[] {
  const out: number[] = [];
  for (const s of shardSegments(nx, ny, shard)) {
    for (let i = 0; i < s.length; i++) out.push(s.iy * nx + s.ix0 + i);
  }
  return out;
}

/** 32-bit FNV-1a hash, as 8 hex digits, of the plan's canonical JSON (keys sorted). */
export function scanFingerprint(plan: ScanPlan): string {
  const text = canonicalJson(plan);
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

function canonicalJson(v: unknown): string {
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : `"${String(v)}"`;
  if (v === null || typeof v !== 'object') return JSON.stringify(v) ?? 'null';
  if (Array.isArray(v)) return `[${v.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(v as Record<string, unknown>)
    .filter(([, x]) => x !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, x]) => `${JSON.stringify(k)}:${canonicalJson(x)}`).join(',')}}`;
}
