import { describe, expect, it } from 'vitest';
import { runFuzz, summary } from './fuzz-driver.ts';

/**
 * Issue 10, "No hangs, anywhere": random valid and invalid inputs for the core's entry points
 * (fuzz-inputs.ts), each in a worker thread with a watchdog (fuzz-driver.ts). Every call must
 * end with an answer or a clean refusal: an InputError, or a ConvergenceError that names a
 * numerical limit. No hang (20 s budget a case; the slowest take ~2 s), no other exception,
 * no NaN, and where physics gives the answer (no interaction, fuzz-case.ts) the right one.
 * The longer run is `npm run bench -- fuzz`.
 */
describe('fuzz of the physics core', () => {
  it('400 seeded inputs: answers or clean refusals, closed forms where they apply, nothing hangs', async () => {
    const r = await runFuzz({ seed: 20261202, count: 400, quick: true, budgetMs: 20000 });
    console.log(summary(r));
    for (const f of r.failures) console.log(`case ${f.i} ${f.verdict}: ${f.note}\n  ${JSON.stringify(f.input)}`);
    expect(r.tried).toBe(400);
    expect(r.counts.hung).toBe(0);
    expect(r.counts.crash).toBe(0);
    expect(r.counts.wrong).toBe(0);
    // The stream must exercise both sides: real answers checked against closed forms, and refusals.
    expect(r.checked).toBeGreaterThan(50);
    expect(r.counts.refused).toBeGreaterThan(20);
  }, 120_000);
});
