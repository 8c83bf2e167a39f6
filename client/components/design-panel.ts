/** Placeholder for <design-panel>: filled in by the design issue. */
import { LitElement, html } from 'lit';
import type { Scenario } from '../../shared/schema';

export class DesignPanel extends LitElement {
  static override properties = { scenario: { attribute: false } };
  declare scenario: Scenario | undefined;
  override render() {
    return html`<p>Design solver not built yet.</p>`;
  }
}
if (!customElements.get('design-panel')) customElements.define('design-panel', DesignPanel);
