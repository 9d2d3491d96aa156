/**
 * Build the app with Vite into test-output/dist (the production bundle the tests
 * serve), in a child process so the test runner's own Vite instance is not disturbed.
 */
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { join } from 'node:path';

const run = promisify(execFile);

export const ROOT = join(import.meta.dirname, '..', '..', '..');
export const OUTPUT = join(ROOT, 'test-output');

/** Build and return the output directory. */
export async function buildApp(outDir = join(OUTPUT, 'dist')): Promise<string> {
  await run(join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'],
    { cwd: ROOT, timeout: 120_000 });
  return outDir;
}
