/**
 * The page's quantum Monte Carlo in real Chromium (the harness of the other browser test
 * files, harness/app-session.ts, with a build folder of its own, test-output/dist-qmc):
 * QMC in the correlated check on a tiny ring, against the engine's own command line for the
 * command the page offers; and a tiny "check this boundary" on the phase atlas, whose
 * Binder-crossing marker must be drawn on the map. Sizes and sweeps are tiny so each takes
 * seconds; the numbers checked are the run's own, not stored ones.
 */
import { describe, it, expect } from 'vitest';
import { join } from 'node:path';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { expectRel } from '../references.ts';
import { useApp } from './harness/app-session.ts';
import { download, pointAt, runCliLine, screenshot } from './harness/page-tools.ts';

const app = useApp('dist-qmc');

async function open(query: string) {
  await app.page.goto(app.url);
  await app.page.evaluate(() => localStorage.clear());
  await app.page.goto(app.url + query);
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
    await app.page.locator('correlated-view[data-status="complete"][data-method="qmc"]').waitFor({ state: 'attached', timeout: 60_000 });
    const row = (label: string) => app.page.locator('correlated-view table.comparison tr', { hasText: label }).locator('td').first().textContent();
    const [n, dn] = valueError((await row('emitter density')) ?? '');
    // a density with a real, nonzero Monte Carlo error bar, well inside (0, 1) at mu = V1/2
    expect(n).toBeGreaterThan(0.05);
    expect(n).toBeLessThan(0.95);
    expect(dn).toBeGreaterThan(0);
    expect(dn).toBeLessThan(0.05);
    const [u, du] = valueError((await row('Binder')) ?? '');
    expect(Number.isFinite(u) && du > 0).toBe(true);

    const { text } = await download(app.page, () => app.page.locator('correlated-view data-export button', { hasText: 'JSON' }).click());
    const mine = JSON.parse(text);
    expect(mine.method).toBe('qmc');
    expect(mine.sites).toBe(6);
    expect(mine.temperature).toBe(0.5);
    // the table shows the exported number, rounded to the second significant digit of its error
    expect(Math.abs(mine.density.value - n)).toBeLessThan(dn / 5);
    expectRel(mine.density.error, dn, 0.05);
    // S(k) as points with error bars at the 6 momenta of the ring, C(r) at its 3 distances, f(alpha) on its grid
    expect(await app.page.locator('correlated-view figure-panel.sk svg .error-bars circle').count()).toBe(mine.structureFactor.length);
    expect(mine.structureFactor.length).toBe(6);
    expect(await app.page.locator('correlated-view figure-panel.cr svg .error-bars circle').count()).toBe(mine.correlation.length);
    expect(await app.page.locator('correlated-view figure-panel.qmc-f svg .error-bars circle').count()).toBeGreaterThanOrEqual(4);
    expect(await app.page.locator('correlated-view figure-panel.sk svg').textContent()).toContain('connected');

    // the command the page offers gives the same numbers (same seed and chains; V8 in both,
    // 1e-12 relative allows a last-bit difference of Math.exp between Chromium and Node)
    const command = (await app.page.locator('correlated-view data-export code.command').textContent()) ?? '';
    expect(command).toContain('qmc');
    const cli = JSON.parse(await runCliLine(command));
    expectRel(mine.energyPerSite.value, cli.energyPerSite.value, 1e-12);
    expectRel(mine.density.value, cli.density.value, 1e-12);
    expectRel(mine.alpha.value + 1, cli.alpha.value + 1, 1e-12);
    await screenshot(app.page, 'correlated-qmc');
  });
});

describe('QMC on an uploaded array', () => {
  it('runs on a CSV array and shades each site by its own <n_i> with an error', async () => {
    // an invented 5-site open chain with one site pushed close to its neighbour (units of a)
    const dir = await mkdtemp(join(tmpdir(), 'atlas-qmc-sites-'));
    const csv = join(dir, 'five.csv');
    await writeFile(csv, 'x,y\n0,0\n1,0\n2,0\n2.8,0\n4,0\n');
    await open('?view=correlated&lattice=chain&interaction=nn&strength=v1&v1=1&mu=0.5&detuning=2'
      + '&correlated.method=qmc&correlated.cluster=array&correlated.alpha=0.2&correlated.temperature=0.5&correlated.sweeps=256&correlated.chains=2');
    await app.page.locator('correlated-view input[type="file"]').setInputFiles(csv);
    await app.page.locator('correlated-view[data-status="complete"][data-method="qmc"]').waitFor({ state: 'attached', timeout: 60_000 });
    const { text } = await download(app.page, () => app.page.locator('correlated-view data-export button', { hasText: 'JSON' }).click());
    const r = JSON.parse(text);
    expect(r.sites).toBe(5);
    expect(r.clusterKind).toBe('array');
    expect(r.siteDensities.length).toBe(5);
    for (const d of r.siteDensities) { expect(d.value).toBeGreaterThan(0); expect(d.value).toBeLessThan(1); expect(d.error).toBeGreaterThan(0); }
    // the site densities average to the density within its error (3 sigma: Monte Carlo; the two
    // are different estimators of the same samples, so they need not agree to rounding)
    const mean = r.siteDensities.reduce((a: number, d: { value: number }) => a + d.value, 0) / 5;
    expect(Math.abs(mean - r.density.value)).toBeLessThan(3 * r.density.error);
    // each site drawn with its own density in its tooltip
    const titles = await app.page.locator('correlated-view figure-panel.cluster svg circle title').allTextContents();
    expect(titles.length).toBe(5);
    titles.forEach((t, i) => expect(t).toContain(`<n> = ${r.siteDensities[i].value.toFixed(4)}`));
    await rm(dir, { recursive: true, force: true });
  });
});

describe('check this boundary', () => {
  it('picks a line on the map (arrow keys and Enter, then a click), runs the QMC line scan and draws the Binder crossing on the map', async () => {
    // square lattice, nearest neighbours V1 = 1, half filling mu = 2 V1, cavity far detuned (alpha = 0):
    // the classical Ising point; mean field puts the density-wave melting at T = z V1 / 4 = 1, the exact
    // value is Onsager's 0.567 (Onsager 1944). A tiny map over T and mu, and a line along T at mu = 2.
    await open('?view=atlas&lattice=square&interaction=nn&strength=v1&v1=1&v2=0&detuning=10&mu=2&temperature=0.5&max-cell=2'
      + '&atlas.x=temperature=0.2:1.4:7&atlas.y=mu=1.5:2.5:3&atlas.lines=&atlas.sizes=4,8&atlas.cpoints=6&atlas.csweeps=400');
    await app.page.locator('phase-atlas-view[data-scan="done"]').waitFor({ state: 'attached', timeout: 60_000 });
    await app.page.locator('boundary-check-panel button.pick').click();
    const click = async (x: number, y: number) => {
      const p = await pointAt(app.page, 'figure-panel.map', x, y);
      await app.page.mouse.click(p.x, p.y);
    };
    // the first end from the keyboard: the map's key cursor starts at the centre of the plot
    // (T = 0.8, mu = 2.0) and moves by one grid step (0.2 in T) per arrow; Enter picks
    await app.page.locator('figure-panel.map .host').focus();
    await app.page.keyboard.press('ArrowLeft');
    await app.page.keyboard.press('ArrowLeft');
    await app.page.keyboard.press('Enter');
    await expect.poll(() => app.page.locator('figure-panel.map svg .boundary-check circle').count()).toBe(1);
    // the second with the mouse
    await click(1.2, 2.0);
    const ends = await app.page.locator('boundary-check-panel input[name="atlas-check"]').inputValue();
    const [[x0, y0], [x1, y1]] = ends.split(';').map((p) => p.split(',').map(Number));
    // the key cursor's end is exact; the click lands within a pixel of its data point (~900 px for 1.4 units of T)
    expect(x0).toBe(0.4);
    expect(y0).toBe(2);
    expect(Math.abs(x1 - 1.2)).toBeLessThan(0.01);
    expect(Math.abs(y1 - 2)).toBeLessThan(0.02);
    await app.page.locator('boundary-check-panel[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    const n = Number(await app.page.locator('boundary-check-panel').getAttribute('data-crossings'));
    expect(n).toBeGreaterThanOrEqual(1);
    // every crossing is drawn on the map, on the line (mu held at the first end's value), inside its ends
    const markers = app.page.locator('figure-panel.map svg .boundary-check .crossing-marker');
    expect(await markers.count()).toBe(n);
    const at = await markers.evaluateAll((ms) => ms.map((m) => [Number(m.getAttribute('data-x')), Number(m.getAttribute('data-y'))]));
    for (const [x, y] of at) {
      expect(x).toBeGreaterThan(x0);
      expect(x).toBeLessThan(x1);
      expect(y).toBe(y0);
    }
    // the Binder figure: one point with an error bar per run (2 sizes x 6 points from T = 0.4 to 1.2)
    expect(await app.page.locator('boundary-check-panel figure-panel.binder svg .error-bars circle').count()).toBe(12);
    // exported at one column (3.4 in = 326.4 px) it is laid out again at that width, every run still drawn
    const printed = await app.page.locator('boundary-check-panel figure-panel.binder').evaluate((el) => {
      const f = (el as unknown as { figure: { layout?: (w: number, h: number) => { frame: { width: number }; svg: string } } }).figure;
      const again = f.layout?.(326.4, 250);
      return again ? { width: again.frame.width, bars: (again.svg.match(/<circle/g) ?? []).length } : null;
    });
    expect(printed?.width).toBe(326.4);
    expect(printed?.bars).toBeGreaterThanOrEqual(12);
    // mean field: the order vanishes continuously at T_c = z V1/4 = 1, so the map's T = 0.8 is ordered
    // and T = 1.0 already normal: the boundary read off the grid is 0.9 +- 0.1
    const verdict = (await app.page.locator('boundary-check-panel .verdict').textContent()) ?? '';
    expect(verdict).toMatch(/mean field: T = 0\.9 \u00b1 0\.1 \(density-wave 1\/2 \u2192 normal/);
    expect(verdict).toMatch(/Mean field is off by|ambiguous/);
    await screenshot(app.page, 'atlas-boundary-check');
  });
});
