/**
 * Comparing parameter sets (issue 11, item 16) in real Chromium: a pinned map's boundaries
 * stay drawn (dashed, with a legend entry naming the pinned parameters) over the map of a
 * changed model, and go with Unpin; a pinned staircase is drawn over the new one; a named
 * session saved in the browser survives a reload and loads back, and a damaged entry is
 * listed as refused, not loaded.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { useApp } from './harness/app-session.ts';
import { screenshot, waitForScan } from './harness/page-tools.ts';

const app = useApp('dist-compare');

/** A small map (12 x 6) and a short staircase (60 points). */
const SMALL = 'atlas.x=mu%3D-1%3A2.9%3A12&atlas.y=rb%3D0.8%3A2.4%3A6&staircase.mu=-1%3A2.9%3A60';

beforeAll(async () => {
  await app.page.goto(app.url);
  await app.page.evaluate(() => localStorage.clear());
}, 240_000);

const atlas = () => app.page.locator('phase-atlas-view');

describe('pinned results', () => {
  it('a pinned map stays drawn, dashed and named, over the map of a changed model; Unpin takes it off', async () => {
    await app.page.goto(`${app.url}?view=atlas&${SMALL}`);
    await waitForScan(app.page, 'done', 90_000);
    await atlas().locator('button.pin-map').click();
    await expect.poll(() => atlas().getAttribute('data-pinned')).toBe('drawn');
    const pinnedLines = atlas().locator('figure-panel.map svg .pinned-boundaries path');
    const before = await pinnedLines.count();
    expect(before).toBeGreaterThan(0);
    // change the model: a new map, the pinned boundaries still over it
    await app.page.locator('model-form input[name="detuning"]').fill('4');
    await waitForScan(app.page, 'running');
    await waitForScan(app.page, 'done', 90_000);
    expect(await atlas().getAttribute('data-stale')).toBe('no');
    expect(await atlas().getAttribute('data-pinned')).toBe('drawn');
    expect(await pinnedLines.count()).toBe(before);
    // dashed, and the legend names the pinned model's parameters (the demo's detuning 3, not the new 4)
    expect(await pinnedLines.last().getAttribute('stroke-dasharray')).toBe('7 4');
    const legend = await atlas().locator('figure-panel.map svg .pinned-legend').textContent();
    expect(legend).toContain('pinned map');
    expect(legend).toContain('\u03b4 = 3');
    expect(legend).not.toContain('\u03b4 = 4');
    await screenshot(app.page, 'compare-pinned-map');
    await atlas().locator('button.unpin-map').click();
    await expect.poll(() => atlas().getAttribute('data-pinned')).toBe('');
    expect(await pinnedLines.count()).toBe(0);
  });

  it('a pinned staircase is drawn over the staircase of a changed model', async () => {
    await app.page.locator('#tab-staircase').click();
    const view = app.page.locator('staircase-view');
    await app.page.locator('staircase-view[data-scan="done"]').waitFor({ state: 'attached', timeout: 90_000 });
    await view.locator('button.pin-staircase').click();
    await app.page.locator('model-form input[name="rb"]').fill('1.2');
    await app.page.locator('staircase-view[data-scan="running"]').waitFor({ state: 'attached', timeout: 30_000 });
    await app.page.locator('staircase-view[data-scan="done"]').waitFor({ state: 'attached', timeout: 90_000 });
    expect(await view.getAttribute('data-pinned')).toBe('drawn');
    // rho and <n> of the pinned model's own range: two curves
    expect(await view.locator('figure-panel.staircase svg .pinned-staircase path').count()).toBe(2);
    expect(await view.locator('figure-panel.staircase svg .pinned-legend').textContent()).toContain('Rb = 1.5');
    await screenshot(app.page, 'compare-pinned-staircase');
    await view.locator('button.unpin-staircase').click();
    await expect.poll(() => view.getAttribute('data-pinned')).toBe('');
  });
});

describe('named sessions', () => {
  const menu = () => app.page.locator('session-menu');

  it('a saved session survives a reload and loads back; a damaged entry is refused by name', async () => {
    await app.page.goto(`${app.url}?view=planner&${SMALL}`);
    await app.page.locator('model-form input[name="detuning"]').fill('3.75');
    await menu().locator('button.sessions-toggle').click();
    await menu().locator('input[name="session-name"]').fill('chain at detuning 3.75');
    await menu().locator('button.save-session').click();
    await expect.poll(() => menu().locator('li.session').count()).toBe(1);
    // a damaged entry beside it, as an older or broken page might leave
    await app.page.evaluate(() => {
      const key = 'blockade-atlas.saved-sessions';
      const doc = JSON.parse(localStorage.getItem(key)!);
      doc.entries.push({ version: 1, name: 'broken', savedAt: '2026-01-01T00:00:00Z', query: 'nothing=1' });
      localStorage.setItem(key, JSON.stringify(doc));
    });
    // move away from the saved state, then reload the bare address
    await app.page.locator('model-form input[name="detuning"]').fill('4.2');
    await app.page.goto(app.url);
    expect(await app.page.locator('model-form input[name="detuning"]').inputValue()).toBe('4.2');
    await menu().locator('button.sessions-toggle').click();
    await expect.poll(() => menu().locator('li.session').count()).toBe(1);
    expect(await menu().locator('li.session .name').textContent()).toBe('chain at detuning 3.75');
    expect(await menu().locator('li.refused').textContent()).toContain('cannot be loaded: the entry holds no page state');
    expect(await menu().locator('li.refused button.load').count()).toBe(0);
    await menu().locator('li.session button.load').click();
    await expect.poll(() => app.page.locator('model-form input[name="detuning"]').inputValue()).toBe('3.75');
    expect(new URL(app.page.url()).searchParams.get('detuning')).toBe('3.75');
    // deleting leaves the other entry
    await menu().locator('li.refused button.delete').click();
    await expect.poll(() => menu().locator('li.refused').count()).toBe(0);
    expect(await menu().locator('li.session').count()).toBe(1);
    expect(app.browser.errors).toEqual([]);
  });
});
