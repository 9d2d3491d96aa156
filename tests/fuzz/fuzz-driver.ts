/**
 * Drives the fuzz cases through one worker thread with a watchdog: a case still running
 * after `budgetMs` is a hang, its worker is terminated and a new one takes the next case.
 * Counts every verdict (fuzz-case.ts) and keeps the first few failures with their input.
 * Used by tests/fuzz/core-fuzz.test.ts (a short run in npm test) and bench/fuzz.bench.ts.
 */
import type { Worker } from 'node:worker_threads';
import { spawnNodeWorker } from '../../workers/node-spawn.ts';
import { drawCase, type FuzzCase } from './fuzz-inputs.ts';
import type { Outcome, Verdict } from './fuzz-case.ts';

export interface FuzzOptions {
  seed: number;
  count: number;
  /** Smaller cells and clusters (npm test). */
  quick: boolean;
  /** Wall time after which a case counts as hung (ms). */
  budgetMs: number;
  onCase?: (i: number, o: Outcome, ms: number) => void;
}

export interface FuzzReport {
  tried: number;
  counts: Record<Verdict | 'hung', number>;
  /** Answers whose closed form was checked. */
  checked: number;
  slowestMs: number;
  failures: { i: number; verdict: Verdict | 'hung'; note?: string; input: FuzzCase }[];
}

type Reply = { ready: true } | { i: number; outcome: Outcome; ms: number };

/** Start a worker and wait until it has loaded the core. */
function start(): Promise<Worker> {
  const w = spawnNodeWorker(new URL('./fuzz-worker.ts', import.meta.url));
  return new Promise((resolve, reject) => {
    w.once('message', () => resolve(w));
    w.once('error', reject);
  });
}

/** Run case i on w; null if it takes longer than budgetMs. */
function runOne(w: Worker, seed: number, i: number, quick: boolean, budgetMs: number): Promise<{ outcome: Outcome; ms: number } | null> {
  return new Promise((resolve) => {
    const timer = setTimeout(() => { w.off('message', onMsg); resolve(null); }, budgetMs);
    const onMsg = (m: Reply) => {
      if ('ready' in m || m.i !== i) return;
      clearTimeout(timer); w.off('message', onMsg); resolve({ outcome: m.outcome, ms: m.ms });
    };
    w.on('message', onMsg);
    w.postMessage({ seed, i, quick });
  });
}

/** Run `count` cases of the stream `seed`. */
export async function runFuzz(o: FuzzOptions): Promise<FuzzReport> {
  const report: FuzzReport = {
    tried: 0, checked: 0, slowestMs: 0, failures: [],
    counts: { answered: 0, refused: 0, named: 0, crash: 0, wrong: 0, hung: 0 },
  };
  let w = await start();
  try {
    for (let i = 0; i < o.count; i++) {
      const r = await runOne(w, o.seed, i, o.quick, o.budgetMs);
      report.tried++;
      const verdict = r ? r.outcome.verdict : 'hung';
      report.counts[verdict]++;
      if (r?.outcome.checked) report.checked++;
      if (r) report.slowestMs = Math.max(report.slowestMs, r.ms);
      if (verdict === 'crash' || verdict === 'wrong' || verdict === 'hung') {
        if (report.failures.length < 10) report.failures.push({ i, verdict, note: r?.outcome.note, input: drawCase(o.seed, i, o.quick) });
      }
      o.onCase?.(i, r?.outcome ?? { verdict: 'crash', note: 'hung' }, r?.ms ?? o.budgetMs);
      if (!r) { await w.terminate(); w = await start(); }
    }
  } finally {
    await w.terminate();
  }
  return report;
}

/** One line of counts: inputs tried / refused cleanly / answered / hung (and the rest). */
export function summary(r: FuzzReport): string {
  const c = r.counts;
  return `fuzz: ${r.tried} inputs tried, ${c.refused} refused cleanly (InputError), ${c.named} named limits (ConvergenceError), ` +
    `${c.answered} answered (${r.checked} checked against a closed form), ${c.hung} hung, ${c.crash} crashed, ${c.wrong} wrong; slowest ${r.slowestMs.toFixed(0)} ms`;
}
