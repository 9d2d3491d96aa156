/**
 * Drag-to-zoom on the atlas map in real Chromium: a box dragged over the demo map becomes
 * a new map whose axes are the box snapped outward to the old grid (the form's range
 * fields follow), painted at once from the old map's points at the same grid points, then
 * finished by its own scan (with its boundary lines); Escape and "Full map" return to the
 * demo map from the map cache without a new scan. Checked against the demo axes
 * (src/ui/state/app-state.ts) and the arithmetic of evenly spaced axes; no stored result.
 */
import { describe, it, expect } from 'vitest';
import { useApp } from './harness/app-session.ts';
import { scanNumber, screenshot, waitForScan } from './harness/page-tools.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';

const app = useApp('dist-zoom');

/** Demo axes (src/ui/state/app-state.ts). */
const DEMO_X = parseAxis('mu=-1..2.9 x64', 'x'), DEMO_Y = parseAxis('rb=0.8..2.4 x40', 'y');

/**
 * Client position of data point (x, y) on the map, once the drawn map's axes cover it and
 * the map is scrolled into view (opening a point scrolls the page to its detail, and a
 * figure redraws a frame after the range fields change: a drag computed before either
 * settles would start outside the plot).
 */
async function client(x: number, y: number): Promise<{ x: number; y: number }> {
  const map = app.page.locator('figure-panel.map');
  await expect.poll(() => map.evaluate((el, [dx, dy]) => {
    const f = (el as unknown as { figure?: { frame?: { x: { domain: number[] }; y: { domain: number[] } } } }).figure?.frame;
    const inside = (v: number, d: number[]) => v >= Math.min(d[0], d[1]) && v <= Math.max(d[0], d[1]);
    return !!f && inside(dx, f.x.domain) && inside(dy, f.y.domain);
  }, [x, y] as [number, number])).toBe(true);
  await map.scrollIntoViewIfNeeded();
  const p = await map.evaluate(
    (el, [dx, dy]) => (el as unknown as { dataToClient(x: number, y: number): { x: number; y: number } | null }).dataToClient(dx, dy),
    [x, y] as [number, number]);
  if (!p) throw new Error('no map figure');
  return p;
}

const range = (which: 'x' | 'y') => app.page.locator(`#ax-${which}-range`).inputValue();

describe('drag to zoom', () => {
  it('a dragged box becomes a map over the box, shown at once and then finished', async () => {
    await app.page.goto(app.url);
    await app.page.evaluate(() => localStorage.clear());
    await app.page.goto(app.url);
    await waitForScan(app.page, 'done', 120_000);
    expect(await scanNumber(app.page, 'started')).toBe(1);
    // drag from (mu, Rb) = (0.5, 1.2) to (1.5, 1.8): across the 1/3 | 1/2 boundary
    const a = await client(0.5, 1.2), b = await client(1.5, 1.8);
    await app.page.mouse.move(a.x, a.y);
    await app.page.mouse.down();
    await app.page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 4 });
    await app.page.mouse.move(b.x, b.y, { steps: 4 });
    await app.page.mouse.up();
    // the axes: old grid values bracketing the box; step 3.9/63 in mu, 1.6/39 in Rb
    // mu: 0.5 lies in (0.4857, 0.5476] -> i0 = 24; 1.5 in [1.4762, 1.5381) -> i1 = 41;
    // Rb: 1.2 in (1.1692, 1.2103) -> i0 = 9; 1.8 in (1.7744, 1.8154) -> i1 = 25
    const x = parseAxis(`mu=${await range('x')}`, 'x'), y = parseAxis(`rb=${await range('y')}`, 'y');
    expect(x.start).toBe(DEMO_X.values[24]);
    expect(x.stop).toBe(DEMO_X.values[41]);
    expect(y.start).toBe(DEMO_Y.values[9]);
    expect(y.stop).toBe(DEMO_Y.values[25]);
    // k-fold refinements with about the demo's counts: 17 steps x 4 = 68, 16 steps x 2 = 32
    expect(x.count).toBe(69);
    expect(y.count).toBe(33);
    // the new map's first picture is there before its scan has delivered a point
    const view = app.page.locator('phase-atlas-view');
    await expect.poll(() => view.getAttribute('data-started')).toBe('2');
    expect(await view.getAttribute('data-first-ms')).toBe('0.0');
    expect(await app.page.locator('figure-panel.map svg .heatmap rect').count()).toBeGreaterThan(0);
    await waitForScan(app.page, 'done', 120_000);
    expect(await scanNumber(app.page, 'points')).toBe(69 * 33);
    // the finished map: its axis ticks lie inside the box, its boundary lines are drawn
    const ticks = (await app.page.locator('figure-panel.map svg .axis-x text').allTextContents()).map(Number).filter(Number.isFinite);
    expect(ticks.length).toBeGreaterThan(2);
    for (const t of ticks) { expect(t).toBeGreaterThanOrEqual(x.start - 1e-9); expect(t).toBeLessThanOrEqual(x.stop + 1e-9); }
    expect(await app.page.locator('figure-panel.map svg .boundaries path, figure-panel.map svg .boundaries polyline').count()).toBeGreaterThan(0);
    // the refinement corners on the old grid points were taken from the demo map, not solved
    expect(await app.page.locator('.map-notes').textContent()).toMatch(/\d+ corner points taken from the map this one was zoomed from/);
    // the click that ended the drag opened no point
    expect(await app.page.locator('point-detail').count()).toBe(0);
    await screenshot(app.page, 'atlas-zoomed');
  });

  it('Escape returns to the demo map from the cache; Full map returns from two zooms', async () => {
    // with a point open, the first Escape closes the point and keeps the zoom
    const zoomed = await range('x');
    const p = await client(1.0, 1.5);
    await app.page.mouse.click(p.x, p.y);
    await app.page.locator('point-detail').waitFor({ state: 'attached' });
    await app.page.keyboard.press('Escape');
    await expect.poll(() => app.page.locator('point-detail').count()).toBe(0);
    expect(await range('x')).toBe(zoomed);
    await app.page.locator('figure-panel.map .host').focus();
    await app.page.keyboard.press('Escape');
    await expect.poll(() => range('x')).toBe('-1..2.9 x64');
    expect(await range('y')).toBe('0.8..2.4 x40');
    await waitForScan(app.page, 'done');
    expect(await app.page.locator('phase-atlas-view').getAttribute('data-cached')).toBe('true');
    expect(await app.page.locator('button.zoom-back').count()).toBe(0);
    // zoom twice, then back to the full map in one step
    for (const [[x0, y0], [x1, y1]] of [[[0, 1.0], [2, 2.0]], [[0.5, 1.2], [1.0, 1.6]]]) {
      const a = await client(x0, y0), b = await client(x1, y1);
      await app.page.mouse.move(a.x, a.y);
      await app.page.mouse.down();
      await app.page.mouse.move(b.x, b.y, { steps: 6 });
      await app.page.mouse.up();
      await expect.poll(() => range('x')).not.toBe('-1..2.9 x64');
      await waitForScan(app.page, 'done', 120_000);
    }
    expect(parseAxis(`mu=${await range('x')}`, 'x').stop).toBeLessThan(1.1);
    await app.page.locator('button.zoom-full').click();
    await expect.poll(() => range('x')).toBe('-1..2.9 x64');
    expect(await range('y')).toBe('0.8..2.4 x40');
    await waitForScan(app.page, 'done');
    expect(await app.page.locator('phase-atlas-view').getAttribute('data-cached')).toBe('true');
    expect(app.browser.errors).toEqual([]);
  });
});
