/**
 * The set-up every browser test file shares: before its tests, build the app into a folder
 * of the file's own under test-output (browser test files build at the same time in
 * parallel workers, so a shared folder would clash), serve it on 127.0.0.1 and launch
 * Chromium with one page; after them, close the browser and the server. Call useApp at
 * the top level of a test file; a beforeAll the file registers after it runs once the app
 * is up.
 */
import { beforeAll, afterAll } from 'vitest';
import type { Page } from 'playwright-core';
import { join } from 'node:path';
import { OUTPUT, buildApp } from './build-app.ts';
import { serveStatic, type StaticServer } from './static-server.ts';
import { launchChromium, type Browser } from './launch-chromium.ts';

/** Time for the build (up to 120 s), the server and Chromium's launch (up to 60 s). */
export const APP_HOOK_TIMEOUT = 240_000;

export interface AppSession {
  readonly server: StaticServer;
  readonly browser: Browser;
  /** The browser's first page. */
  readonly page: Page;
  /** The served app's address (ends in '/'). */
  readonly url: string;
}

/**
 * Register the hooks that build the app into test-output/<folder>, serve it and launch
 * Chromium at `viewport`; the returned session's getters are valid once they have run.
 */
export function useApp(folder: string, viewport = { width: 1280, height: 800 }): AppSession {
  let server: StaticServer | undefined;
  let browser: Browser | undefined;
  beforeAll(async () => {
    server = await serveStatic(await buildApp(join(OUTPUT, folder)));
    browser = await launchChromium(viewport);
  }, APP_HOOK_TIMEOUT);
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });
  const ready = <T>(value: T | undefined): T => {
    if (value === undefined) throw new Error(`useApp('${folder}'): the app is not up (used outside the tests, or its set-up failed)`);
    return value;
  };
  return {
    get server() { return ready(server); },
    get browser() { return ready(browser); },
    get page() { return ready(browser).page; },
    get url() { return ready(server).url; },
  };
}
