/**
 * <site-import-panel> (the Import tab) in a real browser against the real server: import the
 * invented Ferry Road DXF site plan and AGS ground investigation (fixtures/imports/), see the
 * layers with their entity counts and the boreholes on the plan, apply the pit outline and a
 * ground profile confirmed layer by layer, and get plain messages for broken files. Logger
 * readings are mapped and sent to the Test tab. Needs the built client (npm run build).
 * Screenshots under artifacts/browser/.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { loadDemo, usePlanMap, type BrowserSession } from './browser-harness';
import type { Scenario } from '../../shared/schema';

let s: BrowserSession;
let page: Page;
const dxfPath = fileURLToPath(new URL('../../fixtures/imports/demo-site-plan.dxf', import.meta.url));
const agsPath = fileURLToPath(new URL('../../fixtures/imports/demo-site-investigation.ags', import.meta.url));
const sha256 = (file: string) => createHash('sha256').update(readFileSync(file)).digest('hex');

usePlanMap((session) => {
  s = session;
  page = session.page;
});

type WithImports = Scenario & { imports?: Array<{ kind: string; name: string; sha256: string; used: string }> };
const scenario = () => page.evaluate(() => (window as unknown as { __drydig: { scenario(): unknown } }).__drydig.scenario()) as Promise<WithImports>;

describe('<site-import-panel>', () => {
  it('reads the DXF site plan in the worker: layers with entity counts, the unit from $INSUNITS, a backdrop and a dashed preview of the pit outline', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-import"]');
    await page.setInputFiles('dxf-import-section input[name="import-dxf"]', dxfPath);
    await page.waitForSelector('dxf-import-section [data-test="dxf-layers"]');
    const rows = await page.locator('dxf-import-section [data-test="dxf-layers"] tbody tr').evaluateAll((trs) => trs.map((tr) => [tr.getAttribute('data-layer'), tr.children[1]!.textContent!.trim()]));
    expect(rows).toEqual([
      ['KERB', 'LINE 1 · ARC 1'],
      ['NEIGHBOUR', 'LWPOLYLINE 1'],
      ['PIT', 'LWPOLYLINE 1'],
      ['SITE', 'LWPOLYLINE 1'],
      ['TEXT', 'TEXT 1'],
      ['TREES', 'CIRCLE 1'],
      ['WELLS', 'POINT 2 · INSERT 1'],
    ]);
    expect(await page.locator('dxf-import-section [data-test="dxf-summary"]').innerText()).toMatch(/7 layers, 10 entities, unit metres/);
    // Every layer is drawn as backdrop at first: 6 lines (kerb line and arc, neighbour, pit, site, tree circle).
    expect(await page.locator('dxf-import-section section').getAttribute('data-backdrop-lines')).toBe('6');
    // The first layer with closed polylines is offered as the outlines: PIT, previewed dashed on the plan.
    expect(await page.locator('dxf-import-section [data-test="dxf-outline-preview"]').innerText()).toMatch(/layer PIT gives 1 outline\(s\) — 900\s*m² with 4 corners/);
    expect(await page.locator('path.dd-import-preview').count()).toBe(1);
    await page.locator('tr[data-layer="WELLS"] input[name="dxf-marks-layer"]').check();
    expect(await page.locator('dxf-import-section [data-test="dxf-marks-preview"]').innerText()).toMatch(/gives 3 point\(s\): point, point, WELLMARK/);
    expect(await page.locator('path.dd-import-preview-mark').count()).toBe(3);
    // Nothing has entered the scenario yet.
    expect((await scenario()).imports).toBeUndefined();
    await page.locator('dxf-import-section [data-test="dxf-layers"]').scrollIntoViewIfNeeded();
    await s.screenshot('site-import-dxf-layers');
  }, 60_000);

  it('applies the PIT outline as the excavation, replacing the demo pit, and keeps the file’s SHA-256', async () => {
    await page.fill('dxf-import-section input[name="dxf-formation"]', '7.5');
    await page.locator('dxf-import-section input[name="dxf-formation"]').dispatchEvent('change');
    await page.locator('dxf-import-section input[name="dxf-replace"]').check();
    await page.click('dxf-import-section button[name="dxf-apply-outlines"]');
    expect(await page.locator('dxf-import-section [data-test="dxf-applied"]').innerText()).toMatch(/Added excavation\(s\) PIT-1 from layer PIT, replacing/);
    const after = await scenario();
    expect(after.excavations).toEqual([{ id: 'PIT-1', outline: [[389200, 5819400], [389230, 5819400], [389230, 5819430], [389200, 5819430]], formationLevel_m: 7.5, margin_m: 0.5 }]);
    expect(after.imports).toEqual([expect.objectContaining({ kind: 'dxf', name: 'demo-site-plan.dxf', sha256: sha256(dxfPath), used: 'outlines from layer PIT: PIT-1' })]);
  }, 60_000);

  it('shows the AGS boreholes on the plan with their strata and water strikes', async () => {
    await page.setInputFiles('ags-import-section input[name="import-ags"]', agsPath);
    await page.waitForSelector('ags-import-section [data-test="ags-boreholes"]');
    expect(await page.locator('ags-import-section [data-test="ags-boreholes"] tbody tr').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-borehole')))).toEqual(['BH1', 'BH2']);
    expect(await page.locator('.leaflet-marker-pane .dd-borehole').count()).toBe(2);
    const log = page.locator('ags-import-section [data-test="ags-log"]');
    expect(await log.getAttribute('data-borehole')).toBe('BH1');
    expect(await log.locator('tbody tr').count()).toBe(3);
    expect(await log.innerText()).toMatch(/1\.20–7\.80\s+13\.00 to 6\.40\s+Firm grey silty CLAY/);
    expect(await log.locator('[data-test="ags-strikes"]').innerText()).toMatch(/Water struck at 7\.80 m depth \(level 6\.40\s*m\), rose to 1\.20 m depth \(level 13\.00\s*m\) after 20 min/);
    // A borehole picked on the map shows its log.
    await page.locator('.leaflet-marker-pane .dd-borehole').nth(1).click();
    expect(await page.locator('ags-import-section [data-test="ags-log"]').getAttribute('data-borehole')).toBe('BH2');
  }, 60_000);

  it('builds the ground profile from BH1, applies it only once every layer is confirmed, and keeps the AGS file’s hash', async () => {
    await page.click('ags-import-section button[name="ags-build"]');
    const profile = page.locator('ags-import-section [data-test="ags-profile"]');
    await profile.waitFor();
    expect(await profile.locator('tbody tr[data-layer]').evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-layer')))).toEqual(['mg-1', 'alv-2', 'rtd-3']);
    const apply = page.locator('ags-import-section button[name="ags-apply"]');
    expect(await apply.isDisabled()).toBe(true);
    // The designer changes the clay's saturated unit weight, then confirms every layer.
    await page.fill('tr[data-layer="alv-2"] input[name="ags-gamma-sat"]', '20');
    await page.locator('tr[data-layer="alv-2"] input[name="ags-gamma-sat"]').dispatchEvent('change');
    for (const box of await page.locator('ags-import-section input[name="ags-confirm"]').all()) await box.check();
    expect(await apply.isDisabled()).toBe(false);
    // The ninth tab and the wide tables stay inside the side panel: the page never scrolls sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await s.screenshot('site-import-dxf-ags');
    await apply.click();
    expect(await page.locator('ags-import-section [data-test="ags-applied"]').innerText()).toMatch(/Applied: ground profile: 3 layers; ground level 14\.2 m; static level 13 m; aquifer top 6\.4 m \(top of rtd-3\)/);
    const after = await scenario();
    expect(after.ground?.layers.map((l) => [l.id, l.top_m, l.bottom_m, l.kind, l.unitWeightSat_kN_m3])).toEqual([
      ['mg-1', 14.2, 13, 'granular', 19],
      ['alv-2', 13, 6.4, 'plug', 20],
      ['rtd-3', 6.4, -10.8, 'granular', 21],
    ]);
    expect([after.groundLevel_m, after.aquifer.staticLevel_m, after.aquifer.top_m, after.aquifer.base_m]).toEqual([14.2, 13, 6.4, -15]);
    expect(after.imports?.map((r) => [r.kind, r.sha256])).toEqual([['dxf', sha256(dxfPath)], ['ags', sha256(agsPath)]]);
    // The result is a valid scenario: the map shows no "needs fixing" box.
    expect(await page.locator('.dd-issues').count()).toBe(0);
    await s.screenshot('site-import-applied');
    expect(s.errors).toEqual([]);
  }, 60_000);

  it('names what is wrong with a broken DXF or AGS file and keeps the scenario as it was', async () => {
    const before = await scenario();
    await page.setInputFiles('dxf-import-section input[name="import-dxf"]', { name: 'broken.dxf', mimeType: 'application/dxf', buffer: Buffer.from('this is not a drawing\n') });
    expect(await page.locator('dxf-import-section [data-test="dxf-error"]').innerText()).toMatch(/^DXF file: not an ASCII DXF file/);
    await page.setInputFiles('ags-import-section input[name="import-ags"]', { name: 'broken.ags', mimeType: 'text/plain', buffer: Buffer.from('"GROUP","LOCA"\n"HEADING","LOCA_ID","LOCA_NATE","LOCA_NATN","LOCA_GL"\n"UNIT","","m","m","m"\n"TYPE","ID","2DP","2DP","2DP"\n"DATA","BH9","abc","5819400.00","14.00"\n') });
    expect(await page.locator('ags-import-section [data-test="ags-error"]').innerText()).toMatch(/^AGS file: line 5: LOCA LOCA_NATE "abc" is not a number/);
    expect(await scenario()).toEqual(before);
  }, 60_000);

  it('maps a logger file’s columns, previews it and sends the readings to the Test tab', async () => {
    const csv = 'logged_at,level_m\n2027-03-01T07:00:00Z,13.00\n2027-03-01T07:01:00Z,12.80\n2027-03-01T07:10:00Z,12.40\n2027-03-01T08:00:00Z,12.00\n';
    await page.setInputFiles('logger-import-section input[name="import-logger"]', { name: 'pz-a.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.waitForSelector('logger-import-section [data-test="logger-preview"]');
    expect(await page.locator('logger-import-section select[name="logger-time-format"]').inputValue()).toBe('iso');
    await page.click('logger-import-section button[name="logger-read"]');
    expect(await page.locator('logger-import-section [data-test="logger-readings"]').innerText()).toMatch(/^4 readings from 0 s to 3600 s .* 4 with a drawdown, 4 with a level/);
    await page.fill('logger-import-section input[name="logger-distance"]', '18');
    await page.locator('logger-import-section input[name="logger-distance"]').dispatchEvent('change');
    await page.click('logger-import-section button[name="logger-to-test"]');
    await page.waitForSelector('pumping-test-panel [data-test="file-name"]');
    expect(await page.locator('pumping-test-panel [data-test="file-name"]').innerText()).toMatch(/pz-a\.csv \(pz-a\) · 3 rows/);
    expect(await page.locator('pumping-test-panel textarea[name="test-csv"]').inputValue()).toBe('time_s,drawdown_m,distance_m,well\n60,0.1999999999999993,18,pz-a\n600,0.5999999999999996,18,pz-a\n3600,1,18,pz-a\n');
    expect(s.errors).toEqual([]);
  }, 60_000);

  it('enters the logger readings as site readings of a piezometer once the scenario is stored', async () => {
    await page.click('button[name="tab-import"]');
    await page.selectOption('logger-import-section select[name="logger-piezometer"]', 'PZ1');
    await page.click('logger-import-section button[name="logger-to-site"]');
    expect(await page.locator('logger-import-section [data-test="logger-error"]').innerText()).toMatch(/save the scenario in the Store tab/);
    await page.click('button[name="tab-store"]');
    const store = page.locator('scenario-store-panel');
    await store.locator('input[name="savedBy"]').fill('desk designer');
    await store.getByRole('button', { name: 'Store on server', exact: true }).click();
    await expect.poll(() => store.locator('.status').first().innerText()).toMatch(/Stored, showing revision 1/);
    await page.click('button[name="tab-import"]');
    await page.click('logger-import-section button[name="logger-to-site"]');
    await expect.poll(() => page.locator('logger-import-section [data-test="logger-sent"]').innerText()).toMatch(/^Entered 4 readings for PZ1/);
    const readings = await page.evaluate(async () => {
      const id = (document.querySelector('scenario-store-panel') as unknown as { scenarioId: string }).scenarioId;
      return ((await (await fetch(`/api/v1/scenarios/${id}/readings`)).json()) as { readings: Array<{ piezometerId: string; level_m: number; measuredAt: string }> }).readings;
    });
    expect(readings.map((r) => [r.piezometerId, r.level_m, r.measuredAt])).toEqual([
      ['PZ1', 13, '2027-03-01T07:00:00Z'],
      ['PZ1', 12.8, '2027-03-01T07:01:00Z'],
      ['PZ1', 12.4, '2027-03-01T07:10:00Z'],
      ['PZ1', 12, '2027-03-01T08:00:00Z'],
    ]);
    expect(s.errors).toEqual([]);
  }, 60_000);
});
