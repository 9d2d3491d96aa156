/**
 * Drag a box on a figure to zoom into it: a reactive controller for the element that holds
 * the figure panel. A press inside the plot area, a drag of more than DRAG_PX pixels and a
 * release report the box in data coordinates (clamped to the plot area) through onZoom;
 * the click that ends a drag is swallowed, so it does not also select a point. Escape calls
 * onBack. While dragging, a dashed box follows the pointer. Pointer positions are turned
 * into data coordinates through the figure's frame, as <figure-panel> does.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { Frame } from '../plot/frame.ts';

/** A drag shorter than this (px, either way) is a click, not a box. */
export const DRAG_PX = 6;

export interface ZoomBox { x: [number, number]; y: [number, number] }

export interface DragZoomOptions {
  /** The figure panel element (its shadow root holds the figure's svg) and the figure's frame. */
  panel(): HTMLElement | null;
  frame(): Frame | null | undefined;
  onZoom(box: ZoomBox): void;
  onBack(): void;
}

/** Data coordinates of a client position over the figure in `panel`, clamped to the plot area (null: no figure). */
export function clientToData(panel: HTMLElement, f: Frame, clientX: number, clientY: number, clamp: boolean): [number, number] | null {
  const svg = panel.shadowRoot?.querySelector('svg');
  if (!svg) return null;
  const r = svg.getBoundingClientRect();
  const s = r.width / f.width;
  let X = (clientX - r.left) / s, Y = (clientY - r.top) / s;
  const { x0, x1, y0, y1 } = f.inner;
  if (!clamp && (X < x0 || X > x1 || Y < y0 || Y > y1)) return null;
  X = Math.min(Math.max(X, x0), x1);
  Y = Math.min(Math.max(Y, y0), y1);
  return [f.x.invert(X), f.y.invert(Y)];
}

export class DragZoomController implements ReactiveController {
  private start: { x: number; y: number; id: number } | null = null;
  private dragging = false;
  private swallowClick = false;
  private box: HTMLDivElement | null = null;

  constructor(private readonly host: ReactiveControllerHost & HTMLElement, private readonly o: DragZoomOptions) {
    host.addController(this);
  }

  hostConnected(): void {
    this.host.addEventListener('pointerdown', this.down);
    this.host.addEventListener('pointermove', this.move);
    this.host.addEventListener('pointerup', this.up);
    this.host.addEventListener('pointercancel', this.cancel);
    this.host.addEventListener('click', this.click, true);
    this.host.addEventListener('keydown', this.key);
  }

  hostDisconnected(): void {
    this.host.removeEventListener('pointerdown', this.down);
    this.host.removeEventListener('pointermove', this.move);
    this.host.removeEventListener('pointerup', this.up);
    this.host.removeEventListener('pointercancel', this.cancel);
    this.host.removeEventListener('click', this.click, true);
    this.host.removeEventListener('keydown', this.key);
    this.cancel();
  }

  private overPanel(e: Event): HTMLElement | null {
    const panel = this.o.panel();
    return panel && e.composedPath().includes(panel) ? panel : null;
  }

  private down = (e: PointerEvent) => {
    const panel = this.overPanel(e), f = this.o.frame();
    if (e.button !== 0 || !panel || !f || !clientToData(panel, f, e.clientX, e.clientY, false)) return;
    this.start = { x: e.clientX, y: e.clientY, id: e.pointerId };
    this.dragging = false;
  };

  private move = (e: PointerEvent) => {
    const s = this.start;
    if (!s || e.pointerId !== s.id) return;
    if (!this.dragging && Math.max(Math.abs(e.clientX - s.x), Math.abs(e.clientY - s.y)) < DRAG_PX) return;
    if (!this.dragging) {
      this.dragging = true;
      this.host.setPointerCapture?.(e.pointerId);
    }
    this.drawBox(s.x, s.y, e.clientX, e.clientY);
  };

  private up = (e: PointerEvent) => {
    const s = this.start;
    if (!s || e.pointerId !== s.id) return;
    const dragged = this.dragging;
    this.cancel();
    if (!dragged) return;
    this.swallowClick = true;
    setTimeout(() => { this.swallowClick = false; }, 0);
    if (Math.abs(e.clientX - s.x) < DRAG_PX || Math.abs(e.clientY - s.y) < DRAG_PX) return; // a thin line, not a box
    const panel = this.o.panel(), f = this.o.frame();
    if (!panel || !f) return;
    const a = clientToData(panel, f, s.x, s.y, true), b = clientToData(panel, f, e.clientX, e.clientY, true);
    if (!a || !b) return;
    this.o.onZoom({ x: [Math.min(a[0], b[0]), Math.max(a[0], b[0])], y: [Math.min(a[1], b[1]), Math.max(a[1], b[1])] });
  };

  private cancel = () => {
    if (this.start && this.dragging) this.host.releasePointerCapture?.(this.start.id);
    this.start = null;
    this.dragging = false;
    this.box?.remove();
    this.box = null;
  };

  private click = (e: MouseEvent) => {
    if (this.swallowClick) { e.stopPropagation(); e.preventDefault(); this.swallowClick = false; }
  };

  private key = (e: KeyboardEvent) => {
    if (e.key !== 'Escape' || e.defaultPrevented) return; // an open point took it first
    if (this.start) { this.cancel(); return; }
    this.o.onBack();
  };

  /** The dashed box between two client positions (fixed to the viewport, over everything). */
  private drawBox(x0: number, y0: number, x1: number, y1: number) {
    if (!this.box) {
      this.box = document.createElement('div');
      this.box.className = 'zoom-box';
      Object.assign(this.box.style, {
        position: 'fixed', border: '1.5px dashed #111827', background: 'rgba(255, 255, 255, 0.25)', pointerEvents: 'none', zIndex: '10',
      });
      (this.host.shadowRoot ?? this.host).appendChild(this.box);
    }
    Object.assign(this.box.style, {
      left: `${Math.min(x0, x1)}px`, top: `${Math.min(y0, y1)}px`, width: `${Math.abs(x1 - x0)}px`, height: `${Math.abs(y1 - y0)}px`,
    });
  }
}
