/**
 * The page's main-thread CPU time from a Chromium trace: the tasks (RunTask) of the
 * renderer main thread that loaded the page, each with its wall time (dur) and the CPU time
 * its thread really ran (tdur). On a loaded machine a task's wall time includes the time the
 * thread waited for a core; its CPU time does not, so the CPU figures compare runs made at
 * different loads. Times in ms from the page's navigation start (performance.now()).
 */
import type { BrowserContext, Page } from 'playwright-core';

export interface MainTask { at: number; wall: number; cpu: number }

interface TraceEvent { name: string; ph: string; pid: number; tid: number; ts: number; dur?: number; tdur?: number; args?: { name?: string; data?: { isOutermostMainFrame?: boolean; documentLoaderURL?: string } } }

/** Trace `load` (a navigation and what follows) and return the new document's main-thread tasks. */
export async function traceMainThread(context: BrowserContext, page: Page, load: () => Promise<void>): Promise<MainTask[]> {
  const cdp = await context.newCDPSession(page);
  const events: TraceEvent[] = [];
  cdp.on('Tracing.dataCollected', (d) => { events.push(...(d.value as unknown as TraceEvent[])); });
  const complete = new Promise<void>((ok) => cdp.once('Tracing.tracingComplete', () => ok()));
  await cdp.send('Tracing.start', { categories: 'devtools.timeline,disabled-by-default-devtools.timeline,blink.user_timing', transferMode: 'ReportEvents' });
  try {
    await load();
  } finally {
    await cdp.send('Tracing.end');
    await complete;
    await cdp.detach();
  }
  // the last main-frame navigation: its ts is the document's time origin
  const nav = events.filter((e) => e.name === 'navigationStart' && e.args?.data?.isOutermostMainFrame).pop();
  if (!nav) return [];
  const main = events.find((e) => e.name === 'thread_name' && e.pid === nav.pid && e.args?.name === 'CrRendererMain');
  const tid = main?.tid ?? nav.tid;
  return events
    .filter((e) => e.pid === nav.pid && e.tid === tid && e.ph === 'X' && e.name === 'RunTask' && e.ts >= nav.ts)
    .map((e) => ({ at: (e.ts - nav.ts) / 1000, wall: (e.dur ?? 0) / 1000, cpu: (e.tdur ?? e.dur ?? 0) / 1000 }));
}
