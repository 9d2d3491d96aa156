/**
 * The long fuzz of the physics core (the short one runs in npm test, tests/fuzz/): random
 * inputs with full-size cells and clusters through a watchdogged worker. Reports inputs
 * tried / refused cleanly / answered / hung; `--count=N` (default 2000) and `--seed=S`.
 */
import type { Bench } from './harness.ts';
import { runFuzz, summary } from '../tests/fuzz/fuzz-driver.ts';

const bench: Bench = {
  name: 'fuzz',
  title: 'random core inputs: every call answers or refuses cleanly, closed forms hold at V = 0, none hangs',
  async run(ctx) {
    const count = Number(ctx.option('count') ?? (ctx.flag('quick') ? 300 : 2000));
    const seed = Number(ctx.option('seed') ?? 1);
    const t0 = performance.now();
    const r = await runFuzz({ seed, count, quick: false, budgetMs: 60000 });
    const s = (performance.now() - t0) / 1000;
    ctx.log(summary(r));
    for (const f of r.failures) ctx.log(`case ${f.i} ${f.verdict}: ${f.note} ${JSON.stringify(f.input)}`);
    ctx.figure('inputs tried', r.tried, 'inputs');
    ctx.figure('refused cleanly', r.counts.refused + r.counts.named, 'inputs', { note: `${r.counts.named} of them ConvergenceError` });
    ctx.figure('answered', r.counts.answered, 'inputs', { note: `${r.checked} checked against a closed form` });
    ctx.figure('hung', r.counts.hung, 'inputs', { target: '<= 0' });
    ctx.figure('crashed or wrong', r.counts.crash + r.counts.wrong, 'inputs', { target: '<= 0' });
    ctx.figure('slowest input', r.slowestMs / 1000, 's');
    ctx.figure('mean time per input', s / r.tried, 's');
  },
};
export default bench;
