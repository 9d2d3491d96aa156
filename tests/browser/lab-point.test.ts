/**
 * The lab point (issue 11, item 12) in real Chromium: the planner's "use these numbers"
 * puts the operating point on the atlas map, as a marker with its one-sigma box, at the
 * place the unit conversion gives (closed form computed here, DESIGN.md "Lab units":
 * Rb/a = (C6 / (a^6 2g))^(1/6), mu = mu_lab / g), re-centres the blockade-radius axis the
 * point lies outside of, carries the marker into the SVG export, and marks the point's mu
 * on the staircase; the modes view says whether its spectrum is at the point.
 */
import { describe, it, expect } from 'vitest';
import { useApp } from './harness/app-session.ts';
import { download, screenshot, waitForScan } from './harness/page-tools.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';

const app = useApp('dist-lab-point');

/** A small map (12 x 6) and a short staircase (60 points), so each check runs in seconds. */
const SMALL = 'atlas.x=mu%3D-1%3A2.9%3A12&atlas.y=rb%3D0.8%3A2.4%3A6&staircase.mu=-1%3A2.9%3A60';

// The planner's demo numbers (invented): C6/h = 140 GHz um^6, g0/2pi = 0.5 MHz, N = 200,
// Delta/2pi = 21 MHz, mu/h = 7 MHz; the spacing typed below is 1.5 +- 0.03 um, the pump +- 0.5 MHz.
const G = 0.5 * Math.sqrt(200);
const RB_OVER_A = Math.pow((140e3) / (2 * G), 1 / 6) / 1.5; // 3.09: outside the demo's Rb axis 0.8..2.4
const MU = 7 / G;
const SIGMA_RB = RB_OVER_A * (0.03 / 1.5); // first order, (Rb/a) sigma_a / a
const SIGMA_MU = 0.5 / G;

describe('the lab point on every view', () => {
  it('"use these numbers" marks the point with its box on the atlas, re-centres the axis it missed, and exports it', async () => {
    await app.page.goto(app.url);
    await app.page.evaluate(() => localStorage.clear());
    await app.page.goto(`${app.url}?view=planner&${SMALL}`);
    await app.page.locator('array-planner-view input[name="lab-spacing"]').fill('1.5');
    await app.page.locator('array-planner-view input[name="lab-dspacing"]').fill('0.03');
    await app.page.locator('array-planner-view input[name="lab-dmu"]').fill('0.5');
    await app.page.locator('array-planner-view button.use-numbers').click();
    await expect.poll(() => app.page.locator('array-planner-view .lab-in-use').count()).toBe(1);
    await app.page.locator('#tab-atlas').click();
    // the Rb axis kept its span 1.6 and its 6 points, centred on Rb/a = 3.09 (it held 0.8..2.4)
    const y = parseAxis(`rb=${await app.page.locator('phase-atlas-view input[name="range-y"]').inputValue()}`, 'y');
    expect(y.count).toBe(6);
    // written to 6 significant digits: 1e-5 absolute
    expect(Math.abs((y.start + y.stop) / 2 - RB_OVER_A)).toBeLessThan(1e-5);
    expect(Math.abs(y.stop - y.start - 1.6)).toBeLessThan(1e-5);
    await waitForScan(app.page, 'done', 90_000);
    await expect.poll(() => app.page.locator('phase-atlas-view').getAttribute('data-lab')).toBe('box');
    const mark = app.page.locator('figure-panel.map svg g.lab-point');
    expect(await mark.count()).toBe(1);
    // the marker sits at the converted point (stored as the exact doubles: 1e-12 relative)
    const at = [Number(await mark.getAttribute('data-x')), Number(await mark.getAttribute('data-y'))];
    expect(Math.abs(at[0] / MU - 1)).toBeLessThan(1e-12);
    expect(Math.abs(at[1] / RB_OVER_A - 1)).toBeLessThan(1e-12);
    // its box spans +- sigma on both axes: width and height in pixels against the frame's scale
    const box = await mark.locator('rect').nth(1).boundingBox();
    const scale = await app.page.locator('figure-panel.map').evaluate((el, [mu, rb, smu, srb]) => {
      const p = el as unknown as { dataToClient(x: number, y: number): { x: number; y: number } | null };
      const a = p.dataToClient(mu - smu, rb - srb)!, b = p.dataToClient(mu + smu, rb + srb)!;
      return { w: Math.abs(b.x - a.x), h: Math.abs(b.y - a.y) };
    }, [MU, RB_OVER_A, SIGMA_MU, SIGMA_RB]);
    // the rect's stroke adds about a pixel either side; 2 px allows for it and for rounding
    expect(Math.abs(box!.width - scale.w)).toBeLessThan(2.5);
    expect(Math.abs(box!.height - scale.h)).toBeLessThan(2.5);
    expect(await app.page.locator('figure-panel.map svg .lab-point-legend').textContent()).toContain('lab point');
    // the exported SVG carries the marker
    const svg = await download(app.page, () => app.page.locator('figure-panel.map button', { hasText: 'SVG' }).click());
    expect(svg.text).toContain('class="lab-point"');
    await screenshot(app.page, 'lab-point-atlas');
  });

  it('marks the point on the staircase, and the modes view says its spectrum is at it', async () => {
    await app.page.locator('#tab-staircase').click();
    await app.page.locator('staircase-view[data-scan="done"]').waitFor({ state: 'attached', timeout: 90_000 });
    await expect.poll(() => app.page.locator('staircase-view').getAttribute('data-lab')).toBe('marker');
    const mark = app.page.locator('figure-panel.staircase svg g.lab-point');
    expect(await mark.count()).toBe(1);
    expect(Math.abs(Number(await mark.getAttribute('data-x')) / MU - 1)).toBeLessThan(1e-12);
    await screenshot(app.page, 'lab-point-staircase');
    await app.page.locator('#tab-modes').click();
    await expect.poll(() => app.page.locator('modes-view').getAttribute('data-lab'), { timeout: 10_000 }).toBe('at');
    // the model moved off the point: the modes view says so
    await app.page.locator('model-form input[name="mu"]').fill('0.5');
    await expect.poll(() => app.page.locator('modes-view').getAttribute('data-lab')).toBe('away');
    expect(app.browser.errors).toEqual([]);
  });
});
