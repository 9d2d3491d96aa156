/**
 * Export file names (issue 11, item 15): the view, the figure or table, and the key
 * inputs, with an axis range `name<start>..<stop>` standing in the place of the entry the
 * axis sets; only characters every common file system accepts. The expected names are
 * written out from that rule and the inputs (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { demoState, type AppState } from '../../../src/ui/state/app-state.ts';
import { exportBaseName, safeWord, MAX_BASE_LENGTH } from '../../../src/ui/export/file-name.ts';

/** Characters allowed in a portable file name (POSIX portable filename character set, IEEE Std 1003.1, 3.282). */
const PORTABLE = /^[A-Za-z0-9._-]+$/;

function state(patch: (s: AppState) => void): AppState {
  const s = demoState();
  patch(s);
  return s;
}

describe('export file names', () => {
  it('carry the view, the model and the axis ranges in the entries\' places', () => {
    const s = state((s) => { s.model.detuning = '4'; s.atlas.x = 'mu=-1:3.9:64'; s.atlas.y = 'temperature=0:0.5:11'; });
    expect(exportBaseName(s, 'atlas')).toBe('atlas_chain_vdw_Rb1.5_delta4_mu-1..3.9_T0..0.5');
    // the demo map: the Rb axis replaces the fixed Rb = 1.5, the mu axis the fixed mu = 1
    expect(exportBaseName(demoState(), 'phase-map')).toBe('atlas-phase-map_chain_vdw_Rb0.8..2.4_delta3_mu-1..2.9_T0');
    // the range read by the scan's own parser, in the page's form start..stop xN as in the old start:stop:count
    const both = ['mu=-1..2.9 x64', 'mu=-1:2.9:64'].map((x) => exportBaseName(state((s) => { s.atlas.x = x; s.atlas.y = 'rb=0.8..2.4 x40'; }), 'phase-map'));
    expect(both).toEqual(['atlas-phase-map_chain_vdw_Rb0.8..2.4_delta3_mu-1..2.9_T0', 'atlas-phase-map_chain_vdw_Rb0.8..2.4_delta3_mu-1..2.9_T0']);
  });

  it('name other interactions by their own strengths, and the density pump by rho', () => {
    const s = state((s) => { s.view = 'modes'; s.model.interaction = 'nn'; s.model.v1 = '2'; s.model.v2 = '0.5'; s.model.pump = 'density'; s.model.density = '0.25'; });
    expect(exportBaseName(s, 'branches')).toBe('modes-branches_chain_nn_V12_V20.5_delta3_rho0.25_T0');
    const soft = state((s) => { s.view = 'modes'; s.model.interaction = 'softcore'; s.model.v0 = '4'; s.model.rc = '1.5'; });
    expect(exportBaseName(soft, 'spectrum')).toBe('modes-spectrum_chain_softcore_V04_Rc1.5_delta3_mu1_T0');
  });

  it('the staircase names its mu range; the opened point of the atlas its own coordinates', () => {
    expect(exportBaseName(state((s) => { s.view = 'staircase'; }), 'staircase')).toBe('staircase_chain_vdw_Rb1.5_delta3_mu-1..2.9_T0');
    const p = state((s) => { s.atlas.point = '1.5,1.9'; });
    expect(exportBaseName(p, 'sublattice-pattern')).toBe('atlas-sublattice-pattern_chain_vdw_Rb1.9_delta3_mu1.5_T0');
  });

  it('the correlated check names its method and cluster', () => {
    const s = state((s) => { s.view = 'correlated'; s.correlated.method = 'vmc'; s.correlated.size = '16'; });
    expect(exportBaseName(s, 'vmc-trace')).toBe('correlated-vmc-trace_chain_vdw_Rb1.5_delta3_mu1_T0_vmc_periodic16');
  });

  it('stay file-system safe whatever is typed', () => {
    const hostile = ['../../etc/passwd', 'a b\tc', 'C:\\x', '1e-3', '\u22121.5', 'x*?"<>|:', '\u03bc=1', '', '   ', '#1;2'];
    for (const h of hostile) {
      const s = state((s) => { s.model.rb = h; s.model.detuning = h; s.atlas.x = `mu=${h}`; s.model.lattice = h || 'chain'; });
      const name = exportBaseName(s, h);
      expect(name, h).toMatch(PORTABLE);
      expect(name).not.toMatch(/^[-.]/);
      expect(name.length).toBeLessThanOrEqual(MAX_BASE_LENGTH);
    }
    // a Unicode minus typed in an entry is written as '-'
    expect(exportBaseName(state((s) => { s.model.detuning = '\u22122'; }), 'modes')).toContain('_delta-2_');
    expect(safeWord(' a/b  c ')).toBe('a-b-c');
  });

  it('keep long names within the limit', () => {
    const s = state((s) => { s.model.rb = '1.'.padEnd(400, '1'); });
    const name = exportBaseName(s, 'phase-map');
    expect(name.length).toBeLessThanOrEqual(MAX_BASE_LENGTH);
    expect(name.startsWith('atlas-phase-map_chain_vdw_')).toBe(true);
  });
});
