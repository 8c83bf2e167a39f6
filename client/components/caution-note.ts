/**
 * <caution-note>: the standing caution beside every result (design.md section 7), with the
 * model's own notes on request. Compact by default so it can sit on the map without hiding it.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';

export const CAUTION_TEXT =
  'Estimates from idealised models (homogeneous, isotropic aquifer; infinite except the boundaries drawn). ' +
  'Check against site investigation, pumping tests and local codes; a licensed engineer must approve any design.';

export class CautionNote extends LightElement {
  static override properties = { notes: { attribute: false }, compact: { type: Boolean } };
  declare notes: string[];
  declare compact: boolean;

  constructor() {
    super();
    this.notes = [];
    this.compact = false;
  }

  override render() {
    return html`<div class="dd-caution" role="note">
      <strong>Caution.</strong> ${CAUTION_TEXT}
      ${!this.compact && this.notes.length > 0
        ? html`<details class="dd-model-notes"><summary>Model assumptions (${this.notes.length})</summary>
            <ul>${this.notes.map((n) => html`<li>${n}</li>`)}</ul></details>`
        : nothing}
    </div>`;
  }
}
if (!customElements.get('caution-note')) customElements.define('caution-note', CautionNote);
