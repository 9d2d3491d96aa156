/**
 * Refusals in the page's words (issue 11, item 19): the core's messages, quoted as the CLI
 * prints them, lose their flag names and bare symbol names on the page; numbers stay.
 */
import { describe, it, expect } from 'vitest';
import { inPageWords } from '../../../src/ui/model/page-words.ts';
import { parseAxis } from '../../../src/core/scan/axes.ts';

describe('inPageWords', () => {
  it('names the axes and entries as the form does', () => {
    let msg = '';
    try { parseAxis('mu:0:1:3', 'x'); } catch (e) { msg = (e as Error).message; }
    expect(msg.startsWith('--x')).toBe(true); // the CLI's words, from the core
    const page = inPageWords(msg);
    expect(page).not.toMatch(/--[a-z]/);
    expect(page.startsWith('the horizontal axis must be name=start..stop xN')).toBe(true);
    expect(inPageWords('the softcore range needs --v0 and --rc')).toBe('the soft core range needs the plateau height V0 and the core radius Rc');
    expect(inPageWords('the rb axis needs the vdw or dipolar interaction, not softcore'))
      .toBe('the blockade-radius (Rb) axis needs the van der Waals or dipolar interaction, not soft core');
  });

  it('writes symbols for names and leaves numbers and other words alone', () => {
    expect(inPageWords('mu = 2.190909090909091 must be below the detuning 2: for mu >= delta the photon number is unbounded'))
      .toBe('\u03bc = 2.190909090909091 must be below the detuning 2: for \u03bc >= \u03b4 the photon number is unbounded');
    expect(inPageWords('cavity linewidth kappa must be > 0, got -1')).toBe('cavity linewidth \u03ba must be > 0, got -1');
    // the form's entries by the names the form shows
    expect(inPageWords("rb must be a finite number, got ''")).toBe("Rb must be a finite number, got ''");
    expect(inPageWords('max-cell must be an integer 1..32 on the chain lattice, got 0')).toBe('Mmax must be an integer 1..32 on the chain lattice, got 0');
    expect(inPageWords('range must be > 0 (or inf), got -1')).toBe('the range cut must be > 0 (or inf), got -1');
    expect(inPageWords("v1 must be a finite number, got 'x'")).toBe("V1 must be a finite number, got 'x'");
    // whole words only: "mutual", "summary" and "--unknown-flag" are kept
    expect(inPageWords('mutual summary --unknown-flag')).toBe('mutual summary --unknown-flag');
  });
});
