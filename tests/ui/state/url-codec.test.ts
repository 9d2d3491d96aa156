/**
 * The URL holds the whole state: encode then decode gives the state back exactly, entries
 * the query leaves out take the demo value, unknown entries are ignored (round-trip
 * invariant, common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { decodeState, encodeState, queryHasState } from '../../../src/ui/state/url-codec.ts';

describe('URL state', () => {
  it('round-trips every entry, including characters that need escaping', () => {
    const s = demoState();
    s.view = 'correlated';
    s.model.mu = '-0.25';
    s.atlas.x = 'detuning=2:4:30';
    s.atlas.lines = 'nn,vdw:2';
    s.correlated.sites = '0,0;1.5,0;3,0.25';
    s.planner.tunit = 'mK';
    expect(decodeState(encodeState(s))).toEqual(s);
  });

  it('fills what is missing from the demo and ignores what it does not know', () => {
    const s = decodeState('?view=staircase&rb=2&nonsense=1&atlas.bogus=3');
    const d = demoState();
    expect(s.view).toBe('staircase');
    expect(s.model.rb).toBe('2');
    expect({ ...s, view: d.view, model: { ...s.model, rb: d.model.rb } }).toEqual(d);
    expect(queryHasState('?foo=1')).toBe(false);
    expect(queryHasState('?lattice=square')).toBe(true);
  });
});
