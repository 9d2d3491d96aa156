/**
 * The segments of one shard (or of the whole map) in order, computed one at a time
 * instead of listed (a 2000 x 2000 map has 250,000 of them), and a cursor over the shard's
 * points in index order. The numbering is grid.ts's (segment id row-major, rowCuts(nx) a
 * row) and the sharding shards.ts's (segment s belongs to shard (s mod n) + 1), so the
 * points come in the order one run writes them.
 */
import { rowCuts, type Segment } from '../core/scan/grid.ts';
import type { Shard } from '../core/scan/shards.ts';

/** The segments of shard k/n of an nx x ny grid, by their rank in the shard. */
export class ShardSegments {
  /** Number of segments in the shard. */
  readonly count: number;
  /** Number of points in the shard. */
  readonly points: number;
  private readonly cuts: number[];
  private readonly starts: number[];
  private readonly k: number;
  private readonly n: number;

  constructor(readonly nx: number, readonly ny: number, shard?: Shard) {
    this.cuts = rowCuts(nx);
    this.starts = [];
    let x = 0;
    for (const c of this.cuts) {
      this.starts.push(x);
      x += c;
    }
    this.k = shard?.k ?? 1;
    this.n = shard?.n ?? 1;
    const all = this.cuts.length * ny;
    this.count = all > this.k - 1 ? Math.floor((all - this.k) / this.n) + 1 : 0;
    // points: whole rows of pieces, each piece p taken by the shard ceil-counted over the rows
    let pts = 0;
    const per = this.cuts.length;
    for (let p = 0; p < per; p++) {
      // segment ids of piece p: p, p + per, ...; those with id mod n = k - 1
      pts += this.cuts[p] * this.idsOfPiece(p, per, ny);
    }
    this.points = pts;
  }

  /** How many of the ids p + per * iy (iy < ny) have id mod n = k - 1. */
  private idsOfPiece(p: number, per: number, ny: number): number {
    if (this.n === 1) return ny;
    let c = 0;
    for (let iy = 0; iy < ny; iy++) if ((p + per * iy) % this.n === this.k - 1) c++;
    return c;
  }

  /** The j-th segment of the shard (0 <= j < count). */
  at(j: number): Segment {
    const id = this.k - 1 + j * this.n;
    const per = this.cuts.length;
    const piece = id % per;
    return { id, iy: Math.floor(id / per), ix0: this.starts[piece], length: this.cuts[piece] };
  }
}

/** A position in the shard's points: segment rank j, offset i inside it. */
export class PointCursor {
  j = 0;
  i = 0;
  private seg: Segment | undefined;

  constructor(private readonly segs: ShardSegments) {
    this.seg = segs.count > 0 ? segs.at(0) : undefined;
  }

  /** Past the last point. */
  get done(): boolean {
    return this.seg === undefined;
  }

  /** The current point (undefined when done). */
  get point(): { index: number; ix: number; iy: number } | undefined {
    const s = this.seg;
    if (!s) return undefined;
    const ix = s.ix0 + this.i;
    return { index: s.iy * this.segs.nx + ix, ix, iy: s.iy };
  }

  /** Move to the next point. */
  advance(): void {
    const s = this.seg;
    if (!s) return;
    if (++this.i < s.length) return;
    this.i = 0;
    this.j++;
    this.seg = this.j < this.segs.count ? this.segs.at(this.j) : undefined;
  }
}
