// map's adaptive path through the command line (in this process, real worker threads):
// --dense gives the same pixels, --json closes with solves, notes and the boundary lines
// (the closing line unchanged), --boundaries writes them as CSV, the notes of a map that is
// not adaptive reach stderr and the JSON, and a resumed adaptive JSON map (a torn part
// in memory) is the uninterrupted one byte for byte. Check values: the dense run of the same map (the
// adaptive map promises its pixels, docs/certified-maps.md) and the run's own JSON.
import { describe, expect, it } from 'vitest';
import { parseCsvLine } from '../../src/formats/csv.ts';
import { cli } from './test-io.ts';

/** 24 x 18 points of the 1D vdw map at Mmax 6: several crystals and exact lines between them. */
const MAP = ['map', '--x', 'mu=-1..3.9x24', '--y', 'rb=1..2x18', '--detuning', '4', '--max-cell', '6', '--workers', '2'];
const PIXELS = 24 * 18;

interface Doc {
  points: unknown[];
  solves: { total: number; pixels: number; boundaries: number };
  notes: string[];
  boundaries: Array<{ phases: [string, string]; points: number[][]; firstOrder: boolean | null; densityJump: number | null }>;
  complete: boolean;
}

describe('map: adaptive by default, --dense, solves, boundaries', () => {
  it('the adaptive JSON has the dense pixels, fewer solves and exact lines; --boundaries writes them as CSV', async () => {
    const files = new Map<string, string>();
    const a = await cli([...MAP, '--json', '--boundaries', 'lines.csv'], files);
    const d = await cli([...MAP, '--json', '--dense']);
    expect(a.code).toBe(0);
    expect(d.code).toBe(0);
    // the closing line is the streamed document's, after the summary
    expect(a.out.endsWith('\n],"complete":true}\n')).toBe(true);
    const ad = JSON.parse(a.out) as Doc, dd = JSON.parse(d.out) as Doc;
    expect(ad.points).toHaveLength(PIXELS);
    expect(ad.points).toEqual(dd.points); // zero differing pixels
    // the point lines themselves are the same bytes
    expect(a.out.split('],"solves"')[0]).toBe(d.out.split('],"solves"')[0]);
    expect(ad.solves.total).toBe(ad.solves.pixels + ad.solves.boundaries);
    expect(ad.solves.pixels).toBeLessThan(PIXELS * 0.8);
    expect(ad.solves.total).toBeLessThan(PIXELS);
    expect(ad.solves.boundaries).toBeGreaterThan(0);
    expect(ad.notes).toEqual([]);
    expect(dd.solves).toEqual({ total: PIXELS, pixels: PIXELS, boundaries: 0 });
    expect(dd.notes.join(' ')).toMatch(/densely on request/);
    expect(dd.boundaries).toEqual([]);
    expect(d.err).toMatch(/map: note: solved densely on request/);
    expect(a.err).toMatch(new RegExp(`; ${ad.solves.total} points solved for ${PIXELS} pixels \\(${ad.solves.pixels} for the pixels, ${ad.solves.boundaries} confirming boundaries\\)`));
    const exact = ad.boundaries.filter((b) => b.firstOrder === true);
    expect(exact.length).toBeGreaterThan(2);
    for (const b of exact) {
      // a jump between density-wave fractions p/q with q <= 6
      expect(b.phases.every((p) => p.startsWith('density-wave') || p === 'empty')).toBe(true);
      expect(Math.abs(b.densityJump as number)).toBeGreaterThanOrEqual(1 / 30 - 1e-12);
    }
    // resumed after 150 points and a torn line: computed again from its first row (points on
    // disk not written again), so the summary and the file are the uninterrupted run's
    const cut = a.out.split('\n');
    files.set('m.json', cut.slice(0, 151).join('\n') + '\n' + cut[151].slice(0, 40));
    const re = await cli([...MAP, '--json', '--out', 'm.json', '--resume'], files);
    expect(re.code).toBe(0);
    expect(re.err).toMatch(/the 150 points on disk are computed again/);
    expect(files.get('m.json') === a.out).toBe(true);
    // the CSV: one row a vertex, the JSON's lines in order
    const csv = (files.get('lines.csv') as string).trimEnd().split('\n').map((l) => parseCsvLine(l) as string[]);
    expect(csv[0]).toEqual(['line', 'vertex', 'phase_a', 'phase_b', 'firstOrder', 'densityJump', 'mu', 'rb']);
    const rows = csv.slice(1);
    expect(rows.length).toBe(ad.boundaries.reduce((n, b) => n + b.points.length, 0));
    let r = 0;
    ad.boundaries.forEach((b, id) => {
      b.points.forEach((pt, k) => {
        const f = rows[r++];
        expect(f.slice(0, 4)).toEqual([String(id), String(k), b.phases[0], b.phases[1]]);
        expect(f[4]).toBe(b.firstOrder === null ? '' : String(b.firstOrder));
        expect(f[5] === '' ? null : Number(f[5])).toBe(b.densityJump);
        expect([Number(f[6]), Number(f[7])]).toEqual(pt);
      });
    });
  }, 300_000);

  it('says why a map is not certified (T > 0) or draws no lines (a shard), on stderr and in the JSON; refuses --boundaries there', async () => {
    const line = ['map', '--x', 'mu=-1..3.9x12', '--rb', '1.5', '--detuning', '4', '--max-cell', '4', '--workers', '2'];
    const hot = await cli([...line, '--temperature', '0.1', '--json']);
    expect(hot.code).toBe(0);
    expect(hot.err).toMatch(/map: note: not certified \(at T > 0/);
    const doc = JSON.parse(hot.out) as Doc & { solves: { inCell: number } };
    expect(doc.notes).toHaveLength(1);
    expect(doc.notes[0]).toMatch(/^not certified \(at T > 0/);
    // every pixel solved in full or in its region's cell; none confirms a boundary
    expect(doc.solves.total + doc.solves.inCell).toBe(12);
    expect(doc.solves.boundaries).toBe(0);
    const shard = await cli([...line, '--json', '--shard', '1/2']);
    expect(shard.err).toMatch(/map 1\/2: note: a shard refines only the rectangles that hold its own segments/);
    // a part keeps the bare closing line that merge reads
    expect(shard.out.trimEnd().split('\n').slice(-1)[0]).toBe('],"complete":true}');
    expect(shard.out).not.toMatch(/"solves"/);
    for (const extra of [['--dense'], ['--shard', '1/2']]) {
      const files = new Map<string, string>();
      const r = await cli([...line, ...extra, '--boundaries', 'b.csv'], files);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(/--boundaries: this map locates no boundary lines/);
      expect(r.out).toBe('');
      expect(files.has('b.csv')).toBe(false);
    }
  }, 300_000);
});
