/**
 * Jobs under control (issue 11, blockers 1-5), in real Chromium: impossible axis ranges are
 * refused beside their field and never start a scan, a newly chosen axis gets a range of
 * its own; a soft-core model with a soft-mode box ticked traces soft-core lines and the
 * page stays responsive; Cancel leaves the scan stopped; a tab round trip keeps the map;
 * a 2D Modes request finishes, its old figure marked out of date meanwhile.
 */
import { describe, it, expect } from 'vitest';
import { useApp } from './harness/app-session.ts';
import { pointAt, scanNumber, waitForScan } from './harness/page-tools.ts';
import { ROOT } from './harness/build-app.ts';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { join } from 'node:path';

const run = promisify(execFile);

const app = useApp('dist-jobs');

/** A small map (12 x 6) so each check runs in seconds. */
const SMALL = 'atlas.x=mu%3D-1%3A2.9%3A12&atlas.y=rb%3D0.8%3A2.4%3A6';

async function open(query: string) {
  await app.page.goto(app.url);
  await app.page.evaluate(() => localStorage.clear());
  await app.page.goto(app.url + query);
}

const view = () => app.page.locator('phase-atlas-view');
const attr = async (name: string) => view().getAttribute(`data-${name}`);

/** Longest main-thread delay over `n` timer round trips (ms): a frozen tab shows seconds. */
async function worstDelay(n = 10): Promise<number> {
  return app.page.evaluate(async (k) => {
    let worst = 0;
    for (let i = 0; i < k; i++) {
      const t = performance.now();
      await new Promise((r) => setTimeout(r, 20));
      worst = Math.max(worst, performance.now() - t - 20);
    }
    return worst;
  }, n);
}

describe('jobs under control', () => {
  it('a temperature axis chosen from the demo gets a sane range and finishes; a mu axis past delta is refused beside its field', async () => {
    await open(`?view=atlas&${SMALL}`);
    await waitForScan(app.page, 'done', 60_000);
    await app.page.locator('phase-atlas-view select[name="axis-x"]').selectOption('temperature');
    // T from 0 (not the mu range -1:2.9), the count kept
    await expect.poll(() => app.page.locator('phase-atlas-view input[name="range-x"]').inputValue()).toBe('0..0.5 x12');
    await waitForScan(app.page, 'done', 60_000);
    expect(await scanNumber(app.page, 'points')).toBe(12 * 6);
    expect(await app.page.locator('phase-atlas-view #ax-x-msg').textContent()).toBe('');
    // back to mu, then a detuning of 2 puts the mu axis (-1..1.9 by default, typed up to 2.9) past delta
    await app.page.locator('phase-atlas-view select[name="axis-x"]').selectOption('mu');
    await expect.poll(() => app.page.locator('phase-atlas-view input[name="range-x"]').inputValue()).toBe('-1..2.9 x12');
    await waitForScan(app.page, 'done', 60_000);
    const started = await scanNumber(app.page, 'started');
    await app.page.locator('model-form input[name="detuning"]').fill('2');
    // the CLI's message (validateModel through the same grid points), beside the range field
    // (the first point past delta in the CLI's order is ix = 9: -1 + 3.9 * 9 / 11)
    const refusal = 'mu = 2.190909090909091 must be below the detuning 2: for mu >= delta the photon number is unbounded';
    // the same refusal in the page's words (symbols for mu and delta, the number unchanged)
    await expect.poll(() => app.page.locator('phase-atlas-view #ax-x-msg').textContent())
      .toBe('\u03bc = 2.190909090909091 must be below the detuning 2: for \u03bc >= \u03b4 the photon number is unbounded');
    const cli = await run(join(ROOT, 'node_modules', '.bin', 'tsx'),
      [join(ROOT, 'src', 'cli', 'main.ts'), 'map', '--x', 'mu=-1:2.9:12', '--y', 'rb=0.8:2.4:6', '--detuning', '2'], { cwd: ROOT }).catch((e: { stderr: string }) => e);
    expect((cli as { stderr: string }).stderr).toContain(refusal);
    expect(await app.page.locator('phase-atlas-view input[name="range-x"]').getAttribute('aria-invalid')).toBe('true');
    await app.page.waitForTimeout(1500);
    // no scan was started for the refused plan, and the old map is marked out of date
    expect(await scanNumber(app.page, 'started')).toBe(started);
    expect(await attr('scan')).not.toBe('running');
    expect(await app.page.locator('figure-panel.map .stale-mark').textContent()).toContain('out of date');
    expect(await attr('stale')).toBe('yes');
  }, 120_000);

  it('soft core with a soft-mode box ticked traces soft-core lines and the page stays responsive', async () => {
    await open(`?view=atlas&${SMALL}&atlas.lines=vdw%3A2`);
    await waitForScan(app.page, 'done', 60_000);
    await app.page.locator('model-form select[name="interaction"]').selectOption('softcore');
    // the rb axis does not apply to soft core: said beside it, nothing runs
    await expect.poll(() => app.page.locator('phase-atlas-view #ax-y-msg').textContent()).toContain('the blockade-radius (Rb) axis needs the van der Waals or dipolar interaction');
    expect(await worstDelay()).toBeLessThan(500);
    await app.page.locator('phase-atlas-view select[name="axis-y"]').selectOption('detuning');
    await expect.poll(() => app.page.locator('phase-atlas-view input[name="range-y"]').inputValue()).toBe('3..8 x6');
    await waitForScan(app.page, 'done', 60_000);
    // the ticked box now names the soft-core cut, and its lines are traced for the soft-core model
    expect(await app.page.locator('phase-atlas-view fieldset.lines label').filter({ has: app.page.locator('input[name="line-vdw:2"]') }).textContent())
      .toContain('soft-core r\u22642');
    await expect.poll(() => app.page.locator('phase-atlas-view .soft-status').textContent(), { timeout: 60_000 }).toMatch(/^\d+ soft-mode lines?$/);
    expect(await worstDelay()).toBeLessThan(500);
  }, 120_000);

  it('Cancel leaves the scan stopped, through pointer moves and redraws', async () => {
    await open('?view=atlas'); // the demo map, 64 x 40: long enough to cancel
    await expect.poll(async () => scanNumber(app.page, 'points'), { timeout: 60_000 }).toBeGreaterThan(0);
    await app.page.locator('phase-atlas-view button.cancel').click();
    await waitForScan(app.page, 'cancelled');
    const started = await scanNumber(app.page, 'started');
    const points = await scanNumber(app.page, 'points');
    // pointer moves re-render the view; none may restart the scan
    for (const [x, y] of [[0, 1.2], [1, 1.6], [2, 2.0]]) {
      await pointAt(app.page, 'figure-panel.map', x, y);
      await app.page.waitForTimeout(300);
    }
    await app.page.waitForTimeout(1000);
    expect(await attr('scan')).toBe('cancelled');
    expect(await scanNumber(app.page, 'started')).toBe(started);
    expect(await scanNumber(app.page, 'points')).toBe(points);
    expect(await app.page.locator('phase-atlas-view button.resume').count()).toBe(1);
  }, 120_000);

  it('a tab round trip keeps the map', async () => {
    await open(`?view=atlas&${SMALL}`);
    await waitForScan(app.page, 'done', 60_000);
    const heat = await app.page.locator('figure-panel.map svg .heatmap').innerHTML();
    await app.page.locator('#tab-planner').click();
    await app.page.locator('array-planner-view').waitFor();
    await app.page.locator('#tab-atlas').click();
    // a new view element, the finished map taken from the page's cache: no scan started
    await waitForScan(app.page, 'done', 5_000);
    expect(await attr('cached')).toBe('true');
    expect(await scanNumber(app.page, 'started')).toBe(0);
    expect(await scanNumber(app.page, 'points')).toBe(12 * 6);
    expect(await app.page.locator('figure-panel.map svg .heatmap').innerHTML()).toBe(heat);
  }, 120_000);

  it('a 2D Modes request finishes, the old chain result marked out of date meanwhile', async () => {
    await open('?view=modes&modes.points=24');
    await app.page.locator('modes-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    expect(await app.page.locator('modes-view figure-panel.branches .stale-mark').count()).toBe(0);
    await app.page.locator('model-form select[name="lattice"]').selectOption('triangular');
    await app.page.locator('model-form input[name="max-cell"]').fill('8');
    // while the triangular point is computed, the chain's figures say they are out of date
    await expect.poll(() => app.page.locator('modes-view figure-panel.branches .stale-mark').textContent()).toContain('out of date, recomputing');
    await app.page.locator('modes-view[data-status="complete"][data-stale="no"]').waitFor({ state: 'attached', timeout: 90_000 });
    expect(await app.page.locator('modes-view figure-panel.branches .stale-mark').count()).toBe(0);
    // a 2D wavevector (kx, ky)
    expect(await app.page.locator('modes-view .kstar').textContent()).toMatch(/^k\* = \(.*, .*\)$/);
  }, 150_000);

  it('no console errors', () => {
    expect(app.browser.errors).toEqual([]);
  });
});
