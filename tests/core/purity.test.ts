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

describe('src/core stays pure', () => {
  it('no core file schedules work, reads clocks, draws unseeded numbers or imports outer layers', () => {
    const all = files(root);
    expect(all.length).toBeGreaterThan(50);
    const offences: string[] = [];
    for (const f of all) {
      const code = readFileSync(f, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
      for (const [re, what] of FORBIDDEN) if (re.test(code)) offences.push(`${f.slice(root.length + 1)}: ${what}`);
    }
    expect(offences).toEqual([]);
  });
});

describe('src/formats stays pure', () => {
  it('no format file schedules work, reads clocks, draws unseeded numbers or imports the worker, CLI or page layers', () => {
    const all = files(formats);
    expect(all.length).toBeGreaterThan(1);
    const offences: string[] = [];
    for (const f of all) {
      const code = readFileSync(f, 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
      for (const [re, what] of FORBIDDEN.slice(0, 3)) if (re.test(code)) offences.push(`${f.slice(formats.length + 1)}: ${what}`);
      if (/from\s+['"][^'"]*\/(workers|cli|ui)\//.test(code)) offences.push(`${f.slice(formats.length + 1)}: an import from an outer layer`);
    }
    expect(offences).toEqual([]);
  });
});
