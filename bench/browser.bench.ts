/**
 * The explorer in Chromium (issue 5): time to the first picture (the scan's first preview
 * points, or its first whole row: from then on every cell of the map is painted) and to the full demo map, with the pool of
 * navigator.hardwareConcurrency workers against one worker (the ratio over the worker
 * count is the parallel efficiency), and the longest main-thread task while the map
 * streams in (PerformanceObserver 'longtask' entries, which report every task over 50 ms;
 * target: none), counted from the start of the scan; the page's own start-up task, in which
 * the scan is started, is reported apart. Best of --repeat runs (default 2), alternating pool and single worker.
 * The machine's load average is logged before and after (the runs share its cores with
 * whatever else runs); since a task's wall time then includes waiting for a core, the
 * main thread's CPU time (whole scan, and the longest task's) is read from a trace too. The app is built into its own folder (test-output/dist-bench).
 */
import type { BrowserContext, Page } from 'playwright-core';
import { join } from 'node:path';
import { loadavg } from 'node:os';
import { buildApp, OUTPUT } from '../tests/browser/harness/build-app.ts';
import { serveStatic } from '../tests/browser/harness/static-server.ts';
import { launchChromium } from '../tests/browser/harness/launch-chromium.ts';
import type { Bench } from './harness.ts';
import { traceMainThread } from './main-thread-cpu.ts';

interface MapTiming {
  first: number; total: number; longest: number; longTasks: number; startup: number; workers: number;
  /** Main-thread CPU time during the scan (ms), and the longest task's CPU time (trace tdur). */
  mainCpu: number; longestCpu: number;
}

/** Open the demo map with `workers` scan workers and wait for it to finish. */
async function demoMap(context: BrowserContext, page: Page, url: string, workers: number | null, query = ''): Promise<MapTiming> {
  await page.goto(url);
  await page.evaluate(() => localStorage.clear());
  const q = [workers ? `workers=${workers}` : '', query].filter(Boolean).join('&');
  const view = page.locator('phase-atlas-view[data-scan="done"]');
  const tasks = await traceMainThread(context, page, async () => {
    await page.goto(url + (q ? `?${q}` : ''));
    await view.waitFor({ state: 'attached', timeout: 300_000 });
  });
  const first = Number(await view.getAttribute('data-first-ms'));
  const total = Number(await view.getAttribute('data-total-ms'));
  const start = Number(await view.getAttribute('data-start-ms'));
  const long = await page.evaluate(() => (window as unknown as { __longTasks: [number, number][] }).__longTasks.slice());
  const n = await page.evaluate(() => navigator.hardwareConcurrency);
  // the page's start-up task (module evaluation, first render) is where the scan is started;
  // the scan's own tasks are those that begin after it started
  const during = long.filter(([t]) => t > start).map(([, d]) => d);
  const startup = long.filter(([t]) => t <= start).map(([, d]) => d);
  const scanTasks = tasks.filter((t) => t.at > start && t.at < start + total);
  return {
    first, total, longest: during.length ? Math.max(...during) : 0, longTasks: during.length,
    startup: startup.length ? Math.max(...startup) : 0, workers: workers ?? n,
    mainCpu: scanTasks.reduce((a, t) => a + t.cpu, 0), longestCpu: Math.max(0, ...scanTasks.map((t) => t.cpu)),
  };
}

const bench: Bench = {
  name: 'browser',
  title: 'explorer in Chromium: first picture and full demo map, pool vs one worker, longest main-thread task',
  async run(ctx) {
    const repeat = Number(ctx.option('repeat') ?? (ctx.flag('quick') ? 1 : 2));
    const load = () => loadavg().map((v) => v.toFixed(2)).join(' ');
    ctx.log(`load average (1, 5, 15 min) before: ${load()}`);
    const server = await serveStatic(await buildApp(join(OUTPUT, 'dist-bench')));
    const b = await launchChromium({ width: 1280, height: 800 });
    try {
      // every long task of the page from its first script on
      await b.context.addInitScript(() => {
        const w = window as unknown as { __longTasks: [number, number][] };
        w.__longTasks = [];
        new PerformanceObserver((list) => { for (const e of list.getEntries()) w.__longTasks.push([e.startTime, e.duration]); })
          .observe({ type: 'longtask', buffered: true });
      });
      let pool: MapTiming | null = null, one: MapTiming | null = null;
      const best = (a: MapTiming | null, x: MapTiming) => (!a || x.total < a.total ? x : a);
      for (let r = 0; r < repeat; r++) {
        pool = best(pool, await demoMap(b.context, b.page, server.url, null));
        one = best(one, await demoMap(b.context, b.page, server.url, 1));
      }
      const P = pool as MapTiming, O = one as MapTiming;
      // the same demo model on a 4x finer grid (128 x 80): start-up costs matter less
      const BIG = `view=atlas&atlas.x=${encodeURIComponent('mu=-1..2.9 x128')}&atlas.y=${encodeURIComponent('rb=0.8..2.4 x80')}`;
      const bigPool = await demoMap(b.context, b.page, server.url, null, BIG);
      const bigOne = await demoMap(b.context, b.page, server.url, 1, BIG);
      ctx.log(`demo map: 64 x 40 = 2560 points, 1D vdw, Mmax = 12 (see src/ui/state/app-state.ts)`);
      ctx.figure(`first picture, ${P.workers} workers`, P.first, 'ms');
      ctx.figure('first picture, 1 worker', O.first, 'ms');
      ctx.figure(`full map, ${P.workers} workers`, P.total / 1000, 's');
      ctx.figure('full map, 1 worker', O.total / 1000, 's');
      ctx.figure(`speed-up T1 / T${P.workers}`, O.total / P.total, '', { target: '>= 1.6' });
      ctx.figure(`parallel efficiency (T1 / T${P.workers}) / ${P.workers}`, O.total / P.total / P.workers, '', { target: '>= 0.8' });
      ctx.figure(`128 x 80 map, ${bigPool.workers} workers`, bigPool.total / 1000, 's');
      ctx.figure('128 x 80 map, 1 worker', bigOne.total / 1000, 's');
      ctx.figure(`parallel efficiency on 128 x 80`, bigOne.total / bigPool.total / bigPool.workers, '', { target: '>= 0.8' });
      ctx.figure('longest main-thread task during the 128 x 80 scan', bigPool.longest, 'ms', { target: '< 50', note: `${bigPool.longTasks} tasks over 50 ms` });
      ctx.figure('  its CPU time (trace; wall time above includes waiting for a core)', bigPool.longestCpu, 'ms', { target: '< 50' });
      ctx.figure('main-thread CPU during the 128 x 80 scan', bigPool.mainCpu, 'ms');
      ctx.figure(`longest main-thread task during the scan (${P.workers} workers)`, P.longest, 'ms', {
        target: '< 50', note: `${P.longTasks} tasks over 50 ms`,
      });
      ctx.figure('longest main-thread task during the scan (1 worker)', O.longest, 'ms', { target: '< 50', note: `${O.longTasks} tasks over 50 ms` });
      ctx.figure(`longest main-thread task's CPU time (${P.workers} workers; trace)`, P.longestCpu, 'ms', { target: '< 50' });
      ctx.figure('longest main-thread task\'s CPU time (1 worker; trace)', O.longestCpu, 'ms', { target: '< 50' });
      ctx.figure(`main-thread CPU during the scan (${P.workers} workers)`, P.mainCpu, 'ms');
      ctx.figure('main-thread CPU during the scan (1 worker)', O.mainCpu, 'ms');
      ctx.figure('page start-up task (module evaluation and first render, before the scan)', P.startup, 'ms');
      ctx.log(`load average (1, 5, 15 min) after: ${load()}`);
      if (b.errors.length) ctx.log(`page errors: ${b.errors.join('; ')}`);
    } finally {
      await b.close();
      await server.close();
    }
  },
};

export default bench;
