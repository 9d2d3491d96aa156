/**
 * The atlas offers a larger Mmax where the map's winning patterns use the largest cell
 * searched (issue 9). On the nearest-neighbour chain with Mmax = 2 the half-filled crystal
 * |1 0 1 0 ...> (period 2, a fact of the trade: common practice, no source) fills the
 * region 0 < mu < 2 V1 far from the cavity, so every point there sits at the limit; the
 * offer raises Mmax, the new map runs, and the crystal (period 2 < 4) is then off the limit.
 */
import { describe, it, expect } from 'vitest';
import { useApp } from './harness/app-session.ts';
import { waitForScan } from './harness/page-tools.ts';

const app = useApp('dist-limit');

describe('search-limit offer', () => {
  it('points at Mmax are counted and the offer raises Mmax', async () => {
    const page = app.page;
    const errors: string[] = [];
    page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
    await page.goto(app.url);
    await page.evaluate(() => localStorage.clear());
    const q = new URLSearchParams({
      view: 'atlas', lattice: 'chain', interaction: 'nn', strength: 'v1', v1: '1', detuning: '40', 'max-cell': '2',
      'atlas.x': 'mu=-0.5..2.5 x16', 'atlas.y': 'detuning=30..40 x4',
    });
    await page.goto(`${app.url}?${q}`);
    await waitForScan(page, 'done', 120_000);
    const offer = page.locator('phase-atlas-view .limit-offer');
    await offer.waitFor({ state: 'visible', timeout: 30_000 });
    // mu = -0.5 + 0.2 k: the crystal holds 0 < mu < 2, k = 3..12 -> 10 of 16 columns, 4 rows
    expect(await offer.textContent()).toMatch(/^\s*40 points \(dotted\) use the largest pattern searched \(Mmax = 2\)/);
    await page.locator('phase-atlas-view button.raise-mmax').click();
    expect(await page.locator('model-form input[name="max-cell"]').inputValue()).toBe('4');
    await waitForScan(page, 'done', 120_000);
    await page.waitForTimeout(300);
    expect(await offer.count()).toBe(0);
    expect(errors).toEqual([]);
  }, 240_000);
});
