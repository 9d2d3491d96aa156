/**
 * <figure-panel>: shows one rendered figure (SVG markup from renderFigure), with buttons
 * to save it as SVG or PNG. When `interactive`, pointer and keyboard positions are turned
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
import { pngFile, svgFile } from '../export/figure-image.ts';

export interface RenderedFigure { svg: string; frame: Frame; name: string; title: string }

export class FigurePanel extends LitElement {
  static override properties = {
    figure: { attribute: false },
    interactive: { type: Boolean },
    keyStep: { attribute: false },
    busy: { type: Boolean },
    cursor: { attribute: false },
    stale: { type: String },
  };
  declare figure: RenderedFigure | null;
  declare interactive: boolean;
  declare keyStep: [number, number] | null;
  declare busy: boolean;
  /** A cursor mark at data (x, y), drawn over the figure (not part of it, so never exported). */
  declare cursor: [number, number] | null;
  /** Empty while the figure is current; else the words of the out-of-date mark. */
  declare stale: string;
  private keyCursor: [number, number] | null = null;

  constructor() {
    super();
    this.figure = null;
    this.interactive = false;
    this.keyStep = null;
    this.busy = false;
    this.cursor = null;
    this.stale = '';
  }

  static override styles = [sharedStyles, css`
    :host { display: block; }
    .host { position: relative; }
    .host svg { display: block; width: 100%; height: auto; max-width: 100%; }
    .host.interactive { cursor: crosshair; }
    .tools { display: flex; gap: 6px; justify-content: flex-end; margin-top: 4px; }
    .tools button { font-size: 12.5px; padding: 2px 8px; }
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

  private async save(kind: 'svg' | 'png') {
    const fig = this.figure;
    if (!fig) return;
    const blob = kind === 'svg' ? svgFile(fig.svg) : await pngFile(fig.svg, fig.frame.width, fig.frame.height);
    downloadBlob(blob, `${fig.name}.${kind}`);
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
        <button @click=${() => this.save('svg')} aria-label="Save ${fig.title} as SVG">SVG</button>
        <button @click=${() => this.save('png')} aria-label="Save ${fig.title} as PNG">PNG</button>
      </div>`;
  }
}
customElements.define('figure-panel', FigurePanel);

declare global { interface HTMLElementTagNameMap { 'figure-panel': FigurePanel } }
