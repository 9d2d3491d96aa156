/**
 * Small helpers for driving the explorer page in the browser tests: open a view, wait
 * for the map, point the mouse at a data coordinate of a figure, save a download,
 * take a named screenshot, run the project's CLI for comparison.
 */
import type { Page } from 'playwright-core';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { mkdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { OUTPUT, ROOT } from './build-app.ts';

const run = promisify(execFile);

export const SCREENSHOTS = join(OUTPUT, 'screenshots');

/** Wait until the atlas view's scan reports `status` (done, running, ...). */
export async function waitForScan(page: Page, status: string, timeout = 60_000): Promise<void> {
  await page.locator(`phase-atlas-view[data-scan="${status}"]`).waitFor({ state: 'attached', timeout });
}

/** Number attribute of the atlas view (points, started, cancelled). */
export async function scanNumber(page: Page, name: 'points' | 'started' | 'cancelled'): Promise<number> {
  return Number(await page.locator('phase-atlas-view').getAttribute(`data-${name}`));
}

/** Move the mouse to data point (x, y) of the figure panel matched by `selector`. */
export async function pointAt(page: Page, selector: string, x: number, y: number): Promise<{ x: number; y: number }> {
  const p = await page.locator(selector).evaluate(
    (el, [dx, dy]) => (el as unknown as { dataToClient(x: number, y: number): { x: number; y: number } | null }).dataToClient(dx, dy),
    [x, y] as [number, number]);
  if (!p) throw new Error(`no figure in ${selector}`);
  await page.mouse.move(p.x, p.y);
  return p;
}

/** Click a button and read back the file it downloads. */
export async function download(page: Page, click: () => Promise<void>): Promise<{ name: string; text: string }> {
  const [d] = await Promise.all([page.waitForEvent('download', { timeout: 20_000 }), click()]);
  const path = await d.path();
  return { name: d.suggestedFilename(), text: await readFile(path, 'utf8') };
}

/** Screenshot of the page under test-output/screenshots/<name>.png. */
export async function screenshot(page: Page, name: string): Promise<string> {
  await mkdir(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name}.png`);
  // from the top, so the sticky model form sits where a reader expects it
  await page.evaluate('window.scrollTo(0, 0)');
  await page.screenshot({ path, fullPage: true });
  return path;
}

/**
 * Run the CLI line the page offers under "copy as command" (npm run -s atlas -- ...)
 * directly with tsx (what the npm script runs), returning stdout.
 */
export async function runCliLine(line: string, timeout = 120_000): Promise<string> {
  const words = splitShell(line);
  const at = words.indexOf('--');
  if (words.slice(0, 4).join(' ') !== 'npm run -s atlas' || at < 0) throw new Error(`not an atlas command line: ${line}`);
  const { stdout } = await run(join(ROOT, 'node_modules', '.bin', 'tsx'), [join(ROOT, 'src', 'cli', 'main.ts'), ...words.slice(at + 1)],
    { cwd: ROOT, timeout, maxBuffer: 64 << 20 });
  return stdout;
}

/** Split a POSIX shell line with single quotes (the only quoting the page writes). */
export function splitShell(line: string): string[] {
  const out: string[] = [];
  const re = /'((?:[^']|'\\'')*)'|(\S+)/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(line))) out.push(m[1] !== undefined ? m[1].replace(/'\\''/g, "'") : m[2]);
  return out;
}
