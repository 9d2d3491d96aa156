/**
 * The physics core is pure (common practice for this project, no source): no DOM, no Node
 * types (src/core/tsconfig.json has neither lib), and beyond what the compiler checks, no
 * asynchronous scheduling, timers, clocks or unseeded randomness, and no imports from the
 * worker, CLI or page layers. This reads every core file and fails naming the offender.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../src/core', import.meta.url));

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
  [/from\s+['"][^'"]*\/(workers|cli|ui)\//, 'an import from an outer layer'],
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
