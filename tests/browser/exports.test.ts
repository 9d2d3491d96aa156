/**
 * Exports from the page in real Chromium (issue 11, item 15): the phase map saved as a
 * vector PDF (its first bytes are %PDF, ISO 32000-1:2008, 7.5.2; it ends with %%EOF,
 * 7.5.5; its labels are text objects, not an image), as PNG at the single-column preset
 * (3.4 in x 300 dpi = 1020 px wide, the dpi in pHYs, PNG W3C 2003, 11.3.5.3) and as SVG
 * sized in inches; the map's CSV starts with a '#' header of the inputs and its table is
 * the CLI's (src/cli) for the same command; file names carry the view and inputs.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { OUTPUT } from './harness/build-app.ts';
import { useApp } from './harness/app-session.ts';
import { download, runCliLine, waitForScan } from './harness/page-tools.ts';
import { readPngSize } from '../../src/ui/export/png-density.ts';

const app = useApp('dist-exports');

/** A small map (12 x 7 points) of the demo model. */
const SMALL_MAP = '?view=atlas&atlas.x=mu%3D-1%3A2.9%3A12&atlas.y=rb%3D0.9%3A2.1%3A7';
/** Portable file names (POSIX portable filename character set). */
const PORTABLE = /^[A-Za-z0-9._-]+$/;

beforeAll(async () => {
  await app.page.goto(app.url);
  await app.page.evaluate(() => localStorage.clear());
  await app.page.goto(app.url + SMALL_MAP);
  await waitForScan(app.page, 'done', 90_000);
}, 240_000);

/** Where the saved files are kept for a look (test-output/exports). */
const SAVED = join(OUTPUT, 'exports');

/** Click a button and read back the downloaded file's bytes and suggested name (a copy goes to SAVED). */
async function downloadBytes(click: () => Promise<void>): Promise<{ name: string; bytes: Buffer }> {
  const [d] = await Promise.all([app.page.waitForEvent('download', { timeout: 30_000 }), click()]);
  const bytes = await readFile(await d.path());
  await mkdir(SAVED, { recursive: true });
  await writeFile(join(SAVED, d.suggestedFilename()), bytes);
  return { name: d.suggestedFilename(), bytes };
}

describe('exports of the phase map', () => {
  it('saves a vector PDF: %PDF first, %%EOF last, the axis label as text, no image', async () => {
    const { name, bytes } = await downloadBytes(() => app.page.locator('figure-panel.map button', { hasText: 'PDF' }).click());
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.toString('latin1').trimEnd().endsWith('%%EOF')).toBe(true);
    const text = bytes.toString('latin1');
    expect(text).toContain('(chemical potential ) Tj');
    expect(text).not.toMatch(/\/Subtype \/Image/);
    // the view, the figure and the key inputs: Rb and mu are the axes, delta and T fixed
    expect(name).toMatch(PORTABLE);
    expect(name).toBe('atlas-phase-map_chain_vdw_Rb0.9..2.1_delta3_mu-1..2.9_T0.pdf');
  });

  it('the map CSV starts with a # header of the inputs; after it, the table the CLI writes', async () => {
    const { name, text } = await download(app.page, () => app.page.locator('phase-atlas-view data-export.map-export button', { hasText: 'CSV' }).click());
    expect(name).toBe('atlas-phase-map_chain_vdw_Rb0.9..2.1_delta3_mu-1..2.9_T0.csv');
    const lines = text.trimEnd().split('\n');
    expect(lines[0].startsWith('#')).toBe(true);
    expect(lines).toContain('#   detuning = 3');
    expect(lines).toContain('#   x = mu=-1:2.9:12');
    const body = lines.filter((l) => !l.startsWith('#'));
    // pandas' comment='#' cuts a line at any '#': none may stand in the data
    for (const l of body) expect(l).not.toContain('#');
    const command = (await app.page.locator('phase-atlas-view data-export.map-export code.command').textContent()) ?? '';
    const cli = (await runCliLine(command)).trimEnd().split('\n').filter((l) => !l.startsWith('#'));
    expect(body[0]).toBe(cli[0]);
    expect(body.length).toBe(1 + 12 * 7);
    expect(body.slice(1).map((l) => l.split(',').slice(0, 6).join(','))).toEqual(cli.slice(1).map((l) => l.split(',').slice(0, 6).join(',')));
  });

  it('PNG at the single-column preset and 300 dpi: 1020 px wide, 300 dpi in pHYs; SVG sized 3.4 in', async () => {
    const panel = app.page.locator('figure-panel.map');
    await panel.locator('button.size-toggle').click();
    await panel.locator('select[name="export-size"]').selectOption('single');
    await panel.locator('select[name="export-dpi"]').selectOption('300');
    expect(await panel.locator('select[name="export-size"] option[value="single"]').textContent()).toContain('single column, 3.4 in');
    const { name, bytes } = await downloadBytes(() => panel.locator('button', { hasText: 'PNG' }).click());
    expect(name).toMatch(/^atlas-phase-map_.*\.png$/);
    expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const png = readPngSize(new Uint8Array(bytes));
    expect(png.width).toBe(1020);
    // 300 dpi = 300 / 0.0254 m = 11811 px per metre (unit 1: metre)
    expect(png.phys).toEqual([11811, 11811, 1]);
    const svg = await download(app.page, () => panel.locator('button', { hasText: 'SVG' }).click());
    expect(svg.text).toMatch(/<svg [^>]*width="3\.4in"/);
    // laid out again at 3.4 in x 96 px = 326.4 px (CSS Values 3), so its 12 px text prints at 9 pt, as the size note says
    expect(svg.text).toMatch(/<svg [^>]*viewBox="0 0 326\.4 /);
    expect(await panel.locator('.size-note').textContent()).toMatch(/laid out for this width[\s\S]*text 9\.0 pt/);
    // the PDF page at the same preset: 3.4 in = 244.8 pt wide
    const pdf = await downloadBytes(() => panel.locator('button', { hasText: 'PDF' }).click());
    expect(pdf.bytes.toString('latin1')).toMatch(/\/MediaBox \[0 0 244\.8 [\d.]+\]/);
    // the choice is shared by every figure and kept: back to the screen size for the other tests
    await panel.locator('select[name="export-size"]').selectOption('screen');
  });

  it('every figure of the modes and staircase views saves as a PDF', async () => {
    const views = [
      { view: 'modes', query: '?view=modes', ready: 'modes-view[data-status="complete"]', figures: 2 },
      { view: 'staircase', query: '?view=staircase&staircase.mu=-1%3A2.9%3A120', ready: 'staircase-view[data-scan="done"]', figures: 1 },
    ];
    for (const v of views) {
      await app.page.goto(app.url + v.query);
      await app.page.locator(v.ready).waitFor({ state: 'attached', timeout: 90_000 });
      const buttons = app.page.locator(`${v.view}-view figure-panel button`, { hasText: 'PDF' });
      expect(await buttons.count()).toBeGreaterThanOrEqual(v.figures);
      for (let i = 0; i < await buttons.count(); i++) {
        const { name, bytes } = await downloadBytes(() => buttons.nth(i).click());
        expect(name.startsWith(v.view)).toBe(true);
        expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
        expect(bytes.toString('latin1')).toMatch(/ Tj /);
      }
    }
  });

  it('no console errors', () => {
    expect(app.browser.errors).toEqual([]);
  });
});
