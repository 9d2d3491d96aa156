/**
 * The planner's losses panel: the entries kappa, gamma and dephasing (full widths in MHz)
 * and the loss budget of src/core/lab/losses.ts shown with its units. Renders only: every
 * formula lives in the core.
 */
import { html, nothing, type TemplateResult } from 'lit';
import { type LossBudget, type LossRates, SMALL_LOSS_RATIO } from '../../core/lab/losses.ts';
import { parseNumber } from '../model/model-inputs.ts';
import { inPageWords } from '../model/page-words.ts';
import type { Table } from '../export/table.ts';

export const LOSS_FIELDS = [
  { key: 'kappa', label: 'Cavity linewidth \u03ba / 2\u03c0 (full width at half maximum)' },
  { key: 'gamma', label: 'Emitter decay \u03b3 / 2\u03c0 (full width of the radiative line)' },
  { key: 'dephasing', label: 'Emitter dephasing \u03b3\u03c6 / 2\u03c0 (extra full width it adds; blank = 0)' },
] as const;

/** The typed widths, or null while kappa and gamma are both blank (losses not asked for). */
export function typedLosses(v: Record<string, string | undefined>): LossRates | null {
  const t = (k: string) => (v[k] ?? '').trim();
  if (t('kappa') === '' && t('gamma') === '') return null;
  return { kappaMHz: parseNumber(t('kappa')), gammaMHz: parseNumber(t('gamma')), gammaPhiMHz: t('dephasing') === '' ? 0 : parseNumber(t('dephasing')) };
}

const fmt = (v: number, d = 4) => (Number.isFinite(v) ? Number(v.toPrecision(d)).toString() : '\u2014');

/** The three entries, with an error beside the field it concerns. */
export function lossFields(v: Record<string, string | undefined>, onInput: (key: string, value: string) => void, err?: { message: string; field?: string }): TemplateResult {
  return html`${LOSS_FIELDS.map((f) => {
    const id = `lab-${f.key}`, bad = err?.field === f.key;
    return html`<div class="field">
      <label for=${id}>${f.label}</label>
      <input id=${id} name=${id} inputmode="decimal" .value=${v[f.key] ?? ''} aria-invalid=${bad ? 'true' : 'false'} aria-describedby="${id}-msg"
        @input=${(e: Event) => onInput(f.key, (e.target as HTMLInputElement).value)}>
      <span class="muted">MHz</span>
      <div class="msg err" id="${id}-msg" role=${bad ? 'alert' : nothing}>${bad ? inPageWords(err?.message ?? '') : ''}</div>
    </div>`;
  })}`;
}

/** The budget as a table and a plain statement. `marginNote` says where the margin came from. */
export function lossResults(b: LossBudget, marginNote: string): TemplateResult {
  const row = (name: unknown, value: string, unit: string, cls = '') => html`<tr><th class="l">${name}</th><td class=${cls}>${value}</td><td class="l">${unit}</td></tr>`;
  const word = { applies: 'can apply', marginal: 'is marginal', 'does not apply': 'does not apply' }[b.verdict];
  return html`<table aria-label="Losses"><tbody>
      ${b.c1 !== null ? row('single-emitter cooperativity C1 = 4 g0\u00b2 / (\u03ba \u03b3)', fmt(b.c1), '', 'c1') : row('single-emitter cooperativity C1', '\u2014', 'needs g0 and N')}
      ${b.c1Dephased !== null && b.c1Dephased !== b.c1 ? row('C1 with dephasing, 4 g0\u00b2 / (\u03ba (\u03b3 + \u03b3\u03c6))', fmt(b.c1Dephased), '') : nothing}
      ${row('collective cooperativity C = 4 g\u00b2 / (\u03ba \u03b3) = N C1', fmt(b.c), '', 'c-coll')}
      ${b.cDephased !== b.c ? row('C with dephasing, 4 g\u00b2 / (\u03ba (\u03b3 + \u03b3\u03c6))', fmt(b.cDephased), '') : nothing}
      ${row('vacuum Rabi splitting 2g / 2\u03c0', fmt(b.strong.splittingMHz), 'MHz')}
      ${row('polariton full width (\u03ba + \u03b3 + \u03b3\u03c6) / 2', fmt(b.strong.polaritonWidthMHz), 'MHz')}
      ${row('largest loss rate max(\u03ba, \u03b3 + \u03b3\u03c6) / 2\u03c0', fmt(b.maxLossMHz), 'MHz')}
      ${row(`phase margin (${marginNote})`, b.marginMHz === null ? '\u2014' : fmt(b.marginMHz), 'MHz')}
      ${row('polariton gap \u221a(\u0394\u00b2 + 4g\u00b2)', fmt(b.polariton.polaritonGapMHz), 'MHz')}
      ${row('pump to lower polariton |\u03bc \u2212 E_LP|', fmt(b.polariton.pumpToLowerPolaritonMHz), 'MHz')}
      ${row(`largest loss / smallest of these (${b.smallestGapName})`, fmt(b.lossOverGap, 3), '', 'loss-ratio')}
    </tbody></table>
    <p class="loss-verdict" role="status">
      ${b.strong.strong ? html`<strong>Strong coupling:</strong> 2g exceeds the polariton full width (\u03ba + \u03b3 + \u03b3\u03c6)/2.`
        : html`<strong>Not strong coupling:</strong> 2g = ${fmt(b.strong.splittingMHz)} MHz does not exceed the polariton full width ${fmt(b.strong.polaritonWidthMHz)} MHz${b.strong.split ? '' : ' (the normal modes do not even split: g < |\u03ba \u2212 \u03b3 \u2212 \u03b3\u03c6|/4)'}.`}
      The quasi-equilibrium picture of this tool <strong class="qe">${word}</strong> at these numbers:
      the largest loss rate is ${fmt(b.lossOverGap, 2)} times the smallest energy scale (the ${b.smallestGapName})
      ${b.verdict === 'applies' ? `(below ${SMALL_LOSS_RATIO}).` : b.verdict === 'marginal' ? `(below 1 but not below ${SMALL_LOSS_RATIO}: the phase may be blurred by the losses).` : b.strong.strong ? '(not below 1: the losses wash out the phase).' : '.'}
      It also needs the excitations to relax to the temperature entered faster than they are lost; the tool does not know that
      relaxation rate, so check it yourself. <strong>Full driven-dissipative steady states are not computed</strong>: this is a comparison of scales only.</p>
    <p class="muted">Conventions: \u03ba, \u03b3, \u03b3\u03c6 are full widths (ordinary frequency, MHz); C = 4g\u00b2/(\u03ba\u03b3) with full widths as in
      H. Tanji-Suzuki et al., Adv. At. Mol. Opt. Phys. 60, 201 (2011) (convention recalled from memory). Strong coupling: the splitting 2g exceeds the
      polariton full width (\u03ba + \u03b3 + \u03b3\u03c6)/2, from the two damped coupled modes (derived in src/core/lab/losses.ts); a resolution convention,
      others ask g \u226b \u03ba, \u03b3. "Small" means below ${SMALL_LOSS_RATIO}, a choice of this tool. No inhomogeneous broadening.</p>`;
}

/** The loss budget's rows for the CSV/JSON export (units in the third column). */
export function lossRows(b: LossBudget): Table['rows'] {
  return [
    ['largest loss rate', b.maxLossMHz, 'MHz'], ['C1', b.c1, ''], ['C1 dephased', b.c1Dephased, ''],
    ['C', b.c, ''], ['C dephased', b.cDephased, ''], ['2g', b.strong.splittingMHz, 'MHz'], ['polariton width', b.strong.polaritonWidthMHz, 'MHz'],
    ['phase margin', b.marginMHz, 'MHz'], ['polariton gap', b.polariton.polaritonGapMHz, 'MHz'],
    ['mu - E_LP', b.polariton.pumpToLowerPolaritonMHz, 'MHz'], ['loss / smallest gap', b.lossOverGap, ''],
  ];
}
