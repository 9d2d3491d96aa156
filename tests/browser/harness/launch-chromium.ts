/**
 * Debian's Chromium (/usr/bin/chromium) driven headless by playwright-core, with a fresh
 * profile per launch, no network services of its own, and no GPU. Console errors and
 * uncaught page errors are collected for the "no console errors" check.
 */
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const CHROMIUM = '/usr/bin/chromium';

export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

export interface Browser {
  context: BrowserContext;
  page: Page;
  /** Console errors and page errors seen so far. */
  errors: string[];
  close(): Promise<void>;
}

/** Launch with a fresh profile and one page of the given viewport. */
export async function launchChromium(viewport = { width: 1280, height: 800 }): Promise<Browser> {
  const profile = await mkdtemp(join(tmpdir(), 'atlas-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport, timeout: 60_000,
    acceptDownloads: true,
  });
  const errors: string[] = [];
  const watch = (p: Page) => {
    p.on('console', (m) => { if (m.type() === 'error') errors.push(`console: ${m.text()}`); });
    p.on('pageerror', (e) => errors.push(`page: ${e.message}`));
  };
  context.pages().forEach(watch);
  context.on('page', watch);
  const page = context.pages()[0] ?? await context.newPage();
  return {
    context, page, errors,
    async close() {
      await context.close().catch(() => undefined);
      await rm(profile, { recursive: true, force: true }).catch(() => undefined);
    },
  };
}
