/**
 * Build the command line into plain JavaScript: dist/cli/atlas.mjs (src/cli/main.ts) and
 * dist/cli/engine-worker-node.mjs (the worker thread it spawns), each one self-contained ES
 * module with the npm dependencies it uses (comlink, ml-matrix, seedrandom) bundled in: one
 * file to read and no module resolution at start, which is what makes `--help` cost about
 * as much as `node -e 0` (importing the dependencies from node_modules added ~60 ms). Run by `npm install`/`npm ci` (the prepare script, also under --omit=dev:
 * esbuild is a runtime dependency for that reason) and by scripts/atlas.mjs when a source
 * is newer than the build. Each file is written beside its target and renamed over it, so
 * two builds at once (a job array starting) never leave a torn file.
 *
 *   node scripts/build-cli.mjs            build
 *   node scripts/build-cli.mjs --quiet    no line on stderr
 */
import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
export const OUT_DIR = join(root, 'dist', 'cli');
/** Built file -> source entry. */
export const ENTRIES = {
  'atlas.mjs': 'src/cli/main.ts',
  'engine-worker-node.mjs': 'workers/engine-worker-node.ts',
};
/** Every source file of the last build, for the staleness check (scripts/atlas.mjs). */
export const INPUTS_FILE = join(OUT_DIR, 'inputs.json');

/** Build both files; resolves with the list of source files they were built from. */
export async function buildCli({ quiet = false } = {}) {
  const t0 = performance.now();
  const { build } = await import('esbuild');
  mkdirSync(OUT_DIR, { recursive: true });
  const inputs = new Set();
  for (const [out, entry] of Object.entries(ENTRIES)) {
    const target = join(OUT_DIR, out);
    const result = await build({
      entryPoints: [join(root, entry)],
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      sourcemap: 'linked',
      metafile: true,
      write: false,
      outfile: target,
      logLevel: 'warning',
      // seedrandom is CommonJS and may require('crypto'): give the ES module a require
      banner: {
        js: `// Built by scripts/build-cli.mjs from ${entry}: edit the TypeScript, not this file.\n` +
          `import { createRequire as __atlasRequire } from 'node:module'; const require = __atlasRequire(import.meta.url);`,
      },
    });
    for (const f of Object.keys(result.metafile.inputs)) inputs.add(relative(root, join(root, f)));
    // the .map first, so a file never points at a map that is not there yet
    for (const file of [...result.outputFiles].sort((a, b) => Number(b.path.endsWith('.map')) - Number(a.path.endsWith('.map')))) {
      const tmp = `${file.path}.${process.pid}.tmp`;
      writeFileSync(tmp, file.contents);
      renameSync(tmp, file.path);
    }
  }
  const list = [...inputs].sort();
  const tmp = `${INPUTS_FILE}.${process.pid}.tmp`;
  writeFileSync(tmp, JSON.stringify(list) + '\n');
  renameSync(tmp, INPUTS_FILE);
  if (!quiet) process.stderr.write(`built ${relative(root, OUT_DIR)}/ from ${list.length} sources in ${((performance.now() - t0) / 1000).toFixed(2)} s\n`);
  return list;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  try {
    await buildCli({ quiet: process.argv.includes('--quiet') });
  } catch (e) {
    rmSync(INPUTS_FILE, { force: true }); // the next run rebuilds
    process.stderr.write(`build-cli: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exit(1);
  }
}
