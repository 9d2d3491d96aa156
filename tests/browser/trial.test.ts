/**
 * The explorer tried as a physicist at the bench tries it (issue 11), in real Chromium:
 * the planner's collective splitting and losses (items 13, 14), the smaller points of
 * item 19 (the point detail in view and closed by Escape, fields set by an axis greyed
 * out, refusals in the page's words, the modes' frequency range and k*, the staircase's
 * readout, table and labels, S(k) as points, space-separated array files, term tooltips,
 * Modes at 420 px), a 2D Modes request at the demo's Mmax, and a whole trial over every
 * view with bad entries and no console error. Checks are against closed forms or against
 * what the page must show; none rests on a stored result.
 */
import { describe, it, expect } from 'vitest';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { useApp } from './harness/app-session.ts';
import { download, pointAt, runCliLine, waitForScan } from './harness/page-tools.ts';

const app = useApp('dist-trial');

/** A small map (12 x 6) so the atlas steps run in seconds. */
const SMALL = 'atlas.x=mu%3D-1%3A2.9%3A12&atlas.y=rb%3D0.8%3A2.4%3A6';

async function open(query: string) {
  await app.page.goto(app.url);
  await app.page.evaluate(() => localStorage.clear());
  await app.page.goto(app.url + query);
}

const text = async (sel: string) => ((await app.page.locator(sel).first().textContent()) ?? '').replace(/\s+/g, ' ').trim();
const num = async (sel: string) => Number(await text(sel));

describe('planner: collective splitting and losses (items 13, 14)', () => {
  it('switching to the collective splitting prefills 2 g0 sqrt(N) and keeps the verdict; a bad entry keeps the last good one', async () => {
    await open('?view=planner');
    const verdict = app.page.locator('array-planner-view .verdict');
    await expect.poll(async () => (await verdict.textContent()) ?? '', { timeout: 30_000 }).toMatch(/from the nearest phase boundary/);
    const before = await text('array-planner-view .verdict');
    // the regime counts neighbours: on the chain, the sites 0 < |n| < Rb/a, 2 floor(Rb/a) of them;
    // demo Rb = (C6 / 2g)^(1/6) with C6 = 140 GHz um^6, g = 0.5 sqrt(200) MHz, a = 4 um: Rb/a = 1.159
    const rbA = Math.pow(140e3 / (2 * 0.5 * Math.sqrt(200)), 1 / 6) / 4;
    expect(await num('array-planner-view .blockaded')).toBe(2 * Math.floor(rbA));
    expect(await text('array-planner-view .regime')).toContain('neighbours inside one blockade disc');
    expect(await text('array-planner-view label[for="lab-mu"]')).toContain('measured from the emitter line');
    const g = await num('array-planner-view .g-mhz');
    await app.page.locator('array-planner-view select[name="lab-coupling"]').selectOption('collective');
    // collective coupling g = g0 sqrt(N) (Tavis and Cummings, Phys. Rev. 170, 379 (1968)): demo g0 = 0.5 MHz, N = 200
    const splitting = Number(await app.page.locator('array-planner-view input[name="lab-splitting"]').inputValue());
    expect(Math.abs(splitting - 2 * 0.5 * Math.sqrt(200))).toBeLessThan(1e-12);
    // the same point, so the same model units and the same verdict (not blanked, not recomputed to another)
    expect(await num('array-planner-view .g-mhz')).toBe(g);
    await expect.poll(() => text('array-planner-view .verdict'), { timeout: 30_000 }).toBe(before);
    // a bad splitting: the message beside it, the last good numbers and verdict kept, marked
    await app.page.locator('array-planner-view input[name="lab-splitting"]').fill('-3');
    await expect.poll(() => app.page.locator('array-planner-view .last-good').count()).toBe(1);
    expect(await text('array-planner-view #lab-splitting-msg')).not.toBe('');
    expect(await text('array-planner-view .verdict')).toBe(before);
    expect(await num('array-planner-view .g-mhz')).toBe(g);
    await app.page.locator('array-planner-view input[name="lab-splitting"]').fill(String(splitting));
    await expect.poll(() => app.page.locator('array-planner-view .last-good').count()).toBe(0);
  });

  it('kappa, gamma and dephasing give the cooperativities and a plain verdict', async () => {
    await app.page.locator('array-planner-view select[name="lab-coupling"]').selectOption('single');
    await app.page.locator('array-planner-view input[name="lab-kappa"]').fill('1');
    await app.page.locator('array-planner-view input[name="lab-gamma"]').fill('6');
    await app.page.locator('array-planner-view input[name="lab-dephasing"]').fill('0.5');
    // C1 = 4 g0^2 / (kappa gamma) with full widths (Tanji-Suzuki et al., Adv. At. Mol. Opt. Phys. 60, 201 (2011)):
    // 4 (0.5)^2 / (1 * 6) = 1/6; C = N C1 = 200/6; shown to 4 significant digits
    await expect.poll(() => num('array-planner-view td.c1'), { timeout: 30_000 }).toBe(Number((1 / 6).toPrecision(4)));
    expect(await num('array-planner-view td.c-coll')).toBe(Number((200 / 6).toPrecision(4)));
    // 2g = 14.14 MHz against (kappa + gamma + gamma_phi)/2 = 3.75 MHz: strong coupling
    expect(await text('array-planner-view .loss-verdict')).toMatch(/^Strong coupling/);
    expect(['can apply', 'is marginal', 'does not apply']).toContain(await text('array-planner-view .loss-verdict .qe'));
    // a bad cavity: kappa = 1000 MHz is above every scale here (the polariton gap sqrt(21^2 + 14.14^2) = 25.3 MHz), and
    // 2g = 14.14 MHz < (1000 + 6.5)/2: not strong coupling, and the picture does not apply
    await app.page.locator('array-planner-view input[name="lab-kappa"]').fill('1000');
    await expect.poll(() => text('array-planner-view .loss-verdict')).toMatch(/^Not strong coupling/);
    expect(await text('array-planner-view .loss-verdict .qe')).toBe('does not apply');
    // a bad loss entry: said beside its field
    await app.page.locator('array-planner-view input[name="lab-gamma"]').fill('-1');
    await expect.poll(() => text('array-planner-view #lab-gamma-msg')).not.toBe('');
  });
});

describe('smaller points (item 19)', () => {
  it('fields an axis sets are greyed out with a note; the point detail scrolls into view and Escape closes it', async () => {
    await open(`?view=atlas&${SMALL}`);
    await waitForScan(app.page, 'done', 60_000);
    expect(await app.page.locator('model-form input[name="mu"]').isDisabled()).toBe(true);
    expect(await text('model-form [data-set-by="mu"]')).toBe('set by the x axis');
    expect(await app.page.locator('model-form input[name="rb"]').isDisabled()).toBe(true);
    expect(await text('model-form [data-set-by="rb"]')).toBe('set by the y axis');
    expect(await app.page.locator('model-form input[name="detuning"]').isDisabled()).toBe(false);
    // a supersolid point of this grid by the CLI's map of it: the readout there explains the word on hover
    const csv = (await runCliLine(`npm run -s atlas -- map --lattice chain --interaction vdw --detuning 3 --temperature 0 --max-cell 12 --x mu=-1..2.9x12 --y rb=0.8..2.4x6`))
      .trim().split('\n').filter((l) => !l.startsWith('#'));
    const cols = csv[0].split(',');
    const ss = csv.slice(1).map((l) => l.split(',')).find((r) => r[cols.indexOf('phase')] === 'supersolid');
    expect(ss, 'the CLI map holds a supersolid point').toBeTruthy();
    await pointAt(app.page, 'figure-panel.map', Number(ss![cols.indexOf('mu')]), Number(ss![cols.indexOf('rb')]));
    await expect.poll(() => app.page.locator('phase-atlas-view .readout .term[data-term="supersolid"]').count()).toBe(1);
    expect(await app.page.locator('phase-atlas-view .readout .term').getAttribute('title')).toMatch(/^Supersolid: both orders at once/);
    await app.page.locator('phase-atlas-view select[name="axis-y"]').selectOption('detuning');
    await expect.poll(() => app.page.locator('model-form input[name="detuning"]').isDisabled()).toBe(true);
    expect(await app.page.locator('model-form input[name="rb"]').isDisabled()).toBe(false);
    await app.page.locator('phase-atlas-view select[name="axis-y"]').selectOption('rb');
    await waitForScan(app.page, 'done', 60_000);
    // the map fills the first screen: the opened point lies below the fold until it is scrolled to
    expect(await app.page.evaluate(() => scrollY)).toBe(0);
    await pointAt(app.page, 'figure-panel.map', 1.5, 1.9);
    await app.page.mouse.down();
    await app.page.mouse.up();
    await app.page.locator('point-detail .phase-name').waitFor({ timeout: 20_000 });
    await expect.poll(() => app.page.locator('point-detail').evaluate((el) => el.getBoundingClientRect().top)).toBeLessThan(800 * 0.5);
    expect(await app.page.locator('point-detail').evaluate((el) => el.getBoundingClientRect().top)).toBeGreaterThanOrEqual(0);
    // the density legend is a continuous bar, and m is explained
    expect(await app.page.locator('point-detail figure-panel.pattern svg .density-bar').count()).toBe(1);
    expect(await text('point-detail .m-note')).toContain('probability');
    await app.page.keyboard.press('Escape');
    await expect.poll(() => app.page.locator('point-detail').count()).toBe(0);
  });

  it('Modes: the range follows the low branches, nothing hidden, zoom to all; k* as a multiple of pi', async () => {
    await open('?view=modes');
    await app.page.locator('modes-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    const ticks = async () => (await app.page.locator('modes-view figure-panel.branches svg .axis-y text').allTextContents()).map(Number).filter(Number.isFinite);
    const { text: json } = await download(app.page, () => app.page.locator('modes-view data-export button', { hasText: 'JSON' }).click());
    const sp = JSON.parse(json) as { branches: { omega: number[] }[] };
    const all = sp.branches.flatMap((b) => b.omega);
    const top = Math.max(...all);
    const common = Math.min(...sp.branches.map((b) => b.omega.length));
    // the demo density wave has a branch near V1 ~ 22 g far above the low ones: by default it lies off the top, and is said to
    expect(Math.max(...await ticks())).toBeLessThan(top / 2);
    expect(await text('modes-view figure-panel.branches svg .range-note')).toContain('outside the range');
    // every branch is named in the legend (coincident ones together), none left out
    const legend = (await app.page.locator('modes-view figure-panel.branches svg .legend text').allTextContents()).join(' ');
    const named = [...legend.matchAll(/\d+/g)].map((m) => Number(m[0])).filter((n) => n >= 1 && n <= common);
    expect(new Set(named).size).toBe(common);
    await app.page.locator('modes-view select[name="modes-zoom"]').selectOption('all');
    await expect.poll(async () => Math.max(...await ticks())).toBeGreaterThanOrEqual(top * 0.8);
    expect(await app.page.locator('modes-view figure-panel.branches svg .range-note').count()).toBe(0);
    await app.page.locator('modes-view select[name="modes-zoom"]').selectOption('custom');
    await app.page.locator('modes-view input[name="modes-zoom-range"]').fill('0:2');
    await expect.poll(async () => Math.max(...await ticks())).toBeLessThanOrEqual(2);
    // the uniform condensate forced at mu = 0.1, Rb = 1.2 goes soft at k* = pi (explorer.test.ts): written as pi
    await open('?view=modes&mu=0.1&rb=1.2&modes.cell=1&modes.points=65');
    await app.page.locator('modes-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    expect(await text('modes-view .kstar')).toBe('k* = \u03c0 (3.1416)');
    // term tooltips in the modes text and the form
    for (const t of ['margin', 'photon weight']) expect(await app.page.locator(`modes-view .term[data-term="${t}"]`).first().getAttribute('title')).toBeTruthy();
    for (const t of ['Mmax', 'range cut']) expect(await app.page.locator(`model-form .term[data-term="${t}"]`).first().getAttribute('title')).toBeTruthy();
  });

  it('Staircase: a readout under the pointer, the table in order of mu, labels that do not overlap', async () => {
    await open('?view=staircase');
    await app.page.locator('staircase-view[data-scan="done"]').waitFor({ state: 'attached', timeout: 90_000 });
    expect(await app.page.locator('model-form input[name="mu"]').isDisabled()).toBe(true);
    const rows = await app.page.locator('staircase-view table.plateaus').first().locator('tbody tr').evaluateAll((trs) =>
      trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim() ?? '')));
    const lows = rows.map((r) => Number(r[1].replace('\u2264', '').trim()));
    expect(lows).toEqual([...lows].sort((a, b) => a - b));
    // the readout at mu = 0.5 names the plateau whose row spans it
    await pointAt(app.page, 'staircase-view figure-panel.staircase', 0.5, 0.2);
    // the nearest scan point: within one step (3.9 / 399 g) of the pointer
    await expect.poll(async () => Math.abs(Number(/\u03bc = ([-\d.]+)/.exec(await text('staircase-view .readout'))?.[1]) - 0.5)).toBeLessThan(3.9 / 399);
    const row = rows.find((r) => Number(r[1].replace('\u2264', '')) <= 0.5 && 0.5 <= Number(r[2].replace('\u2265', '')));
    expect(row).toBeTruthy();
    expect(await text('staircase-view .readout-plateau')).toBe(row![0]);
    // no two plateau labels overlap on screen
    const boxes = await app.page.locator('staircase-view figure-panel.staircase svg .band-label').evaluateAll((ts) => ts.map((t) => t.getBoundingClientRect()).map((r) => [r.left, r.top, r.right, r.bottom]));
    expect(boxes.length).toBeGreaterThanOrEqual(3);
    for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) {
      const [a, b] = [boxes[i], boxes[j]];
      const overlap = a[0] < b[2] && b[0] < a[2] && a[1] < b[3] && b[1] < a[3];
      expect(overlap, `labels ${i} and ${j}`).toBe(false);
    }
  });

  it('S(k) drawn as connected points; a space-separated array file is read', async () => {
    await open('?view=correlated&correlated.method=ed&correlated.size=8');
    await app.page.locator('correlated-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    // an 8-site ring has 8 momenta 2 pi j / 8: one point each, no line through them
    expect(await app.page.locator('correlated-view figure-panel.sk svg .error-bars circle').count()).toBe(8);
    expect(await app.page.locator('correlated-view figure-panel.sk svg .legend').textContent()).toContain('connected');
    const dir = await mkdtemp(join(tmpdir(), 'atlas-sites-'));
    const file = join(dir, 'square.txt');
    await writeFile(file, '# x y in units of a\n0 0\n1 0\n0 1\n1 1\n');
    await app.page.locator('correlated-view select[name="correlated-cluster"]').selectOption('array');
    await app.page.locator('correlated-view input[type="file"]').setInputFiles(file);
    await expect.poll(() => app.page.locator('correlated-view figure-panel.cluster svg .dots circle').count(), { timeout: 60_000 }).toBe(4);
    await rm(dir, { recursive: true, force: true });
  });

  it('a 2D Modes request at the demo Mmax (triangular) finishes', async () => {
    await open('?view=modes&modes.points=24');
    await app.page.locator('modes-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    expect(await app.page.locator('model-form input[name="max-cell"]').inputValue()).toBe('12');
    await app.page.locator('model-form select[name="lattice"]').selectOption('triangular');
    // finishes, or says why within the view's budget (180 s): either way the view is not left computing
    await app.page.locator('modes-view[data-stale="no"]:is([data-status="complete"], [data-status="error"])').waitFor({ state: 'attached', timeout: 200_000 });
    if (await app.page.locator('modes-view[data-status="error"]').count()) expect(await text('modes-view p.err')).not.toBe('');
    else expect(await text('modes-view .kstar')).toMatch(/^k\* = \(.*, .*\)$/);
  }, 240_000);

  it('Modes at 420 px keep their axes', async () => {
    await app.page.setViewportSize({ width: 420, height: 900 });
    await open('?view=modes');
    await app.page.locator('modes-view[data-status="complete"]').waitFor({ state: 'attached', timeout: 60_000 });
    for (const fig of ['branches', 'margin']) {
      const svg = app.page.locator(`modes-view figure-panel.${fig} svg`);
      const box = (await svg.boundingBox())!;
      expect(box.x + box.width).toBeLessThanOrEqual(420);
      // both axis titles drawn whole inside the figure, and a plot area at least half the figure wide
      for (const axis of ['axis-x', 'axis-y']) {
        const t = await svg.locator(`.${axis} > text`).last().boundingBox();
        expect(t, `${fig} ${axis}`).not.toBeNull();
        expect(t!.y).toBeGreaterThanOrEqual(box.y - 0.5);
        expect(t!.y + t!.height).toBeLessThanOrEqual(box.y + box.height + 0.5);
        expect(t!.x).toBeGreaterThanOrEqual(box.x - 0.5);
      }
      const xAxis = (await svg.locator('.axis-x > line').first().boundingBox())!;
      expect(xAxis.width).toBeGreaterThan(box.width / 2);
    }
    await app.page.setViewportSize({ width: 1280, height: 800 });
  });
});

describe('whole trial', () => {
  it('every view, a few bad entries each said in the page\'s words, and back', async () => {
    await open(`?view=atlas&${SMALL}`);
    await waitForScan(app.page, 'done', 60_000);
    // bad entries: a detuning that is no number, an axis range that is no range
    await app.page.locator('model-form input[name="detuning"]').fill('three');
    await expect.poll(() => text('model-form [data-field="detuning"]')).not.toBe('');
    await app.page.locator('model-form input[name="detuning"]').fill('3');
    await app.page.locator('phase-atlas-view input[name="range-x"]').fill('from 0 to 1');
    await expect.poll(() => text('phase-atlas-view #ax-x-msg')).not.toBe('');
    await app.page.locator('phase-atlas-view input[name="range-x"]').fill('-1:2.9:12');
    await waitForScan(app.page, 'done', 60_000);
    const messages: string[] = [];
    for (const [view, sel, bad, msg] of [
      ['staircase', 'staircase-view input[name="staircase-mu"]', '-1:5:50', 'staircase-view #st-mu-msg'],
      ['modes', 'modes-view input[name="modes-points"]', '1', 'modes-view p.err'],
      ['correlated', 'correlated-view input[name="correlated-size"]', '-3', 'correlated-view p.err'],
      ['planner', 'array-planner-view input[name="lab-spacing"]', '0', 'array-planner-view #lab-spacing-msg'],
    ] as const) {
      await app.page.locator(`#tab-${view}`).click();
      await app.page.locator(sel).waitFor();
      const good = await app.page.locator(sel).inputValue();
      await app.page.locator(sel).fill(bad);
      await expect.poll(() => text(msg), { timeout: 20_000 }).not.toBe('');
      messages.push(await text(msg));
      await app.page.locator(sel).fill(good);
    }
    // the page's words: no command-line flag in any message
    for (const m of messages) expect(m, m).not.toMatch(/(^|\s)--[a-z]/);
    await app.page.locator('#tab-atlas').click();
    await waitForScan(app.page, 'done', 10_000);
  }, 180_000);

  it('no console errors over the whole trial', () => {
    expect(app.browser.errors).toEqual([]);
  });
});
