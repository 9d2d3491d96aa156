/**
 * A reactive controller that tracks the width of its host element (ResizeObserver while
 * connected) so a view can size its figures; the host re-renders when the width changes.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';

export class HostWidthController implements ReactiveController {
  /** Content width of the host in CSS pixels (the initial value until the first observation). */
  width: number;
  private readonly observer = new ResizeObserver((e) => {
    const w = Math.round(e[0].contentRect.width);
    if (w !== this.width) { this.width = w; this.host.requestUpdate(); }
  });

  constructor(private readonly host: ReactiveControllerHost & Element, initial = 900) {
    this.width = initial;
    host.addController(this);
  }

  hostConnected(): void { this.observer.observe(this.host); }
  hostDisconnected(): void { this.observer.disconnect(); }
}
