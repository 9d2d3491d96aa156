/**
 * The benchmark harness's contract: every bench/<name>.bench.ts default-exports a Bench;
 * bench/run.ts finds and runs them in name order. A bench reports figures (a value with a
 * unit and, where there is one, its target) and free lines; run.ts prints them as they
 * come and a summary table at the end (or JSON with --json).
 */
export interface Figure {
  bench: string;
  label: string;
  value: number;
  unit: string;
  /** e.g. ">= 1.7" or "< 60": printed beside the value, checked when it parses. */
  target?: string;
  note?: string;
}

export interface BenchContext {
  /** Flags given after `npm run bench --` (e.g. --quick, --long). */
  flag(name: string): boolean;
  /** Value of --name=value or --name value. */
  option(name: string): string | undefined;
  /** A line of commentary. */
  log(line: string): void;
  /** A measured figure. */
  figure(label: string, value: number, unit: string, extra?: { target?: string; note?: string }): void;
}

export interface Bench {
  /** Short name, e.g. "meanfield". */
  name: string;
  /** One line: what it measures. */
  title: string;
  run(ctx: BenchContext): Promise<void>;
}

/** Does value meet a target like ">= 1.7" or "< 60"? undefined when the target does not parse. */
export function meets(value: number, target: string): boolean | undefined {
  const m = /^\s*(>=|<=|>|<)\s*([-+0-9.eE]+)/.exec(target);
  if (!m) return undefined;
  const t = Number(m[2]);
  return m[1] === '>=' ? value >= t : m[1] === '<=' ? value <= t : m[1] === '>' ? value > t : value < t;
}

/** A number with 3 significant digits (more for large values). */
export function show(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  return Math.abs(x) >= 1000 ? x.toFixed(0) : Number(x.toPrecision(3)).toString();
}
