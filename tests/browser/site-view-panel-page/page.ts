/**
 * Test page for <scenario-store-panel> (tests/browser/site-view-store-panel.test.ts): stands in for
 * the editor — holds a scenario, lets the test edit its name, and takes `scenario-loaded` events.
 */
import '../../../client/components/scenario-store-panel';
import type { ScenarioStorePanel } from '../../../client/components/scenario-store-panel';
import type { Scenario } from '../../../shared/schema';
import demo from '../../../fixtures/demo-deepwells-confined.json';

const panel = document.querySelector('scenario-store-panel') as ScenarioStorePanel;
const name = document.getElementById('name') as HTMLInputElement;
const loaded = document.getElementById('loaded') as HTMLPreElement;
panel.scenario = structuredClone(demo) as unknown as Scenario;
name.value = panel.scenario.name;
document.getElementById('apply')!.addEventListener('click', () => {
  panel.scenario = { ...panel.scenario!, name: name.value };
});
panel.addEventListener('scenario-loaded', (e) => {
  const scenario = (e as CustomEvent<Scenario>).detail;
  panel.scenario = scenario;
  name.value = scenario.name;
  loaded.textContent = scenario.name;
});
