// "Check this boundary" helpers (src/ui/model/boundary-check-line.ts, boundary-check-request.ts,
// src/ui/figures/boundary-check-overlay.ts): the picked line, its snapping, the scan request
// against the CLI's own parsing of the command the page offers, and the marker drawn on the map.
import { describe, it, expect } from 'vitest';
import { addPick, checkLine, labelChanges, lineToMap, parseCheckEnds } from '../../../src/ui/model/boundary-check-line.ts';
import { CHECK_RUN, checkCommand, checkRequest } from '../../../src/ui/model/boundary-check-request.ts';
import { withBoundaryCheck } from '../../../src/ui/figures/boundary-check-overlay.ts';
import { demoState } from '../../../src/ui/state/app-state.ts';
import { renderFigure } from '../../../src/ui/plot/figure.ts';
import { splitShell } from '../../browser/harness/page-tools.ts';

const X = { name: 'mu' as const, span: 3.9 }, Y = { name: 'rb' as const, span: 1.6 };

describe('the picked line', () => {
  it('stores picks as "x0,y0;x1,y1" and parses them back', () => {
    const one = addPick('0.1,0.2;0.3,0.4', 0.5, 1.25, true);
    expect(one).toBe('0.5,1.25');
    expect(parseCheckEnds(one)).toBeNull();
    const two = addPick(one, 1.7, 1.3, false);
    expect(two).toBe('0.5,1.25;1.7,1.3');
    expect(parseCheckEnds(two)).toEqual([[0.5, 1.25], [1.7, 1.3]]);
    expect(parseCheckEnds('0.5,x;1,2')).toBeNull();
  });

  it('snaps onto the axis the ends differ more along, in units of each span', () => {
    // dx = 1.2/3.9 = 0.31 of the span, dy = 0.05/1.6 = 0.03: along mu, rb held at the first end
    const l = checkLine([[1.7, 1.25], [0.5, 1.3]], X, Y);
    expect(l).toMatchObject({ along: 'x', name: 'mu', qmcName: 'mu', start: 0.5, stop: 1.7, fixedName: 'rb', fixedQmcName: 'rb', fixed: 1.25 });
    expect(lineToMap(l, 1)).toEqual([1, 1.25]);
    // dx = 0.1/3.9 = 0.026, dy = 0.8/1.6 = 0.5: along rb at mu = 1
    const v = checkLine([[1, 0.9], [1.1, 1.7]], X, Y);
    expect(v).toMatchObject({ along: 'y', name: 'rb', start: 0.9, stop: 1.7, fixedName: 'mu', fixed: 1 });
    expect(lineToMap(v, 1.2)).toEqual([1, 1.2]);
  });

  it('refuses equal ends and the density axis', () => {
    expect(() => checkLine([[1, 1], [1, 1]], X, Y)).toThrow(/same point/);
    expect(() => checkLine([[0.1, 1], [0.5, 1]], { name: 'density', span: 1 }, Y)).toThrow(/fixed \u03bc/);
  });

  it('finds where the labels change, half a step either side', () => {
    const b = labelChanges([0, 0.1, 0.2, 0.3, 0.4], ['a', 'a', undefined, 'b', 'b']);
    expect(b.length).toBe(1);
    expect(b[0]).toMatchObject({ from: 'a', to: 'b' });
    expect(b[0].at).toBeCloseTo(0.2, 14); // (0.1 + 0.3)/2, to rounding
    expect(b[0].halfWidth).toBeCloseTo(0.1, 14);
    expect(labelChanges([0, 1], ['a', 'a'])).toEqual([]);
  });
});

describe('the scan request', () => {
  const inputs = demoState().model; // vdw chain, Rb 1.5, delta 3, mu 1
  const e = { sizes: '12,8', cpoints: '5', csweeps: '300', ctemp: '0.05', cground: '' };

  it('runs the line parameter over the CLI parser\'s values with the other map axis fixed', () => {
    const l = checkLine([[0.5, 1.25], [1.7, 1.3]], X, Y);
    const r = checkRequest(inputs, l, e);
    expect(r.sizes).toEqual([8, 12]);
    expect(r.axis).toEqual({ name: 'mu', values: [0.5, 0.8, 1.1, 1.4, 1.7].map((v, i) => (i === 4 ? 1.7 : 0.5 + i * 0.3)) });
    expect(r.base.cluster.interaction).toMatchObject({ shape: 'vdw', Rb: 1.25 });
    expect(r.base).toMatchObject({ delta: 3, temperature: 0.05, sweeps: 300, chains: CHECK_RUN.chains, alphaPoints: CHECK_RUN.alphaPoints });
    expect(r.base.ground).toBeUndefined();
  });

  it('offers a qmc-scan command with the same line, sizes and run settings', () => {
    const l = checkLine([[0.5, 1.25], [1.7, 1.3]], X, Y);
    const w = splitShell(checkCommand(inputs, l, checkRequest(inputs, l, { ...e, cground: '1' })));
    const flag = (f: string) => w[w.indexOf(f) + 1];
    expect(w.slice(0, 6)).toEqual(['npm', 'run', '-s', 'atlas', '--', 'qmc-scan']);
    expect(flag('--x')).toBe('mu=0.5..1.7x5');
    expect(flag('--sizes')).toBe('8,12');
    expect(flag('--rb')).toBe('1.25');
    expect(flag('--detuning')).toBe('3');
    expect(w).toContain('--ground');
    expect(w).not.toContain('--temperature');
    expect(w.filter((x) => x === '--mu' || x === '--rb').length).toBe(1); // mu is the axis: only --rb
  });

  it('refuses a bad entry with its reason', () => {
    const l = checkLine([[0.5, 1.25], [1.7, 1.3]], X, Y);
    expect(() => checkRequest(inputs, l, { ...e, ctemp: '0' })).toThrow(/temperature must be > 0/);
    expect(() => checkRequest(inputs, l, { ...e, sizes: '8,8' })).toThrow(/twice/);
    expect(() => checkRequest(inputs, l, { ...e, cpoints: '1' })).toThrow(/points along the line/);
  });
});

describe('the overlay on the map', () => {
  it('draws each crossing at its map position, inside the map\'s clip path, with a bar of +- error', () => {
    const { svg, frame } = renderFigure({ id: 'atlas-map', width: 400, height: 300, x: [0, 2], y: [0, 1], marks: [], title: 'map' });
    const fig = { svg, frame, name: 'phase-map', title: 'map' };
    const o = { ends: [[0.5, 0.5], [1.5, 0.5]] as [number, number][], line: [[0.5, 0.5], [1.5, 0.5]] as [[number, number], [number, number]], markers: [{ x: 1, y: 0.5, ex: 0.1, ey: 0, label: 'QMC L 8/12' }] };
    const out = withBoundaryCheck(fig, o);
    expect(withBoundaryCheck(fig, o)).toBe(out); // memoised: the map panel is not redrawn on a pointer move
    expect(out.svg.endsWith('</svg>')).toBe(true);
    expect(out.svg).toContain('<g class="boundary-check" clip-path="url(#atlas-map-clip)">');
    const bar = /<g class="crossing-marker"[^>]*><title>QMC L 8\/12<\/title><line x1="([\d.]+)" x2="([\d.]+)"/.exec(out.svg);
    expect(bar).not.toBeNull();
    // the bar spans x = 0.9 .. 1.1 in data units
    expect(Number(bar![1])).toBeCloseTo(frame.x(0.9), 1);
    expect(Number(bar![2])).toBeCloseTo(frame.x(1.1), 1);
  });
});
