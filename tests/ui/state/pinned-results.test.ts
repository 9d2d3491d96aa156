/**
 * Pins: the legend's words for a pinned model name the entries it was computed at and leave
 * out those its axes set (what a reader needs to tell two maps apart; common practice, no
 * source), and the store tells its views when a pin changes.
 */
import { describe, it, expect } from 'vitest';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { PinStore, pinLabel } from '../../../src/ui/state/pinned-results.ts';

describe('pinned results', () => {
  it('names the model entries the axes do not set', () => {
    const m = demoState().model; // chain, vdw, Rb 1.5, detuning 3, mu 1, T 0, Mmax 12
    expect(pinLabel(m, ['mu', 'rb'])).toBe('chain, vdw, \u03b4 = 3, T = 0, Mmax = 12');
    expect(pinLabel(m, ['mu'])).toBe('chain, vdw, Rb = 1.5, \u03b4 = 3, T = 0, Mmax = 12');
    // an rb axis also hides V1 (the same strength), a mu axis the density
    expect(pinLabel({ ...m, strength: 'v1', v1: '40', pump: 'density' }, ['rb', 'mu'])).toBe('chain, vdw, \u03b4 = 3, T = 0, Mmax = 12');
    expect(pinLabel({ ...m, interaction: 'softcore', range: '3' }, ['detuning', 'temperature'])).toBe('chain, softcore, V\u2080 = 4, Rc = 1.5, r max = 3, \u03bc = 1, Mmax = 12');
  });

  it('signals each pin and unpin', () => {
    const store = new PinStore();
    let n = 0;
    store.addEventListener('change', () => n++);
    store.pinStaircase({ label: 'x', series: [] });
    store.pinStaircase(null);
    store.pinMap(null);
    expect(n).toBe(3);
    expect(store.staircase).toBeNull();
  });
});
