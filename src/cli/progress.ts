/**
 * Progress of a long run on stderr: a bar redrawn in place (at most ten times a second)
 * when stderr is a terminal; otherwise nothing while running (logs stay clean) unless
 * ATLAS_PROGRESS=<seconds> asks for a plain line that often; one summary line at the end
 * either way.
 */
import type { CliIo } from './io.ts';

export class Progress {
  private readonly t0: number;
  private lastDraw = -Infinity;
  private drawn = false;
  private first?: { s: number; done: number };

  constructor(private readonly io: CliIo, private readonly label: string, private readonly total: number, private readonly unit = 'points') {
    this.t0 = io.now();
  }

  /** done of total finished. */
  update(done: number): void {
    const t = this.io.now();
    if (!this.io.stderrIsTTY) {
      const every = this.io.progressEvery;
      if (every === undefined || t - this.lastDraw < 1000 * every || done >= this.total) return;
      this.lastDraw = t;
      this.io.stderr(this.line(done, (t - this.t0) / 1000) + '\n');
      return;
    }
    if (t - this.lastDraw < 100 && done < this.total) return;
    this.lastDraw = t;
    this.drawn = true;
    this.io.stderr('\r\x1b[K' + this.line(done, (t - this.t0) / 1000));
  }

  /** Clear the bar and print the summary line (e.g. "map: 4000 points in 9.8 s ..."). */
  finish(done: number, extra = ''): void {
    if (this.drawn) this.io.stderr('\r\x1b[K');
    const s = (this.io.now() - this.t0) / 1000;
    const rate = s > 0 ? ` (${formatRate(done / s)} ${this.unit}/s)` : '';
    this.io.stderr(`${this.label}: ${done} of ${this.total} ${this.unit} in ${s.toFixed(1)} s${rate}${extra}\n`);
  }

  /** Seconds since the start. */
  get seconds(): number {
    return (this.io.now() - this.t0) / 1000;
  }

  private line(done: number, s: number): string {
    const frac = this.total > 0 ? done / this.total : 1;
    // rate and eta from the first point on, so worker start-up does not skew them
    if (this.first === undefined) this.first = { s, done };
    const ds = s - this.first.s, rate = ds > 0.5 ? (done - this.first.done) / ds : 0;
    const eta = rate > 0 ? (this.total - done) / rate : NaN;
    const tail = ` ${String(Math.floor(frac * 100)).padStart(3)}% ${done}/${this.total} ${this.unit}` +
      (rate > 0 ? `  ${formatRate(rate)}/s  eta ${formatTime(eta)}` : '');
    // a fixed bar width (the tail varies in length; the bar should not jitter)
    const width = Math.max(10, Math.min(40, this.io.stderrColumns - this.label.length - 60));
    const full = Math.round(frac * width);
    return `${this.label} [${'#'.repeat(full)}${'.'.repeat(width - full)}]${tail}`;
  }
}

function formatRate(r: number): string {
  return r >= 100 ? r.toFixed(0) : r >= 10 ? r.toFixed(1) : r.toPrecision(2);
}

function formatTime(s: number): string {
  if (!Number.isFinite(s)) return '?';
  if (s < 60) return `${Math.ceil(s)}s`;
  const m = Math.floor(s / 60);
  return m < 60 ? `${m}m${String(Math.round(s - 60 * m)).padStart(2, '0')}s` : `${Math.floor(m / 60)}h${String(m % 60).padStart(2, '0')}m`;
}
