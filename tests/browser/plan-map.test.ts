/**
 * The plan-map page in a real browser against the real server: load the demo, place and drag
 * wells, generate a ring, import outlines, switch units, inspect and draw a section. Assertions
 * are on what the page shows (badge text, list entries, chart elements, canvas pixels);
 * `window.__drydig` is read only to wait for results and to find where a site point is drawn.
 * Screenshots of each state go to artifacts/browser/.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import proj4 from 'proj4';
import { clickSite, fieldsDrawn, loadDemo, pagePoint, settle, usePlanMap, type BrowserSession } from './browser-harness';
import demoWellpoints from '../../fixtures/demo-wellpoints-unconfined.json';

let s: BrowserSession;
let page: Page;

/** A fingerprint of the field canvas pixels: changes when the drawn contours change. */
async function canvasFingerprint(p: Page): Promise<string> {
  return p.evaluate(() => {
    const c = document.querySelector<HTMLCanvasElement>('canvas.dd-field-canvas');
    if (!c) return 'none';
    const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
    let h = 2166136261;
    for (let i = 0; i < d.length; i += 7) h = Math.imul(h ^ d[i]!, 16777619);
    return `${c.width}x${c.height}:${h >>> 0}`;
  });
}

async function badgeText(p: Page, id: string): Promise<string> {
  return (await p.locator(`.dd-map-top .dd-badge[data-excavation="${id}"]`).innerText()).replace(/\s+/g, ' ');
}

usePlanMap((session) => {
  s = session;
  page = session.page;
});

describe('the plan-map page', () => {
  it('opens on the well-point demo with contours, a legend, a met badge and the caution', async () => {
    await expect.poll(() => badgeText(page, 'pit-A')).toMatch(/pit-A Target met \d+\.\d\d m to spare/);
    // The legend lists the contour steps in metres and the symbols.
    const steps = await page.locator('map-legend .dd-scale li').allInnerTexts();
    expect(steps.length).toBeGreaterThanOrEqual(3);
    for (const t of steps) expect(t).toMatch(/^\d+\.\d+\s*m$/);
    await expect.poll(() => page.locator('.dd-map-caution').innerText()).toMatch(/Idealised model.*licensed engineer/);
    expect(await page.locator('.dd-caution').first().innerText()).toMatch(/licensed engineer/);
    // The engine's validity flags are listed the same in the legend and in the Results panel.
    const legendFlags = await page.locator('map-legend .dd-legend-flag').allInnerTexts();
    const panelFlags = await page.locator('results-panel .dd-flag strong').allInnerTexts();
    expect(legendFlags.map((t) => t.trim()).sort()).toEqual(panelFlags.map((t) => t.trim()).sort());
    // 66 wells drawn as markers.
    expect(await page.locator('path.dd-well').count()).toBe(66);
    expect(await canvasFingerprint(page)).not.toBe('none');
    await s.screenshot('01-demo-loaded');
    expect(s.errors).toEqual([]);
  });

  it('shows live site coordinates under the cursor', async () => {
    const q = await pagePoint(page, 20, 10);
    await page.mouse.move(q.x, q.y);
    await expect.poll(() => page.locator('.dd-cursor').innerText()).toMatch(/^E -?\d+\.\d\d\sm\s+N -?\d+\.\d\d\sm$/);
    const [, e, n] = /E (-?\d+\.\d\d)\sm\s+N (-?\d+\.\d\d)/.exec(await page.locator('.dd-cursor').innerText())!;
    // Within one screen pixel of the point the mouse is on (about 0.1 m at this zoom).
    expect(Math.abs(Number(e) - 20)).toBeLessThan(0.1);
    expect(Math.abs(Number(n) - 10)).toBeLessThan(0.1);
  });

  it('places a well with the Well tool', async () => {
    const before = await fieldsDrawn(page);
    await page.click('button[name="tool-add-well"]');
    await clickSite(page, 20, 45);
    await settle(page, before);
    await page.keyboard.press('Escape');
    expect(await page.locator('path.dd-well').count()).toBe(67);
    await page.click('button[name="tab-layout"]');
    expect(await page.locator('.dd-well-list button[data-well="WP67"]').count()).toBe(1);
    // The new well is selected and its editor shows where it is.
    // Placed where clicked, to the click's pixel (under 0.1 m at this zoom).
    expect(Math.abs(Number(await page.locator('well-editor input[name="x"]').inputValue()) - 20)).toBeLessThan(0.1);
    expect(Math.abs(Number(await page.locator('well-editor input[name="y"]').inputValue()) - 45)).toBeLessThan(0.1);
    await s.screenshot('02-well-placed');
  });

  it('undo removes the placed well and redo brings it back', async () => {
    await page.click('button[name="undo"]');
    await expect.poll(() => page.locator('path.dd-well').count()).toBe(66);
    await page.click('button[name="redo"]');
    await expect.poll(() => page.locator('path.dd-well').count()).toBe(67);
  });

  it('dragging a well moves it and the contours and shortfall badge follow', async () => {
    await loadDemo(page, 'deepwells');
    const badge0 = await badgeText(page, 'basement');
    expect(badge0).toMatch(/basement Short by (\d+\.\d\d) m/);
    const short0 = Number(/Short by (\d+\.\d\d)/.exec(badge0)![1]);
    const canvas0 = await canvasFingerprint(page);
    await s.screenshot('03-deepwells-before-drag');
    // Drag DW5 (south side) into the middle of the pit, in small steps like a hand would.
    const from = await pagePoint(page, 389215, 5819392);
    const to = await pagePoint(page, 389215, 5819415);
    const before = await fieldsDrawn(page);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let k = 1; k <= 12; k++) await page.mouse.move(from.x + ((to.x - from.x) * k) / 12, from.y + ((to.y - from.y) * k) / 12);
    await page.mouse.up();
    await settle(page, before);
    const badge1 = await badgeText(page, 'basement');
    const short1 = Number(/Short by (\d+\.\d\d)/.exec(badge1)?.[1] ?? '0');
    expect(badge1).not.toBe(badge0);
    expect(short1).toBeLessThan(short0);
    expect(await canvasFingerprint(page)).not.toBe(canvas0);
    // The well is where it was dropped (to the pixel: 1 px is well under a metre at this zoom).
    await page.click('button[name="tab-layout"]');
    await page.click('.dd-well-list button[data-well="DW5"]');
    expect(Math.abs(Number(await page.locator('well-editor input[name="y"]').inputValue()) - 5819415)).toBeLessThan(1);
    await s.screenshot('04-deepwells-after-drag');
    // One undo step for the whole drag.
    await page.click('button[name="undo"]');
    await expect.poll(async () => Number(await page.locator('well-editor input[name="y"]').inputValue())).toBe(5819392);
  });

  it('the ring generator previews numbered wells and places them in order', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-layout"]');
    await page.fill('input[name="ring-spacing_m"]', '6');
    await page.press('input[name="ring-spacing_m"]', 'Enter');
    await page.locator('input[name="ring-spacing_m"]').blur();
    await page.fill('input[name="ring-offset_m"]', '3');
    await page.locator('input[name="ring-offset_m"]').blur();
    await page.selectOption('select[name="ring-kind"]', 'deep');
    await page.click('button[name="ring-preview"]');
    const summary = await page.locator('.dd-ring-summary').innerText();
    const n = Number(/^(\d+) wells/.exec(summary)![1]);
    // Perimeter of the 30 m square offset by 3 m: 4 × 36 = 144 m → 24 wells at 6 m (exact).
    expect(n).toBe(24);
    expect(summary).toMatch(/24 wells at 6\sm along 144\sm/);
    await expect.poll(() => page.locator('path.dd-ring-preview').count()).toBe(24);
    expect(await page.locator('.dd-ring-number').first().innerText()).toBe('1');
    await s.screenshot('05-ring-preview');
    const before = await fieldsDrawn(page);
    await page.click('button[name="ring-place"]');
    await settle(page, before);
    expect(await page.locator('path.dd-well').count()).toBe(6 + 24);
    const ids = await page.locator('.dd-well-list button[data-well^="R"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-well')));
    expect(ids.slice(0, 3)).toEqual(['R01', 'R02', 'R03']);
    expect(ids).toHaveLength(24);
    // 24 more wells pumping: the worst shortfall in the basement must drop (from 1.96 m).
    await expect.poll(async () => Number(/Short by (\d+\.\d\d)/.exec(await badgeText(page, 'basement'))?.[1] ?? 0)).toBeLessThan(1.9);
    await s.screenshot('06-ring-placed');
  });

  it('imports a GeoJSON outline given in longitude/latitude into the site CRS', async () => {
    await loadDemo(page, 'deepwells');
    // Build the file from site corners with an independent proj4 UTM 33N definition (EPSG:32633).
    const utm = proj4('+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', 'EPSG:4326');
    const corners: Array<[number, number]> = [[389300, 5819500], [389320, 5819500], [389320, 5819520], [389300, 5819520]];
    const ring = [...corners, corners[0]!].map((c) => utm.forward(c));
    const geojson = { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { name: 'shaft-B' }, geometry: { type: 'Polygon', coordinates: [ring] } }] };
    await page.click('button[name="tab-layout"]');
    const before = await fieldsDrawn(page);
    await page.setInputFiles('input[name="import-geojson"]', { name: 'shaft.geojson', mimeType: 'application/geo+json', buffer: Buffer.from(JSON.stringify(geojson)) });
    await settle(page, before);
    await expect.poll(() => page.locator('excavation-editor .dd-ok').innerText()).toMatch(/Imported shaft-B/);
    await expect.poll(() => page.locator('.dd-map-top .dd-badge[data-excavation="shaft-B"]').count()).toBe(1);
    // Area 400 m² (20 m × 20 m) shows in the editor: the transform round-trips to the millimetre.
    expect(await page.locator('excavation-editor .dd-facts').innerText()).toMatch(/area 400\s*m²/);
    expect(await page.locator('path.dd-excavation').count()).toBe(2);
    // The map widens to show the new outline.
    const centre = await pagePoint(page, 389310, 5819510);
    const box = (await page.locator('plan-map').boundingBox())!;
    expect(centre.x).toBeGreaterThan(box.x);
    expect(centre.x).toBeLessThan(box.x + box.width);
    expect(centre.y).toBeGreaterThan(box.y);
    expect(centre.y).toBeLessThan(box.y + box.height);
    await s.screenshot('07-geojson-imported');
  });

  it('refuses a GeoJSON import when the scenario has no CRS, with a message saying why', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-layout"]');
    const geojson = { type: 'Feature', geometry: { type: 'Polygon', coordinates: [[[13, 52], [13.001, 52], [13.001, 52.001], [13, 52]]] } };
    await page.setInputFiles('input[name="import-geojson"]', { name: 'pit.geojson', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(geojson)) });
    await expect.poll(() => page.locator('excavation-editor .dd-error').innerText()).toMatch(/no coordinate system/);
    expect(await page.locator('path.dd-excavation').count()).toBe(1);
  });

  it('imports a CSV of easting/northing as a new excavation', async () => {
    const before = await fieldsDrawn(page);
    await page.setInputFiles('input[name="import-csv"]', { name: 'pit-b.csv', mimeType: 'text/csv', buffer: Buffer.from('easting,northing\n60,0\n70,0\n70,10\n60,10\n') });
    await settle(page, before);
    expect(await page.locator('path.dd-excavation').count()).toBe(2);
    expect(await page.locator('excavation-editor .dd-facts').innerText()).toMatch(/area 100\s*m²/);
  });

  it('switches to US customary units: feet, gpm and ft/d, stored values unchanged', async () => {
    await loadDemo(page, 'wellpoints');
    const metres = Number(/(\d+\.\d\d) m to spare/.exec(await badgeText(page, 'pit-A'))![1]);
    const before = await fieldsDrawn(page);
    await page.click('button[name="units-us"]');
    await settle(page, before);
    await expect.poll(() => badgeText(page, 'pit-A')).toMatch(/\d+\.\d\d ft to spare/);
    const feet = Number(/(\d+\.\d\d) ft to spare/.exec(await badgeText(page, 'pit-A'))![1]);
    // 1 ft = 0.3048 m exactly (NIST SP 811); both figures are rounded to 0.01.
    expect(Math.abs(feet * 0.3048 - metres)).toBeLessThan(0.01);
    // Automatic contour levels are round numbers in feet, not converted metres.
    const legend = (await page.locator('map-legend .dd-scale li').allInnerTexts()).map((t) => Number.parseFloat(t));
    expect((await page.locator('map-legend .dd-scale li').first().innerText())).toMatch(/ft$/);
    const step = Math.abs(legend[0]! - legend[1]!);
    expect([0.25, 0.5, 1, 2, 2.5, 5]).toContain(Number(step.toFixed(6)));
    for (const v of legend) expect(Math.abs(v / step - Math.round(v / step))).toBeLessThan(1e-6);
    await page.click('button[name="tab-layout"]');
    // The demo's rate in gpm: Q / (3.785411784e-3 m³ / 60 s) (NIST SP 811).
    const gpm = (demoWellpoints.wells[0]!.rate_m3_s / (3.785411784e-3 / 60)).toFixed(2);
    expect(await page.locator('.dd-well-list button[data-well="WP01"]').innerText()).toMatch(new RegExp(`${gpm.replace('.', '\\.')}\\s*gpm`));
    await page.click('button[name="tab-ground"]');
    expect(await page.locator('ground-panel input[name="conductivity_m_s"]').inputValue()).toBe('56.69'); // 2e-4 m/s × 86400 / 0.3048 = 56.69 ft/d
    expect(await page.locator('.leaflet-control-scale-line').first().innerText()).toMatch(/ft|mi/);
    await s.screenshot('08-us-units');
    const before2 = await fieldsDrawn(page);
    await page.click('button[name="units-si"]');
    await settle(page, before2);
    await expect.poll(() => badgeText(page, 'pit-A')).toMatch(/m to spare/);
  });

  it('clicking the map shows level, drawdown and a level-versus-time chart there', async () => {
    await page.click('button[name="tool-select"]');
    await clickSite(page, 20, 10);
    await expect.poll(() => page.locator('[data-inspect="level"]').innerText()).toMatch(/^\d+\.\d\d\s*m$/);
    const dd = await page.locator('[data-inspect="drawdown"]').innerText();
    expect(Number.parseFloat(dd)).toBeGreaterThan(3);
    expect(await page.locator('time-chart path.dd-curve').count()).toBe(1);
    expect(await page.locator('time-chart line.dd-target').count()).toBe(1);
    await s.screenshot('09-inspect-point');
  });

  it('draws a section line and shows ground, target, water level and the wells it cuts', async () => {
    await loadDemo(page, 'deepwells');
    if (await page.locator('.dd-drawer .dd-close').count()) await page.click('.dd-drawer .dd-close');
    await page.click('button[name="tool-section"]');
    // Diagonally through DW1, across the pit, through DW3.
    await clickSite(page, 389180, 5819380);
    await clickSite(page, 389250, 5819450);
    await expect.poll(() => page.locator('section-chart path.dd-water').count()).toBe(1);
    const d = await page.locator('section-chart path.dd-water').getAttribute('d');
    expect(d!.split('L').length).toBeGreaterThan(100);
    expect(await page.locator('section-chart path.dd-ground').count()).toBe(1);
    expect(await page.locator('section-chart line.dd-target').count()).toBeGreaterThanOrEqual(1);
    // The line runs through DW1 and DW3 and no other well comes within 2 m of it.
    const wells = await page.locator('section-chart .dd-section-well text').allTextContents();
    expect(wells.sort()).toEqual(['DW1', 'DW3']);
    expect(await page.locator('section-chart').innerText()).toMatch(/piezometric level/);
    await s.screenshot('10-section');
  });

  it('names the field when a typed value is not a number, and keeps the old value', async () => {
    await page.click('button[name="tab-layout"]');
    await page.click('.dd-well-list button[data-well="DW1"]');
    await page.locator('well-editor input[name="rate_m3_s"]').fill('lots');
    await page.locator('well-editor input[name="rate_m3_s"]').blur();
    await expect.poll(() => page.locator('well-editor .dd-error').innerText()).toMatch(/\/wells\/0\/rate_m3_s: rate "lots" is not a number/);
    expect(s.errors).toEqual([]);
  });

  it('shows a clear message for an unknown EPSG code and keeps drawing the plan', async () => {
    await page.click('button[name="tab-backdrop"]');
    await page.fill('backdrop-panel input[name="crs"]', 'EPSG:99999');
    await page.locator('backdrop-panel input[name="crs"]').blur();
    await expect.poll(() => page.locator('[data-crs-status]').innerText()).toMatch(/EPSG:99999 is not one of the coordinate systems.*proj4/);
    expect(await canvasFingerprint(page)).not.toBe('none');
    expect(await page.locator('path.dd-well').count()).toBe(6);
    // A pasted proj4 definition makes latitude/longitude work again.
    await page.fill('backdrop-panel textarea[name="proj4"]', '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs');
    await page.locator('backdrop-panel textarea[name="proj4"]').blur();
    await expect.poll(() => page.locator('[data-crs-status]').innerText()).toMatch(/Latitude\/longitude by EPSG:99999/);
    await page.click('.dd-drawer .dd-close');
    const q = await pagePoint(page, 389215, 5819415);
    await page.mouse.move(q.x, q.y);
    await expect.poll(() => page.locator('.dd-cursor').innerText()).toMatch(/52\.51\d+° N, 13\.36\d+° E/);
  });

  it('refuses to open a scenario file with an error, naming the field, and keeps the current one', async () => {
    const bad = { format: 'drydig.scenario', version: 1, name: 'bad', groundLevel_m: 10, aquifer: { kind: 'unconfined', conductivity_m_s: 'fast', base_m: 0, staticLevel_m: 8, specificYield: 0.1 }, excavations: [], wells: [], design: { time_s: null } };
    await page.setInputFiles('input[name="open-scenario"]', { name: 'bad.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(bad)) });
    await expect.poll(() => page.locator('.dd-notice').innerText()).toMatch(/bad\.json was not opened — Aquifer, conductivity: must be a number/);
    expect(await page.locator('path.dd-well').count()).toBe(6);
  });

  it('lays out for a phone: map first, panels below', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(400);
    await s.screenshot('11-phone');
    const map = await page.locator('.dd-map-area').boundingBox();
    const side = await page.locator('.dd-side').boundingBox();
    expect(side!.y).toBeGreaterThanOrEqual(map!.y + map!.height - 1);
    await page.setViewportSize({ width: 1440, height: 900 });
    expect(s.errors).toEqual([]);
  });
});
