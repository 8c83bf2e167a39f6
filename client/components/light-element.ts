/**
 * Base of drydig's elements: Lit rendering into the element itself (no shadow root), so the one
 * global stylesheet and Leaflet's CSS apply everywhere and the app reads as one design.
 */
import { LitElement } from 'lit';

export class LightElement extends LitElement {
  protected override createRenderRoot(): HTMLElement {
    return this;
  }

  /** Dispatches a bubbling, composed CustomEvent. */
  protected emit<T>(name: string, detail: T): void {
    this.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
  }
}
