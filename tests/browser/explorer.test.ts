/**
 * The explorer in real Chromium (Debian's /usr/bin/chromium through playwright-core):
 * the production build served on 127.0.0.1, driven as a user would. Each check below is
 * against the engine's own command line for the same inputs or against what the page
 * must show; none rests on a stored result. Screenshots of every view go to
 * test-output/screenshots (printed at the start).
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { expectRel } from '../references.ts';
import { useApp } from './harness/app-session.ts';
import { SCREENSHOTS, download, pointAt, runCliLine, scanNumber, screenshot, waitForScan } from './harness/page-tools.ts';

const app = useApp('dist-explorer');

/** Demo axes (src/ui/state/app-state.ts): mu = -1:2.9:64, rb = 0.8:2.4:40. */
const DEMO = { nx: 64, ny: 40 };

beforeAll(() => {
  console.log(`browser tests: screenshots in ${SCREENSHOTS}`);
});

/** Open the page fresh (no saved session) with an optional query. */
async function open(query = '') {
  await app.page.goto(app.url);
  await app.page.evaluate(() => localStorage.clear());
  await app.page.goto(app.url + query);
}

describe('phase atlas', () => {
  it('renders the demo map with at least three distinct phases', async () => {
    await open();
    await waitForScan(app.page, 'done', 90_000);
    expect(await scanNumber(app.page, 'points')).toBe(DEMO.nx * DEMO.ny);
    const legend = await app.page.locator('figure-panel.map svg .legend text').allTextContents();
    const phases = legend.filter((t) => t !== 'Phase');
    expect(phases.length).toBeGreaterThanOrEqual(3);
    // the heatmap itself paints at least three different fills
    const fills = await app.page.locator('figure-panel.map svg .heatmap rect').evaluateAll((rs) => [...new Set(rs.map((r) => r.getAttribute('fill')))]);
    expect(fills.filter((f) => f && !f.startsWith('url')).length).toBeGreaterThanOrEqual(3);
    // fractions written on the density-wave regions
    const labels = await app.page.locator('figure-panel.map svg .fraction-labels text').allTextContents();
    expect(labels).toContain('1/2');
    await screenshot(app.page, 'atlas');
  });

  it('the readout follows the cursor', async () => {
    const readout = app.page.locator('phase-atlas-view .readout');
    await pointAt(app.page, 'figure-panel.map', -0.8, 1.0); // far below the condensate onset: empty
    await expect.poll(() => readout.textContent()).toContain('empty');
    const first = await readout.textContent();
    // mu = -0.8 is grid point 3 of -1:2.9:64 (step 3.9/63 = 0.0619): value -0.8143
    expect(first).toContain('\u03bc = -0.8143');
    await pointAt(app.page, 'figure-panel.map', 1.6, 1.4);
    await expect.poll(() => readout.textContent()).not.toBe(first);
    expect(await readout.textContent()).toMatch(/density wave|supersolid/);
  });

  it('the map is keyboard operable: arrows move the readout, Enter opens the point', async () => {
    const readout = app.page.locator('phase-atlas-view .readout');
    await app.page.locator('figure-panel.map .host').focus();
    await app.page.keyboard.press('ArrowRight');
    const a = await readout.textContent();
    await app.page.keyboard.press('Shift+ArrowRight');
    await expect.poll(() => readout.textContent()).not.toBe(a);
    expect(await readout.textContent()).toMatch(/\u03bc = .*, Rb = /);
    await app.page.keyboard.press('Enter');
    await app.page.locator('point-detail .phase-name').waitFor({ timeout: 20_000 });
    await app.page.locator('point-detail button', { hasText: 'Close' }).click();
    expect(await app.page.locator('point-detail').count()).toBe(0);
  });

  it('the map saves as SVG and as PNG', async () => {
    const svg = await download(app.page, () => app.page.locator('figure-panel.map button', { hasText: 'SVG' }).click());
    expect(svg.name).toMatch(/^atlas-phase-map_chain_vdw_[A-Za-z0-9._-]*\.svg$/); // view, figure and key inputs (tests/ui/export/file-name.test.ts)
    expect(svg.text).toContain('<svg xmlns="http://www.w3.org/2000/svg"');
    expect(svg.text).toContain('chemical potential \u03bc (g)');
    expect(svg.text).toContain('class="legend"');
    const [d] = await Promise.all([app.page.waitForEvent('download'), app.page.locator('figure-panel.map button', { hasText: 'PNG' }).click()]);
    expect(d.suggestedFilename()).toMatch(/^atlas-phase-map_chain_vdw_[A-Za-z0-9._-]*\.png$/);
    const bytes = await readFile(await d.path());
    // the PNG signature (ISO/IEC 15948, 5.2): 89 50 4E 47 0D 0A 1A 0A
    expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(bytes.length).toBeGreaterThan(10_000);
  });

  it('a click opens the point with its sublattice pattern', async () => {
    await pointAt(app.page, 'figure-panel.map', 1.5, 1.9);
    await app.page.mouse.down();
    await app.page.mouse.up();
    const detail = app.page.locator('point-detail');
    await detail.locator('.phase-name').waitFor({ timeout: 20_000 });
    const name = await detail.locator('.phase-name').textContent();
    // at T = 0 without a condensate the density is locked: a filling, named as one
    expect(name).toMatch(/density wave, filling 1\/3/);
    // the pattern: sites on the lattice, shaded by density with a period of three
    const fills = await detail.locator('figure-panel.pattern svg .dots circle').evaluateAll((cs) => cs.map((c) => c.getAttribute('fill')));
    expect(fills.length).toBeGreaterThanOrEqual(9);
    expect(new Set(fills).size).toBeGreaterThanOrEqual(2);
    for (let i = 3; i < fills.length; i++) expect(fills[i]).toBe(fills[i - 3]);
    await screenshot(app.page, 'atlas-point');
  });

  it('changing the detuning cancels the running scan and redraws', async () => {
    const started = await scanNumber(app.page, 'started');
    const cancelled = await scanNumber(app.page, 'cancelled');
    const detuning = app.page.locator('model-form input[name="detuning"]');
    await detuning.fill('3.3');
    await waitForScan(app.page, 'running');
    await detuning.fill('3.6');
    await waitForScan(app.page, 'done', 90_000);
    expect(await scanNumber(app.page, 'started')).toBe(started + 2);
    expect(await scanNumber(app.page, 'cancelled')).toBeGreaterThanOrEqual(cancelled + 1);
    // every point on the final map belongs to the new detuning
    const { text } = await download(app.page, () => app.page.locator('phase-atlas-view data-export.map-export button', { hasText: 'JSON' }).click());
    const doc = JSON.parse(text) as { params: { delta: number }; points: { delta: number }[]; complete: boolean };
    expect(doc.params.delta).toBe(3.6);
    expect(doc.complete).toBe(true);
    expect(doc.points.every((p) => p.delta === 3.6)).toBe(true);
  });

  it('an invalid value shows its message beside the field and keeps the last map', async () => {
    const svgBefore = await app.page.locator('figure-panel.map svg .heatmap').innerHTML();
    await app.page.locator('model-form input[name="detuning"]').fill('3.6x');
    const msg = app.page.locator('model-form [data-field="detuning"]');
    await expect.poll(() => msg.textContent()).toContain("must be a finite number, got '3.6x'");
    expect(await app.page.locator('phase-atlas-view .stale').count()).toBe(1);
    expect(await app.page.locator('figure-panel.map svg .heatmap').innerHTML()).toBe(svgBefore);
    await screenshot(app.page, 'atlas-invalid');
    // mu above the detuning is refused with the reason (typed on the modes view: on the
    // atlas the mu field is set by the x axis and greyed out)
    await app.page.locator('model-form input[name="detuning"]').fill('3.6');
    await app.page.locator('#tab-modes').click();
    await app.page.locator('model-form input[name="mu"]').fill('4');
    await expect.poll(() => app.page.locator('model-form [data-field="mu"]').textContent()).toContain('photon number is unbounded');
    await app.page.locator('model-form input[name="mu"]').fill('1');
    await expect.poll(() => app.page.locator('model-form [data-field="mu"]').textContent()).toBe('');
    await app.page.locator('#tab-atlas').click();
    await waitForScan(app.page, 'done', 90_000);
    expect(await app.page.locator('figure-panel.map svg .heatmap').innerHTML()).toBe(svgBefore);
  });

  it('CSV export has the CLI header and one row a point, equal to the CLI map', async () => {
    await open('?view=atlas&atlas.x=mu%3D-1%3A2.9%3A12&atlas.y=rb%3D0.9%3A2.1%3A7');
    await waitForScan(app.page, 'done');
    const { name, text } = await download(app.page, () => app.page.locator('phase-atlas-view data-export.map-export button', { hasText: 'CSV' }).click());
    expect(name).toMatch(/^atlas-phase-map_chain_vdw_[A-Za-z0-9._-]*\.csv$/);
    // the page's CSV starts with a '#' header of its inputs (tests/browser/exports.test.ts); the table follows
    const lines = text.trimEnd().split('\n').filter((l) => !l.startsWith('#'));
    const command = await app.page.locator('phase-atlas-view data-export.map-export code.command').textContent();
    const cli = (await runCliLine(command ?? '')).trimEnd().split('\n');
    expect(lines[0]).toBe(cli[0]);
    expect(lines[0].split(',').slice(0, 7)).toEqual(['ix', 'iy', 'mu', 'rb', 'phase', 'fraction', 'cellSize']);
    expect(lines.length - 1).toBe(12 * 7);
    expect(cli.length).toBe(lines.length);
    // one scan path, one column table, one writer (byte for byte in Node:
    // tests/ui/controllers/map-scan.test.ts); here the page runs in Chromium's V8 and the
    // CLI in Node's, so the grand potential is compared to 1e-9 (rounding of two builds)
    const col = lines[0].split(',').indexOf('grandPotential');
    for (let i = 1; i < lines.length; i++) {
      const a = lines[i].split(','), b = cli[i].split(',');
      expect(a.slice(0, 6)).toEqual(b.slice(0, 6));
      expect(Math.abs(Number(a[col]) - Number(b[col]))).toBeLessThan(1e-9);
    }
  });

  it('the URL round-trips the whole state; the last session is restored on reload', async () => {
    await open();
    await app.page.locator('model-form select[name="lattice"]').selectOption('square');
    // Rb typed on the staircase view (on the atlas the rb axis sets it and the field is greyed out)
    await app.page.locator('#tab-staircase').click();
    await app.page.locator('model-form input[name="rb"]').fill('1.3');
    await app.page.locator('#tab-atlas').click();
    await app.page.locator('phase-atlas-view input[name="range-x"]').fill('-1:2:20');
    await app.page.locator('phase-atlas-view input[name="line-vdw:2"]').check();
    const url = app.page.url();
    // a fresh page (no saved session) opened on the link shows the same entries
    await app.page.goto(app.url);
    await app.page.evaluate(() => localStorage.clear());
    await app.page.goto(url);
    expect(await app.page.locator('model-form select[name="lattice"]').inputValue()).toBe('square');
    expect(await app.page.locator('model-form input[name="rb"]').inputValue()).toBe('1.3');
    expect(await app.page.locator('phase-atlas-view input[name="range-x"]').inputValue()).toBe('-1:2:20');
    expect(await app.page.locator('phase-atlas-view input[name="line-vdw:2"]').isChecked()).toBe(true);
    expect(app.page.url()).toBe(url);
    // the bare address restores the last session
    await app.page.goto(app.url);
    expect(await app.page.locator('model-form input[name="rb"]').inputValue()).toBe('1.3');
    expect(app.page.url()).toBe(url);
  });
});

describe('staircase', () => {
  it('the demo staircase shows its labelled plateaus and their widths', async () => {
    await open('?view=staircase');
    await app.page.locator('staircase-view[data-scan="done"]').waitFor({ state: 'attached', timeout: 90_000 });
    await expect.poll(() => app.page.locator('figure-panel.staircase svg .band-label').count()).toBeGreaterThan(0);
    const labels = await app.page.locator('figure-panel.staircase svg .band-label').allTextContents();
    // the demo chain (vdw, Rb = 1.5, delta = 3) locks at 1/3 and 1/2 over mu in -1..2.9 (its atlas shows both)
    expect(labels).toContain('1/2');
    expect(labels).toContain('1/3');
    const widths = await app.page.locator('staircase-view table.plateaus').first().locator('tbody tr').count();
    expect(widths).toBeGreaterThanOrEqual(2);
    await screenshot(app.page, 'staircase');
  });

  it('its plateaus, edges bisected, equal those of the CLI staircase', async () => {
    await open('?view=staircase&staircase.mu=-1%3A2.9%3A80&staircase.compare=');
    await app.page.locator('staircase-view[data-refined="yes"]').waitFor({ state: 'attached', timeout: 90_000 });
    const { text } = await download(app.page, () => app.page.locator('staircase-view data-export.points-export button', { hasText: 'JSON' }).click());
    const mine = JSON.parse(text).series[0].plateaus as { fraction: string; muLow: number; muHigh: number }[];
    const command = await app.page.locator('staircase-view data-export.points-export code.command').textContent();
    const cli = JSON.parse(await runCliLine(command ?? '')).plateaus as typeof mine;
    expect(mine.map((p) => p.fraction)).toEqual(cli.map((p) => p.fraction));
    // one staircase scan (line, plateaus, bisection) for both; two V8 builds may round a
    // last digit apart, which can move a bisected edge by one step: 2e-9
    mine.forEach((p, i) => {
      expect(Math.abs(p.muLow - cli[i].muLow)).toBeLessThan(2e-9);
      expect(Math.abs(p.muHigh - cli[i].muHigh)).toBeLessThan(2e-9);
    });
  });
});

describe('modes', () => {
  it('shows the branches, the margin and k* of the CLI spectrum for the same point', async () => {
    // the uniform condensate forced (cell 1) at mu = 0.1, Rb = 1.2 goes soft at k* = pi
    await open('?view=modes&mu=0.1&rb=1.2&modes.cell=1&modes.points=65');
    await app.page.locator('modes-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    const { text } = await download(app.page, () => app.page.locator('modes-view data-export button', { hasText: 'JSON' }).click());
    const mine = JSON.parse(text);
    const command = await app.page.locator('modes-view data-export code.command').textContent();
    const cli = JSON.parse(await runCliLine(command ?? ''));
    expect(mine.branches.length).toBe(65);
    // same code on the same inputs in two V8 builds: equal to rounding (1e-9 on margins of order 1)
    expect(Math.abs(mine.softMode.margin - cli.softMode.margin)).toBeLessThan(1e-9);
    expect(Math.abs(mine.softMode.k - cli.softMode.k)).toBeLessThan(1e-6);
    expect(mine.softMode.stable).toBe(false);
    expect(await app.page.locator('modes-view figure-panel.branches svg path').count()).toBeGreaterThan(0);
    await screenshot(app.page, 'modes');
  });
});

describe('correlated check', () => {
  /** Run the view's method and return the page's JSON and the CLI's JSON for the offered command. */
  async function pageAndCli(query: string) {
    await open(`?view=correlated&${query}`);
    await app.page.locator('correlated-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 120_000 });
    const { text } = await download(app.page, () => app.page.locator('correlated-view data-export button', { hasText: 'JSON' }).click());
    const command = await app.page.locator('correlated-view data-export code.command').textContent();
    return { mine: JSON.parse(text), cli: JSON.parse(await runCliLine(command ?? '')) };
  }

  it('ED finishes and agrees with the CLI for the same inputs', async () => {
    const { mine, cli } = await pageAndCli('correlated.method=ed&correlated.size=10');
    expect(mine.method).toBe('ed');
    expect(mine.sites).toBe(10);
    // the same Lanczos on the same cluster: equal to rounding (1e-12 on energies of order 1)
    expect(Math.abs(mine.energyPerSite - cli.energyPerSite)).toBeLessThan(1e-12);
    expect(Math.abs(mine.alpha - cli.alpha)).toBeLessThan(1e-9);
    expect(mine.siteDensities.length).toBe(10);
    mine.siteDensities.forEach((d: number, i: number) => expect(Math.abs(d - cli.siteDensities[i])).toBeLessThan(1e-9));
    expect(await app.page.locator('correlated-view figure-panel.sk svg .error-bars circle').count()).toBe(mine.structureFactor.length);
    await screenshot(app.page, 'correlated-ed');
  });

  it('VMC finishes and agrees with the CLI for the same seed and chain count', async () => {
    const { mine, cli } = await pageAndCli('correlated.method=vmc&correlated.size=10&correlated.steps=30&correlated.samples=2000');
    expect(mine.method).toBe('vmc');
    // The seed and the number of chains fix the Markov chains (DESIGN.md, VMC). The page runs in
    // Chromium's V8 and the CLI in Node's: Math.exp and friends may round differently in the last
    // bit there, so the sums agree to 1e-12 relative; one Metropolis decision taken differently
    // would instead move the energy by about its error bar (~1e-4 here), far beyond that.
    expect(mine.chains).toBe(cli.chains);
    expectRel(mine.energyPerSite.value, cli.energyPerSite.value, 1e-12);
    expectRel(mine.energyPerSite.error, cli.energyPerSite.error, 1e-9);
    expectRel(mine.density.value, cli.density.value, 1e-12);
    expect(mine.acceptance).toBe(cli.acceptance);
    expect(mine.trace.length).toBe(30);
    expect(await app.page.locator('correlated-view figure-panel.trace svg .error-bars circle').count()).toBe(30);
    await screenshot(app.page, 'correlated-vmc');
  });
});

describe('correlated check on an uploaded array', () => {
  it('draws the CSV array to scale and its ED equals the CLI on the same file', async () => {
    // an invented six-site zig-zag, coordinates in um with a = 4 um
    const dir = await mkdtemp(join(tmpdir(), 'atlas-sites-'));
    const csv = join(dir, 'zigzag.csv');
    await writeFile(csv, 'x,y\n0,0\n4,2\n8,0\n12,2\n16,0\n20,2\n');
    await open('?view=correlated&correlated.method=ed&correlated.cluster=array&correlated.alpha=0.2');
    await app.page.locator('correlated-view input[name="correlated-spacing"]').fill('4');
    await app.page.locator('correlated-view input[type="file"]').setInputFiles(csv);
    await app.page.locator('correlated-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    const circles = await app.page.locator('correlated-view figure-panel.cluster svg .dots circle').count();
    expect(circles).toBe(6);
    // drawn to scale: neighbouring sites 1.118 a apart (sqrt(1 + 0.5^2)), the axis spans 5 a
    const xs = await app.page.locator('correlated-view figure-panel.cluster svg .dots circle').evaluateAll((cs) => cs.map((c) => Number(c.getAttribute('cx'))));
    const ys = await app.page.locator('correlated-view figure-panel.cluster svg .dots circle').evaluateAll((cs) => cs.map((c) => Number(c.getAttribute('cy'))));
    const dx = xs[1] - xs[0], dy = ys[1] - ys[0];
    // equal scales on both axes: the pixel step is 2:1 like the data step (0.5 a up per 1 a along), to 0.02 px rounding
    expect(Math.abs(Math.abs(dx) - 2 * Math.abs(dy))).toBeLessThan(0.05);
    // the zig-zag (rows 0.5 a apart) is cut from no lattice of spacing a: no mean-field column
    // against the form's chain (issue 11 item 8)
    expect(await app.page.locator('correlated-view table.comparison thead').textContent()).toContain('no lattice of spacing a');
    const { text } = await download(app.page, () => app.page.locator('correlated-view data-export button', { hasText: 'JSON' }).click());
    const mine = JSON.parse(text);
    const command = (await app.page.locator('correlated-view data-export code.command').textContent()) ?? '';
    expect(command).toContain('--sites sites.csv');
    const saved = await download(app.page, () => app.page.locator('correlated-view button', { hasText: 'Save sites.csv' }).click());
    const savedPath = join(dir, 'sites.csv');
    await writeFile(savedPath, saved.text);
    const cli = JSON.parse(await runCliLine(command.replace('--sites sites.csv', `--sites ${savedPath}`)));
    expect(mine.sites).toBe(6);
    // the same Lanczos on the same six sites: equal to rounding (1e-12)
    expect(Math.abs(mine.energyPerSite - cli.energyPerSite)).toBeLessThan(1e-12);
    await rm(dir, { recursive: true, force: true });
    await screenshot(app.page, 'correlated-array');
  });
});

describe('array planner', () => {
  it('converts lab numbers and gives a verdict with its margin', async () => {
    await open('?view=planner');
    // demo lab numbers: g = 0.5 MHz sqrt(200) = 7.071 MHz; Rb = (140e3 / (2 g))^(1/6) um over a = 4 um
    const g = 0.5 * Math.sqrt(200), rbA = Math.pow(140e3 / (2 * g), 1 / 6) / 4;
    expect(Number(await app.page.locator('array-planner-view .g-mhz').textContent())).toBeCloseTo(g, 3);
    expect(Number(await app.page.locator('array-planner-view .rb-a').textContent())).toBeCloseTo(rbA, 3);
    const verdict = app.page.locator('array-planner-view .verdict');
    await expect.poll(async () => (await verdict.textContent())?.replace(/\s+/g, ' '), { timeout: 30_000 })
      .toMatch(/ground state is a .* g \(.* MHz in \u03bc\) from the nearest phase boundary/);
    await screenshot(app.page, 'planner');
  });
});

describe('whole page', () => {
  it('fits a narrow window and 1280 x 800 without sideways scrolling, every view', async () => {
    for (const [w, h] of [[420, 900], [1280, 800]]) {
      await app.page.setViewportSize({ width: w, height: h });
      for (const view of ['atlas', 'staircase', 'modes', 'correlated', 'planner']) {
        await open(`?view=${view}`);
        await app.page.locator('atlas-app').waitFor();
        await app.page.waitForTimeout(300);
        const scroll = await app.page.evaluate(() => document.documentElement.scrollWidth);
        expect(scroll, `${view} at ${w} px`).toBeLessThanOrEqual(w);
      }
      if (w === 420) {
        await open('?view=atlas');
        await waitForScan(app.page, 'done', 90_000);
        await screenshot(app.page, 'atlas-narrow');
      }
    }
  });

  it('no console errors', () => {
    expect(app.browser.errors).toEqual([]);
  });
});
