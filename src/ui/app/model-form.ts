/**
 * <model-form>: the model shared by all five views. Every entry is checked as it is
 * typed; the reason for a refusal is shown beside the field (and announced), and the
 * views keep their last good result meanwhile. Emits model-input {key, value} per edit;
 * the parent owns the state and passes back `inputs` and `errors`.
 */
import { LitElement, html, css, nothing } from 'lit';
import type { ModelInputs, ModelKey } from '../state/app-state.ts';
import type { FieldErrors } from '../model/model-inputs.ts';
import { activeKeys, parseNumber } from '../model/model-inputs.ts';
import { sharedStyles } from './shared-styles.ts';
import { inPageWords } from '../model/page-words.ts';
import { type Term, term, termStyles } from './term-tip.ts';

interface FieldDef { key: ModelKey; label: string; unit?: string; hint?: string; options?: [string, string][]; term?: [Term, string] }

const FIELDS: Record<ModelKey, FieldDef> = {
  lattice: { key: 'lattice', label: 'Lattice', options: [['chain', 'chain (1D)'], ['square', 'square'], ['triangular', 'triangular']] },
  interaction: { key: 'interaction', label: 'Interaction shape', options: [
    ['vdw', 'van der Waals  V1/r\u2076'], ['dipolar', 'dipolar  V1/r\u00b3'], ['nn', 'nearest neighbour (+ next)'], ['softcore', 'soft core  V0/(1+(r/Rc)\u2076)']] },
  strength: { key: 'strength', label: 'Strength given as', options: [['rb', 'blockade radius Rb'], ['v1', 'V1 at r = a']] },
  rb: { key: 'rb', label: 'Blockade radius Rb', unit: 'a', hint: 'V(Rb) = 2g, the vacuum Rabi splitting' },
  v1: { key: 'v1', label: 'V1, nearest neighbours', unit: 'g' },
  v2: { key: 'v2', label: 'V2, next-nearest', unit: 'g' },
  v0: { key: 'v0', label: 'Plateau height V0', unit: 'g' },
  rc: { key: 'rc', label: 'Core radius Rc', unit: 'a' },
  range: { key: 'range', label: 'Range cut rmax', unit: 'a', hint: 'empty: the full converged lattice sum', term: ['range cut', 'Range cut'] },
  detuning: { key: 'detuning', label: 'Detuning \u03b4 (cavity \u2212 emitter)', unit: 'g' },
  pump: { key: 'pump', label: 'Pump given as', options: [['mu', 'chemical potential \u03bc'], ['density', 'excitation density \u03c1']] },
  mu: { key: 'mu', label: 'Chemical potential \u03bc', unit: 'g', hint: 'must stay below \u03b4' },
  density: { key: 'density', label: 'Excitation density \u03c1', unit: 'per site' },
  temperature: { key: 'temperature', label: 'Temperature T', unit: 'g' },
  'max-cell': { key: 'max-cell', label: 'Largest pattern Mmax', unit: 'sites', hint: 'sublattices searched', term: ['Mmax', 'Mmax'] },
};

export class ModelForm extends LitElement {
  static override properties = { inputs: { attribute: false }, errors: { attribute: false }, overrides: { attribute: false } };
  declare inputs: ModelInputs;
  declare errors: FieldErrors;
  /**
   * Fields the current view sets itself (a map axis, the staircase's mu scan), with the note
   * shown beside them ("set by the x axis"). They are greyed out while they hold no error;
   * a field with an error stays open so it can be fixed.
   */
  declare overrides: Partial<Record<ModelKey, string>>;

  constructor() {
    super();
    this.errors = {};
    this.overrides = {};
  }

  static override styles = [sharedStyles, termStyles, css`
    :host { display: block; }
    fieldset { border: 1px solid var(--line); border-radius: 6px; margin: 0 0 10px; padding: 6px 10px 8px; }
    legend { font-weight: 600; padding: 0 4px; }
    .field { display: grid; grid-template-columns: 1fr 96px; gap: 2px 8px; align-items: center; margin: 5px 0; }
    .field label { font-size: 13px; }
    .field .unit { color: var(--muted); font-size: 12px; }
    .field input, .field select { width: 100%; }
    .field.wide { grid-template-columns: 1fr; }
    .msg { grid-column: 1 / -1; }
    .hint { grid-column: 1 / -1; font-size: 11.5px; color: var(--muted); }
    .field.overridden label { color: var(--muted); }
    .field.overridden input:disabled { background: #eceef2; color: #5b6577; border-style: dashed; }
    .set-by { grid-column: 1 / -1; font-size: 11.5px; color: var(--accent); font-style: italic; }
  `];

  private emit(key: ModelKey, value: string) {
    this.dispatchEvent(new CustomEvent('model-input', { detail: { key, value }, bubbles: true, composed: true }));
  }

  private field(key: ModelKey) {
    const d = FIELDS[key];
    const id = `f-${key}`;
    const err = this.errors[key] ? inPageWords(this.errors[key]!) : undefined;
    const value = this.inputs[key];
    const setBy = this.overrides?.[key];
    const off = !!setBy && !err;
    const control = d.options
      ? html`<select id=${id} name=${key} .value=${value} @change=${(e: Event) => this.emit(key, (e.target as HTMLSelectElement).value)}
          aria-describedby="${id}-msg">${d.options.map(([v, t]) => html`<option value=${v} ?selected=${v === value}>${t}</option>`)}</select>`
      : html`<input id=${id} name=${key} type="text" inputmode="decimal" autocomplete="off" spellcheck="false"
          .value=${value} aria-invalid=${err ? 'true' : 'false'} aria-describedby="${id}-msg ${id}-set" ?disabled=${off}
          @input=${(e: Event) => this.emit(key, (e.target as HTMLInputElement).value)}>`;
    const at = d.term ? d.label.indexOf(d.term[1]) : -1;
    const label = d.term && at >= 0 ? html`${d.label.slice(0, at)}${term(d.term[0], d.term[1])}${d.label.slice(at + d.term[1].length)}` : d.label;
    return html`<div class="field ${d.options ? 'wide' : ''} ${setBy ? 'overridden' : ''}">
      <label for=${id}>${label}${d.unit ? html` <span class="unit">(${d.unit})</span>` : nothing}</label>
      ${control}
      <div class="msg err" id="${id}-msg" role=${err ? 'alert' : nothing} data-field=${key}>${err ?? ''}</div>
      ${setBy ? html`<div class="set-by" id="${id}-set" data-set-by=${key}>${setBy}${err ? ': fix the entry or clear it' : ''}</div>` : nothing}
      ${d.hint && !err && !setBy ? html`<div class="hint">${d.hint}</div>` : nothing}
    </div>`;
  }

  /** A line of derived numbers (V1 from Rb and back), so the user sees what the entry means. */
  private derived() {
    const m = this.inputs;
    if (m.interaction !== 'vdw' && m.interaction !== 'dipolar') return nothing;
    const s = m.interaction === 'vdw' ? 6 : 3;
    if (m.strength === 'rb') {
      const rb = parseNumber(m.rb);
      return Number.isFinite(rb) && rb > 0 ? html`<div class="hint">V1 = 2 Rb^${s} = ${(2 * rb ** s).toPrecision(4)} g</div>` : nothing;
    }
    const v1 = parseNumber(m.v1);
    return Number.isFinite(v1) && v1 > 0 ? html`<div class="hint">Rb = (V1/2)^(1/${s}) = ${((v1 / 2) ** (1 / s)).toPrecision(4)} a</div>` : nothing;
  }

  override render() {
    const active = new Set(activeKeys(this.inputs));
    const show = (k: ModelKey) => (active.has(k) ? this.field(k) : nothing);
    return html`<form @submit=${(e: Event) => e.preventDefault()} aria-label="Model">
      <fieldset><legend>Array</legend>
        ${this.field('lattice')} ${this.field('interaction')} ${show('strength')}
        ${show('rb')} ${show('v1')} ${show('v2')} ${show('v0')} ${show('rc')} ${this.derived()} ${this.field('range')}
      </fieldset>
      <fieldset><legend>Cavity and pump</legend>
        ${this.field('detuning')} ${this.field('pump')} ${show('mu')} ${show('density')} ${this.field('temperature')}
      </fieldset>
      <fieldset><legend>Search</legend>${this.field('max-cell')}</fieldset>
      <p class="hint muted">Energies in units of the collective coupling g (vacuum Rabi splitting 2g), lengths in the lattice spacing a, \u0127 = k<sub>B</sub> = 1.</p>
    </form>`;
  }
}
customElements.define('model-form', ModelForm);

declare global { interface HTMLElementTagNameMap { 'model-form': ModelForm } }
