/**
 * `npm run -s atlas -- <command> [flags]`: the built command line (dist/cli/atlas.mjs),
 * rebuilt first when any of its sources (or the build script) is newer than the build or
 * missing, so an edit to src/ is never run stale. The check is a stat of the ~100 files the
 * last build listed in dist/cli/inputs.json (a few milliseconds); the build, when needed,
 * takes a fraction of a second. `node dist/cli/atlas.mjs ...` skips the check.
 */
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const dist = join(root, 'dist', 'cli');
const BUILT = ['atlas.mjs', 'engine-worker-node.mjs'];

function fresh() {
  try {
    const inputs = JSON.parse(readFileSync(join(dist, 'inputs.json'), 'utf8'));
    const builtAt = Math.min(...BUILT.map((f) => statSync(join(dist, f)).mtimeMs));
    return [...inputs, 'scripts/build-cli.mjs'].every((f) => statSync(join(root, f)).mtimeMs <= builtAt);
  } catch {
    return false; // no build yet, or a source was removed
  }
}

if (!fresh()) {
  const { buildCli } = await import('./build-cli.mjs');
  try {
    await buildCli({ quiet: true });
  } catch (e) {
    process.stderr.write(`atlas: cannot build the command line: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}\n`);
    process.exit(1);
  }
}
await import(pathToFileURL(join(dist, 'atlas.mjs')).href);
