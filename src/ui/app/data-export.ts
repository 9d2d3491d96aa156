/**
 * <data-export>: a view's numbers as CSV and JSON files, and the command line that
 * reproduces the view ("copy as command"), shown in full so it can be read and selected.
 * The CSV starts with a '#' comment header of every input (export/csv-header.ts, for
 * pandas.read_csv(path, comment='#')); files are named after the view, `name` and the
 * key inputs (export/file-name.ts).
 * `table` and `json` may be functions, called only when the file is asked for (a big map's
 * table is not rebuilt at every redraw); `rows` then gives the count shown.
 */
import { LitElement, html, css, nothing } from 'lit';
import { sharedStyles } from './shared-styles.ts';
import { downloadText } from '../export/download.ts';
import type { Table } from '../export/table.ts';
import { commentedCsv, inputHeader } from '../export/csv-header.ts';
import { exportBaseName } from '../export/file-name.ts';
import { pageState } from '../export/page-state.ts';

export class DataExport extends LitElement {
  static override properties = {
    table: { attribute: false }, json: { attribute: false }, rows: { attribute: false }, command: { type: String }, name: { type: String },
    copied: { state: true },
  };
  declare table: Table | (() => Table) | null;
  declare json: unknown;
  declare rows: number | null;
  declare command: string;
  declare name: string;
  declare copied: boolean;

  constructor() {
    super();
    this.table = null;
    this.json = null;
    this.rows = null;
    this.command = '';
    this.name = 'atlas';
    this.copied = false;
  }

  static override styles = [sharedStyles, css`
    :host { display: block; margin-top: 8px; }
    code { display: block; font-family: 'DejaVu Sans Mono', monospace; font-size: 12px; background: #f1f3f6;
      border: 1px solid var(--line); border-radius: 4px; padding: 5px 8px; white-space: pre-wrap; word-break: break-all; margin-top: 6px; }
  `];

  private async copy() {
    try {
      await navigator.clipboard.writeText(this.command);
      this.copied = true;
    } catch {
      // no clipboard permission: select the text so Ctrl+C copies it
      const code = this.renderRoot.querySelector('code');
      if (code) getSelection()?.selectAllChildren(code);
    }
    setTimeout(() => { this.copied = false; }, 2000);
  }

  private csv() {
    const t = typeof this.table === 'function' ? this.table() : this.table;
    if (!t) return;
    const s = pageState();
    const header = inputHeader(s, this.name, { command: this.command, written: new Date(), rows: t.rows.length });
    downloadText(commentedCsv(t, header), `${exportBaseName(s, this.name)}.csv`, 'text/csv');
  }

  private saveJson() {
    const j = typeof this.json === 'function' ? (this.json as () => unknown)() : this.json;
    downloadText(JSON.stringify(j, null, 1), `${exportBaseName(pageState(), this.name)}.json`, 'application/json');
  }

  override render() {
    const rows = this.rows ?? (typeof this.table === 'function' ? 0 : this.table?.rows.length ?? 0);
    return html`<div class="row" role="group" aria-label="Export the numbers of this view">
        <button ?disabled=${!this.table} @click=${this.csv} aria-label="Save the numbers as CSV">CSV</button>
        <button ?disabled=${this.json === null} @click=${this.saveJson}
          aria-label="Save the numbers as JSON">JSON</button>
        <span class="muted">${rows} rows</span>
        ${this.command ? html`<button @click=${this.copy}>Copy as command</button>
          <span role="status" class="muted">${this.copied ? 'copied' : ''}</span>` : nothing}
      </div>
      ${this.command ? html`<code class="command" aria-label="Command line for this view">${this.command}</code>` : nothing}`;
  }
}
customElements.define('data-export', DataExport);

declare global { interface HTMLElementTagNameMap { 'data-export': DataExport } }
