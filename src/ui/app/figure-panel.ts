/**
 * <figure-panel>: shows one rendered figure (SVG markup from renderFigure), with buttons
 * to save it as SVG, vector PDF or PNG, at a figure size shared by every figure (as on
 * screen, single or double journal column, or a custom width; PNG at 150/300/600 dpi),
 * in files named after the view and its key inputs (export/file-name.ts). When `interactive`, pointer and keyboard positions are turned
 * back into data coordinates through the figure's frame and sent as events:
 *   plot-hover {x, y} while the pointer (or the keyboard cursor) is over the plot area,
 *   plot-leave when it leaves, plot-select {x, y} on click or Enter.
 * Arrow keys move the keyboard cursor by `keyStep` data units (Shift: five steps).
 * `stale` (a short text, e.g. "out of date, recomputing") marks a figure whose inputs have
 * changed and whose new result has not arrived: a visible band over the figure, dimmed.
 */
import { LitElement, html, css } from 'lit';
import { unsafeHTML } from 'lit/directives/unsafe-html.js';
import type { Frame } from '../plot/frame.ts';
import { sharedStyles } from './shared-styles.ts';
import { downloadBlob } from '../export/download.ts';
import { pdfFile, pngFile, svgFile } from '../export/figure-image.ts';
import { exportBaseName } from '../export/file-name.ts';
import { printFigure } from '../export/print-layout.ts';
import { pageState } from '../export/page-state.ts';
import { loadFigureSize, onFigureSizeChange, saveFigureSize } from '../export/export-settings.ts';
import {
  type FigureSize, type SizePreset, DPI_CHOICES, PRESET_LABELS, bodyTextPoints, customWidthProblem, pngPixels, pngProblem, printedInches,
} from '../export/figure-size.ts';

/** Body text below this many points is too small for print (journals ask for about 6 pt or more; common practice, no source). */
const SMALL_PRINT_PT = 6;

export interface RenderedFigure {
  svg: string; frame: Frame; name: string; title: string;
  /** The same figure built again at widthPx x heightPx (CSS px), for export at a print size (export/print-layout.ts). */
  layout?: (widthPx: number, heightPx: number) => RenderedFigure;
}

export class FigurePanel extends LitElement {
  static override properties = {
    figure: { attribute: false },
    interactive: { type: Boolean },
    keyStep: { attribute: false },
    busy: { type: Boolean },
    cursor: { attribute: false },
    stale: { type: String },
    size: { state: true },
    sizeOpen: { state: true },
    inchesText: { state: true },
    failure: { state: true },
  };
  declare figure: RenderedFigure | null;
  declare interactive: boolean;
  declare keyStep: [number, number] | null;
  declare busy: boolean;
  /** A cursor mark at data (x, y), drawn over the figure (not part of it, so never exported). */
  declare cursor: [number, number] | null;
  /** Empty while the figure is current; else the words of the out-of-date mark. */
  declare stale: string;
  /** The export size (shared by every figure, export-settings.ts). */
  declare size: FigureSize;
  declare sizeOpen: boolean;
  /** The custom width as typed. */
  declare inchesText: string;
  /** Why the last save failed, in the page's words; '' when it did not. */
  declare failure: string;
  private keyCursor: [number, number] | null = null;
  private unlisten: (() => void) | null = null;

  constructor() {
    super();
    this.figure = null;
    this.interactive = false;
    this.keyStep = null;
    this.busy = false;
    this.cursor = null;
    this.stale = '';
    this.size = loadFigureSize();
    this.sizeOpen = false;
    this.inchesText = String(this.size.inches);
    this.failure = '';
  }

  override connectedCallback() {
    super.connectedCallback();
    this.unlisten = onFigureSizeChange(() => { this.size = loadFigureSize(); });
  }

  override willUpdate(changed: Map<string, unknown>) {
    // a failed save speaks of the figure it was asked for, not of the next one
    if (changed.has('figure')) this.failure = '';
  }

  override disconnectedCallback() {
    super.disconnectedCallback();
    this.unlisten?.();
    this.unlisten = null;
  }

  static override styles = [sharedStyles, css`
    :host { display: block; }
    .host { position: relative; }
    .host svg { display: block; width: 100%; height: auto; max-width: 100%; }
    .host.interactive { cursor: crosshair; }
    .tools { display: flex; gap: 6px; justify-content: flex-end; align-items: center; flex-wrap: wrap; margin-top: 4px; }
    .tools button { font-size: 12.5px; padding: 2px 8px; }
    .size-note { font-size: 12px; }
    .size-panel { display: flex; gap: 10px; justify-content: flex-end; align-items: center; flex-wrap: wrap; margin-top: 4px; font-size: 12.5px; }
    .size-panel input { width: 5em; }
    .size-panel select, .size-panel input { font-size: 12.5px; }
    .host:focus-visible { outline: 3px solid #d9a21b; }
    .cursor { position: absolute; width: 9px; height: 9px; margin: -5px 0 0 -5px; border: 1.5px solid #000;
      background: #fff; border-radius: 50%; pointer-events: none; }
    .host.is-stale svg { opacity: 0.55; }
    .stale-mark { position: absolute; left: 50%; top: 8px; transform: translateX(-50%); pointer-events: none;
      background: #7a1f1f; color: #fff; font-size: 13px; font-weight: 600; padding: 3px 10px; border-radius: 4px; white-space: nowrap; }
  `];

  /** Data coordinates of a client position, or null outside the plot area. */
  private toData(clientX: number, clientY: number): [number, number] | null {
    const f = this.figure?.frame;
    const svg = this.renderRoot.querySelector('svg');
    if (!f || !svg) return null;
    const r = svg.getBoundingClientRect();
    const s = r.width / f.width;
    const X = (clientX - r.left) / s, Y = (clientY - r.top) / s;
    const { x0, x1, y0, y1 } = f.inner;
    if (X < x0 || X > x1 || Y < y0 || Y > y1) return null;
    return [f.x.invert(X), f.y.invert(Y)];
  }

  /** Client (viewport) coordinates of data point (x, y): where a pointer must go to point at it. */
  dataToClient(x: number, y: number): { x: number; y: number } | null {
    const f = this.figure?.frame;
    const svg = this.renderRoot.querySelector('svg');
    if (!f || !svg) return null;
    const r = svg.getBoundingClientRect();
    const s = r.width / f.width;
    return { x: r.left + f.x(x) * s, y: r.top + f.y(y) * s };
  }

  private emit(type: string, detail?: { x: number; y: number }) {
    this.dispatchEvent(new CustomEvent(type, { detail, bubbles: true, composed: true }));
  }

  private onMove = (e: PointerEvent) => {
    const d = this.toData(e.clientX, e.clientY);
    if (d) { this.keyCursor = d; this.emit('plot-hover', { x: d[0], y: d[1] }); } else this.emit('plot-leave');
  };

  private onClick = (e: MouseEvent) => {
    const d = this.toData(e.clientX, e.clientY);
    if (d) this.emit('plot-select', { x: d[0], y: d[1] });
  };

  private onKey = (e: KeyboardEvent) => {
    const f = this.figure?.frame;
    if (!f || !this.interactive) return;
    const [dx, dy] = this.keyStep ?? [(f.x.domain[1] - f.x.domain[0]) / 50, (f.y.domain[1] - f.y.domain[0]) / 50];
    const m = e.shiftKey ? 5 : 1;
    const c = this.keyCursor ?? [(f.x.domain[0] + f.x.domain[1]) / 2, (f.y.domain[0] + f.y.domain[1]) / 2];
    const moves: Record<string, [number, number]> = { ArrowLeft: [-dx, 0], ArrowRight: [dx, 0], ArrowUp: [0, dy], ArrowDown: [0, -dy] };
    if (moves[e.key]) {
      e.preventDefault();
      const clampX = (v: number) => Math.min(Math.max(v, Math.min(...f.x.domain)), Math.max(...f.x.domain));
      const clampY = (v: number) => Math.min(Math.max(v, Math.min(...f.y.domain)), Math.max(...f.y.domain));
      this.keyCursor = [clampX(c[0] + m * moves[e.key][0]), clampY(c[1] + m * moves[e.key][1])];
      this.emit('plot-hover', { x: this.keyCursor[0], y: this.keyCursor[1] });
    } else if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      this.keyCursor = c;
      this.emit('plot-select', { x: c[0], y: c[1] });
    }
  };

  /** The cursor, placed in percent of the figure so it follows the figure's scaling. */
  private cursorMark(fig: RenderedFigure) {
    if (!this.cursor) return null;
    const f = fig.frame;
    const left = (f.x(this.cursor[0]) / f.width) * 100, top = (f.y(this.cursor[1]) / f.height) * 100;
    return html`<div class="cursor" style="left:${left}%;top:${top}%"></div>`;
  }

  private async save(kind: 'svg' | 'pdf' | 'png') {
    const fig = this.figure;
    if (!fig) return;
    const problem = this.sizeProblem(fig);
    if (problem) { this.failure = problem; return; }
    this.failure = '';
    try {
      // at a print size, the figure laid out again at the printed width when it can be
      const out = printFigure(fig, this.size);
      const { width, height } = out.frame;
      const blob = kind === 'svg' ? svgFile(out.svg, this.size, width, height)
        : kind === 'pdf' ? await pdfFile(out.svg, out.title, this.size, width)
          : await pngFile(out.svg, width, height, this.size);
      downloadBlob(blob, `${exportBaseName(pageState(), fig.name)}.${kind}`);
    } catch (e) {
      this.failure = `The ${kind.toUpperCase()} could not be made: ${e instanceof Error ? e.message : String(e)}`;
    }
  }

  /** Why the chosen size cannot be exported, or ''. */
  private sizeProblem(fig: RenderedFigure): string {
    if (this.size.preset === 'custom') {
      const p = customWidthProblem(this.inchesText);
      if (p) return `Custom width: ${p}.`;
    }
    const out = printFigure(fig, this.size);
    return pngProblem(this.size, out.frame.width, out.frame.height);
  }

  private setSize(patch: Partial<FigureSize>) {
    this.size = { ...this.size, ...patch };
    saveFigureSize(this.size);
  }

  private onInches(e: Event) {
    this.inchesText = (e.target as HTMLInputElement).value;
    if (!customWidthProblem(this.inchesText)) this.setSize({ inches: Number(this.inchesText) });
  }

  /** One line saying what the saved files will be: printed width, PNG pixels, text size. */
  private sizeNote(fig: RenderedFigure) {
    const out = printFigure(fig, this.size);
    const relaid = out !== fig;
    const { width, height } = out.frame;
    const px = pngPixels(this.size, width, height);
    const pt = bodyTextPoints(this.size, width);
    const inches = printedInches(this.size, width);
    const what = this.size.preset === 'screen' ? 'as on screen' : this.size.preset === 'custom' ? 'custom' : `${this.size.preset} column`;
    const small = pt < SMALL_PRINT_PT
      ? html` <span class="err">(small for print: ${fig.layout ? 'a wider size gives larger text' : 'a narrower window lays the figure out narrower'})</span>` : '';
    return html`<span class="size-note muted">${what}, ${inches.toFixed(2)} in wide${relaid ? ', laid out for this width' : ''}; PNG ${px.width} × ${px.height} px at ${this.size.dpi} dpi;
      text ${pt.toFixed(1)} pt${small}</span>`;
  }

  private sizePanel(fig: RenderedFigure) {
    const custom = this.size.preset === 'custom';
    const problem = custom ? customWidthProblem(this.inchesText) : '';
    return html`<div class="size-panel" role="group" aria-label="Size of saved figures (all figures)">
      <label>Figure size <select name="export-size" @change=${(e: Event) => this.setSize({ preset: (e.target as HTMLSelectElement).value as SizePreset })}>
        ${(Object.keys(PRESET_LABELS) as SizePreset[]).map((p) => html`<option value=${p} ?selected=${p === this.size.preset}>${PRESET_LABELS[p]}</option>`)}
      </select></label>
      ${custom ? html`<label>Width (in) <input name="export-inches" inputmode="decimal" .value=${this.inchesText}
        aria-invalid=${problem ? 'true' : 'false'} @input=${this.onInches}></label>${problem ? html`<span class="err">${problem}</span>` : ''}` : ''}
      <label>PNG resolution <select name="export-dpi" @change=${(e: Event) => this.setSize({ dpi: Number((e.target as HTMLSelectElement).value) })}>
        ${DPI_CHOICES.map((d) => html`<option value=${d} ?selected=${d === this.size.dpi}>${d} dpi</option>`)}
      </select></label>
      ${this.sizeNote(fig)}
    </div>`;
  }

  override render() {
    const fig = this.figure;
    if (!fig) return html`<div class="host muted" aria-busy=${this.busy ? 'true' : 'false'}>No figure yet.</div>`;
    return html`
      <div class="host ${this.interactive ? 'interactive' : ''} ${this.stale ? 'is-stale' : ''}" role=${this.interactive ? 'application' : 'figure'}
        aria-label=${fig.title + (this.interactive ? ' (arrow keys move the cursor, Enter opens the point)' : '')}
        tabindex=${this.interactive ? '0' : '-1'} aria-busy=${this.busy ? 'true' : 'false'}
        @pointermove=${this.interactive ? this.onMove : null} @pointerleave=${() => this.emit('plot-leave')}
        @click=${this.interactive ? this.onClick : null} @keydown=${this.onKey}>${unsafeHTML(fig.svg)}${this.cursorMark(fig)}${this.stale
          ? html`<div class="stale-mark" role="status">${this.stale}</div>` : null}</div>
      <div class="tools">
        <button class="size-toggle" aria-expanded=${this.sizeOpen ? 'true' : 'false'} @click=${() => { this.sizeOpen = !this.sizeOpen; }}
          title="Figure size and PNG resolution for the saved files">Size…</button>
        <button @click=${() => this.save('svg')} aria-label="Save ${fig.title} as SVG">SVG</button>
        <button @click=${() => this.save('pdf')} aria-label="Save ${fig.title} as vector PDF">PDF</button>
        <button @click=${() => this.save('png')} aria-label="Save ${fig.title} as PNG">PNG</button>
      </div>
      ${this.sizeOpen ? this.sizePanel(fig) : null}
      ${this.failure ? html`<p class="err" role="alert">${this.failure}</p>` : null}`;
  }
}
customElements.define('figure-panel', FigurePanel);

declare global { interface HTMLElementTagNameMap { 'figure-panel': FigurePanel } }
