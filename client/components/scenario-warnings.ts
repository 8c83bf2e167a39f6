/**
 * <scenario-warnings>: the scenario's warnings (accepted, probably not meant: two wells at one
 * spot, a screen above the water table, water above ground, a well radius over 1 m), each with
 * the JSON pointer of its field, in the side panel above the tabs. Nothing is drawn when there is
 * none. Computed here with the shared `findScenarioWarnings`, the same list the API returns.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import { findScenarioWarnings, type Scenario, type ScenarioWarning } from '../../shared/schema';

const STYLE = `
scenario-warnings .dd-scenario-warnings { margin: 6px 8px; padding: 4px 8px; border-left: 4px solid #b26b00; background: #fff8e8; font-size: 12px; }
scenario-warnings .dd-scenario-warnings summary { cursor: pointer; font-weight: 600; color: #6b4000; }
scenario-warnings .dd-scenario-warnings ul { margin: 4px 0 2px; padding-left: 16px; }
scenario-warnings .dd-scenario-warnings code { font-size: 11px; }
`;

export class ScenarioWarnings extends LightElement {
  static override properties = { scenario: { attribute: false } };
  declare scenario: Scenario | undefined;
  private _for: Scenario | undefined = undefined;
  private _warnings: ScenarioWarning[] = [];

  constructor() {
    super();
    this.scenario = undefined;
  }

  /** The warnings of the current scenario (recomputed only when the scenario object changes). */
  get warnings(): ScenarioWarning[] {
    if (this.scenario !== this._for) {
      this._for = this.scenario;
      try {
        this._warnings = this.scenario ? findScenarioWarnings(this.scenario) : [];
      } catch {
        // A scenario mid-edit may not be valid yet; the app's issue list speaks for it then.
        this._warnings = [];
      }
    }
    return this._warnings;
  }

  override render() {
    const ws = this.warnings;
    if (ws.length === 0) return nothing;
    return html`<details class="dd-scenario-warnings" open role="status" aria-label="Scenario warnings">
      <summary>${ws.length} warning${ws.length === 1 ? '' : 's'} — accepted, but check</summary>
      <ul>${ws.map((w) => html`<li data-warning=${w.code}><code>${w.path}</code> ${w.message}</li>`)}</ul>
    </details>`;
  }
}

function installStyle(): void {
  if (typeof document === 'undefined' || document.getElementById('dd-scenario-warnings-style')) return;
  const style = document.createElement('style');
  style.id = 'dd-scenario-warnings-style';
  style.textContent = STYLE;
  document.head.append(style);
}
installStyle();
if (!customElements.get('scenario-warnings')) customElements.define('scenario-warnings', ScenarioWarnings);
