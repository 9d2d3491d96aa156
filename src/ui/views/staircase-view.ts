/** <staircase-view>: under construction. */
import { LitElement, html } from 'lit';

export class StaircaseView extends LitElement {
  static override properties = { section: { attribute: false }, model: { attribute: false }, inputs: { attribute: false }, engine: { attribute: false } };
  override render() { return html`<p>Under construction.</p>`; }
}
customElements.define('staircase-view', StaircaseView);
