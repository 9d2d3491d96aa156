/**
 * The physics core is pure (common practice for this project, no source): no DOM, no Node
 * types (src/core/tsconfig.json has neither lib), and beyond what the compiler checks, no
 * asynchronous scheduling, timers, clocks or unseeded randomness, and no imports from the
 * output formats, worker, CLI or page layers. This reads every core file and fails naming
 * the offender. The output formats (src/formats: the map's columns, CSV text), shared by
 * the page and the CLI, are held to the same rules, with the core as their only import.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../src/core', import.meta.url));
const formats = fileURLToPath(new URL('../../src/formats', import.meta.url));

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

const FORBIDDEN: [RegExp, string][] = [
  [/\basync\b|\bawait\b|\bPromise\b/, 'asynchronous code (drivers belong in workers/)'],
  [/\bsetTimeout\b|\bsetInterval\b|\bperformance\.now\b|\bDate\.now\b/, 'timers or clocks'],
  [/\bMath\.random\b/, 'unseeded randomness'],
  [/from\s+['"][^'"]*\/(workers|cli|ui|formats)\//, 'an import from an outer layer'],
];

/** The rules broken by the files under dir, as "file: rule". */
function offences(dir: string, rules: readonly [RegExp, string][]): string[] {
  const out: string[] = [];
  for (const f of files(dir)) {
    const code = readFileSync(f, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
    for (const [re, what] of rules) if (re.test(code)) out.push(`${f.slice(dir.length + 1)}: ${what}`);
  }
  return out;
}

describe('src/core stays pure', () => {
  it('no core file schedules work, reads clocks, draws unseeded numbers or imports outer layers', () => {
    expect(files(root).length).toBeGreaterThan(50);
    expect(offences(root, FORBIDDEN)).toEqual([]);
  });
});

describe('src/formats stays pure', () => {
  it('no format file schedules work, reads clocks, draws unseeded numbers or imports the worker, CLI or page layers', () => {
    expect(files(formats).length).toBeGreaterThan(1);
    const outer: [RegExp, string] = [/from\s+['"][^'"]*\/(workers|cli|ui)\//, 'an import from an outer layer'];
    expect(offences(formats, [...FORBIDDEN.slice(0, 3), outer])).toEqual([]);
  });
});
