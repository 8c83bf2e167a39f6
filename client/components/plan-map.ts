/**
 * <plan-map>: the Leaflet plan in site metres. The element only hosts the map; its owner drives
 * it through `controller` and listens to `map-*` events (detail = the callback arguments).
 */
import { html } from 'lit';
import { LightElement } from './light-element';
import { LeafletMapController, type MapCallbacks } from '../map';

export class PlanMap extends LightElement {
  private _controller: LeafletMapController | null = null;

  /** The map controller (available after the element is first rendered). */
  get controller(): LeafletMapController | null {
    return this._controller;
  }

  override render() {
    return html`<div class="dd-map-host" role="application" aria-label="Plan map in site metres"></div>`;
  }

  override firstUpdated(): void {
    const host = this.querySelector<HTMLElement>('.dd-map-host')!;
    const forward = <K extends keyof MapCallbacks>(name: K) =>
      ((...args: unknown[]) => this.emit(`map-${name}`, args)) as MapCallbacks[K];
    const cb: MapCallbacks = {
      cursor: forward('cursor'),
      click: forward('click'),
      selectWell: forward('selectWell'),
      selectExcavation: forward('selectExcavation'),
      dragWell: forward('dragWell'),
      dragVertex: forward('dragVertex'),
      selectPiezometer: forward('selectPiezometer'),
      dragPiezometer: forward('dragPiezometer'),
      selectReceptor: forward('selectReceptor'),
      dragReceptor: forward('dragReceptor'),
      insertVertex: forward('insertVertex'),
      drawnOutline: forward('drawnOutline'),
      drawnLine: forward('drawnLine'),
      viewChanged: forward('viewChanged'),
      focusExcavation: forward('focusExcavation'),
    };
    this._controller = new LeafletMapController(host, cb);
    new ResizeObserver(() => this._controller?.invalidateSize()).observe(host);
    this.emit('map-ready', this._controller);
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this._controller?.destroy();
    this._controller = null;
  }
}
if (!customElements.get('plan-map')) customElements.define('plan-map', PlanMap);
