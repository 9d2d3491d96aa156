/**
 * <limits-note>: the model's limits, stated beside results. Always: the cavity's
 * mean-field is exact as N -> infinity, the short-range interaction's is not (it
 * overstates order, most of all in 1D). Emphasised where it bites: a 1D modulated
 * state at T > 0, which no real chain holds (no long-range order in 1D at T > 0).
 */
import { LitElement, html, css, nothing } from 'lit';
import { sharedStyles } from './shared-styles.ts';

export class LimitsNote extends LitElement {
  static override properties = { lattice: { type: String }, temperature: { type: Number }, modulated: { type: Boolean } };
  declare lattice: string;
  declare temperature: number;
  declare modulated: boolean;

  constructor() {
    super();
    this.lattice = 'chain';
    this.temperature = 0;
    this.modulated = false;
  }

  static override styles = [sharedStyles, css`:host { display: block; }`];

  override render() {
    const oneDHot = this.lattice === 'chain' && this.temperature > 0;
    return html`<div class="note" role="note">
      <strong>Limits.</strong> Mean-field theory: the cavity couples every emitter to every other, so the photon's
      mean field is exact for many emitters at any T; the emitter-emitter interaction is short-ranged, so its
      mean field <em>overstates order</em>, most of all in 1D. No losses (quasi-equilibrium), one cavity mode,
      rotating-wave coupling.
      ${oneDHot ? html`<br><strong class="err">1D at T &gt; 0:</strong> no density wave survives in a real chain at finite
        temperature; the crystals shown here are mean-field artefacts of their true short-range correlations
        (use the correlated check to measure them).` : nothing}
    </div>`;
  }
}
customElements.define('limits-note', LimitsNote);

declare global { interface HTMLElementTagNameMap { 'limits-note': LimitsNote } }
