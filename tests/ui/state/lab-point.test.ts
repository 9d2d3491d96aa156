/**
 * The lab point in the page state: stored as strings and read back, its box test, and the
 * re-centring of axes on it. Expected ranges are worked out by hand in the comments
 * (arithmetic on short decimals, compared to 1e-12); the point itself comes from the
 * closed-form case of tests/core/lab/operating-point.test.ts (C6/h = 64 GHz um^6,
 * 2g = 1000 MHz: Rb = 2 um).
 */
import { describe, it, expect } from 'vitest';
import { operatingPoint } from '../../../src/core/lab/operating-point.ts';
import { parseAxis, parseRange } from '../../../src/core/scan/axes.ts';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { decodeState, encodeState } from '../../../src/ui/state/url-codec.ts';
import { clearLabPoint, insideBox, labOnAxis, readLabPoint, recentredRange, useLabPoint } from '../../../src/ui/state/lab-point.ts';

const TOL = 1e-12;
// a = 1 +- 0.01 um, Delta = 1500 +- 50 MHz, mu = 250 +- 10 MHz: Rb/a = 2 +- 0.02, V1 = 128 +- 7.68, delta = 3 +- 0.1, mu = 0.5 +- 0.02
const POINT = operatingPoint(
  { c6GHzUm6: 64, spacingUm: 1, coupling: { kind: 'collective', splittingMHz: 1000 }, detuningMHz: 1500, muMHz: 250, temperatureK: 0 },
  { spacingUm: 0.01, detuningMHz: 50, muMHz: 10 },
);

/** start, stop, count of a range text. */
const ends = (t: string | null) => {
  if (t === null) return null;
  const r = parseRange(t, 'test');
  return [r.start, r.stop, r.count];
};
const close = (got: number[] | null, want: number[]) => {
  expect(got).not.toBeNull();
  got!.forEach((v, i) => expect(Math.abs(v - want[i])).toBeLessThan(TOL * Math.max(1, Math.abs(want[i]))));
};

describe('re-centring a range on the point', () => {
  it('leaves a range holding the box alone', () => {
    expect(recentredRange({ start: -1, stop: 2.9, count: 64 }, { value: 0.5, sigma: 0.02 })).toBeNull();
  });

  it('keeps the span, centred on the value', () => {
    // span 1 around 3: 2.5 .. 3.5
    close(ends(recentredRange({ start: 0, stop: 1, count: 11 }, { value: 3, sigma: 0.1 })), [2.5, 3.5, 11]);
    // a falling range stays falling: 3.5 .. 2.5
    close(ends(recentredRange({ start: 1, stop: 0, count: 11 }, { value: 3, sigma: 0.1 })), [3.5, 2.5, 11]);
  });

  it('widens to 1.25 times the box when the box is wider than the span', () => {
    // half-width max(0.5, 1.25 * 2) = 2.5 around 5: 2.5 .. 7.5
    close(ends(recentredRange({ start: 0, stop: 1, count: 5 }, { value: 5, sigma: 2 })), [2.5, 7.5, 5]);
  });

  it('stays below the detuning on a mu range', () => {
    // value 2.8 +- 0.2 past 2.9; span 3.9: 0.85 .. 4.75 reaches delta = 3, so the top is
    // delta - 2% of the span = 3 - 0.078 = 2.922 and the bottom 2.922 - 3.9 = -0.978
    close(ends(recentredRange({ start: -1, stop: 2.9, count: 400 }, { value: 2.8, sigma: 0.2 }, { hi: 3 })), [-0.978, 2.922, 400]);
    // a range that holds the point but reaches delta = 2.9 is only pulled below it: 2.9 - 0.02 * 4.9 = 2.802 (the bottom -2 kept)
    close(ends(recentredRange({ start: -2, stop: 2.9, count: 10 }, { value: 0.5, sigma: 0.02 }, { hi: 2.9 })), [-2, 2.802, 10]);
  });

  it('stays above zero on a blockade-radius range', () => {
    // 0.3 +- 0.05 below 0.8 .. 2.4 (span 1.6): -0.5 .. 1.1 crosses 0, so the bottom is 2% of the span, 0.032, and the top 0.032 + 1.6 = 1.632
    close(ends(recentredRange({ start: 0.8, stop: 2.4, count: 40 }, { value: 0.3, sigma: 0.05 }, { lo: 0, loOpen: true })), [0.032, 1.632, 40]);
  });
});

describe('the stored point', () => {
  it('survives the URL and reads back as numbers', () => {
    const s = useLabPoint(demoState(), {}, POINT);
    const back = readLabPoint(decodeState(encodeState(s)).lab)!;
    expect(back.rb.value).toBeCloseTo(2, 12);
    expect(back.rb.sigma).toBeCloseTo(0.02, 12);
    expect(back.v1.sigma).toBeCloseTo(7.68, 10);
    expect(back.detuning).toEqual({ value: POINT.delta.value, sigma: POINT.delta.sigma });
    expect(labOnAxis(back, 'mu')).toEqual({ value: POINT.mu.value, sigma: POINT.mu.sigma });
    expect(labOnAxis(back, 'density')).toBeNull();
    expect(readLabPoint(clearLabPoint(s).lab)).toBeNull();
    // a hand-edited link with a non-number is no point at all
    expect(readLabPoint({ ...s.lab, dmu: 'abc' })).toBeNull();
  });

  it('tells a model point inside the one-sigma box from one outside', () => {
    const p = readLabPoint(useLabPoint(demoState(), {}, POINT).lab)!;
    expect(insideBox(p, { rb: 2.019, delta: 2.95, mu: 0.51, T: 0 })).toBe(true);
    expect(insideBox(p, { rb: 2.021, delta: 3, mu: 0.5, T: 0 })).toBe(false);
    expect(insideBox(p, { v1: 128 + 7.6, delta: 3, mu: 0.5, T: 0 })).toBe(true);
    expect(insideBox(p, { rb: 2, delta: 3, T: 0 })).toBe(false);
  });
});

describe('"use these numbers"', () => {
  it('sets the model, and re-centres only the axes that miss the point', () => {
    const s = demoState();
    s.atlas.x = 'mu=-1..0.2 x12';
    s.atlas.y = 'rb=0.8..2.4 x6';
    s.staircase.mu = '2..2.5 x10';
    const next = useLabPoint(s, { rb: '2', detuning: '3', mu: '0.5' }, POINT);
    expect([next.model.rb, next.model.detuning, next.model.mu]).toEqual(['2', '3', '0.5']);
    // mu: span 1.2 around 0.5: -0.1 .. 1.1 (below delta = 3)
    const x = parseAxis(next.atlas.x, 'x');
    expect(x.name).toBe('mu');
    close([x.start, x.stop, x.count], [-0.1, 1.1, 12]);
    // rb = 2 +- 0.02 lies inside 0.8 .. 2.4: unchanged
    expect(next.atlas.y).toBe(s.atlas.y);
    // staircase: span 0.5 around 0.5: 0.25 .. 0.75
    close(ends(next.staircase.mu), [0.25, 0.75, 10]);
    // the input state is not changed
    expect(s.atlas.x).toBe('mu=-1..0.2 x12');
  });

  it('moves a detuning axis first and keeps mu below its smallest value', () => {
    const s = demoState();
    s.atlas.x = 'mu=-1..2.9 x12';
    s.atlas.y = 'detuning=5..8 x6';
    const next = useLabPoint(s, {}, POINT);
    // detuning 3 +- 0.1: span 3 around 3: 1.5 .. 4.5 (above mu = 0.5)
    const y = parseAxis(next.atlas.y, 'y');
    close([y.start, y.stop], [1.5, 4.5]);
    // mu holds 0.5 +- 0.02 but reaches 2.9 >= 1.5: the top pulled to 1.5 - 2% of 3.9 = 1.422
    const x = parseAxis(next.atlas.x, 'x');
    close([x.start, x.stop], [-1, 1.422]);
  });
});
