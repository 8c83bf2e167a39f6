/**
 * The pit-floor check wherever the design is exported (issue 8 item 6): the report carries, per
 * excavation, the governing check, uplift / heave FS against required, the allowable level, the
 * time to unsafe after a power failure and the safe-dig table, with the floor cautions at the top
 * and in the cautions section; the design CSV carries the same figures and cautions.
 * Demo: fixtures/demo-clay-plug-confined.json (uplift of the plug governs).
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { createSiteProjection, designFloorCautions, writeReportHtml } from '../../../shared/exports';
import { designResultToCsv, runDesign, type DesignResult } from '../../../shared/design';
import { FLOOR_ASSUMPTIONS, formatFloorDuration } from '../../../shared/floor';
import { escapeHtml } from '../../../shared/exports/escape-html';
import type { Scenario } from '../../../shared/schema';

const scenario = JSON.parse(readFileSync(new URL('../../../fixtures/demo-clay-plug-confined.json', import.meta.url), 'utf8')) as Scenario;
let design: DesignResult;
let html: string;

beforeAll(async () => {
  design = await runDesign({ scenario, rates: 'scenario' });
  html = writeReportHtml({ scenario, projection: createSiteProjection(scenario), design, revision: { revision: 1, savedAt: '2027-02-01T10:00:00Z', savedBy: 'designer', issued: null } });
});

describe('writeReportHtml with a design that carries floor checks', () => {
  it('gives the governing check, the uplift FS against the required one, the allowable level and the time to unsafe', () => {
    const floor = design.excavations[0]!.floor!;
    expect(floor.governing).toBe('uplift');
    expect(html).toContain('<h3>Pit floor: basement</h3>');
    expect(html).toContain('<tr><th>Governing check</th><td>uplift of the plug (EN 1997-1 UPL)</td></tr>');
    expect(html).toContain(`${floor.upliftFS!.toFixed(3)}</span> (required ${floor.requiredUpliftFS!.toFixed(3)})`);
    expect(html).toContain(`<tr><th>Allowable head under the floor</th><td>${floor.allowableLevel_m!.toFixed(2)} m</td></tr>`);
    expect(html).toContain(`<tr><th>Power failure: floor unsafe after</th><td>${formatFloorDuration(floor.timeToUnsafe_s!)}</td></tr>`);
  });

  it('lists the safe-dig table step by step', () => {
    const steps = design.excavations[0]!.floor!.safeDig;
    expect(steps.length).toBeGreaterThan(5);
    for (const s of steps) expect(html).toContain(`<tr><td>${formatFloorDuration(s.time_s)}</td><td>${s.safeFormationLevel_m.toFixed(2)}</td></tr>`);
  });

  it('puts the floor cautions with the cautions at the top and in the cautions section, once each', () => {
    const cautions = designFloorCautions(design);
    expect(cautions.some((c) => c.includes('uplift of the plug governs'))).toBe(true);
    const top = html.slice(html.indexOf('<section class="cautions">'), html.indexOf('<h2>1. The job</h2>'));
    const last = html.slice(html.indexOf('<h2>8. Cautions</h2>'));
    for (const c of cautions) {
      expect(top).toContain(escapeHtml(c));
      expect(last.split(escapeHtml(c)).length - 1).toBe(1);
    }
  });

  it('reports a check of the revision’s own rates with one rate column, and the revision as saved', () => {
    expect(design.rateSource).toBe('scenario');
    expect(html).toContain('Design check of these rates');
    expect(html).toContain('<th>Rate L/s</th>');
    expect(html).not.toContain('<th>Design rate L/s</th>');
    expect(html).toContain('Revision 1 is saved; nobody has recorded it as issued for construction.');
  });
});

describe('designResultToCsv with floor checks', () => {
  it('carries the governing check, the factors, the allowable level, time to unsafe, the safe-dig table and the floor cautions', () => {
    const csv = designResultToCsv(design);
    const floor = design.excavations[0]!.floor!;
    expect(csv).toMatch(/governingCheck,allowableLevel \(m\),upliftFS \(-\),requiredUpliftFS \(-\),heaveFS \(-\),requiredHeaveFS[^,]*,timeToUnsafe \(s\)/);
    expect(csv).toContain(`,uplift,${Number(floor.allowableLevel_m!.toPrecision(10))},${Number(floor.upliftFS!.toPrecision(10))},${Number(floor.requiredUpliftFS!.toPrecision(10))},`);
    expect(csv).toContain(`,${Number(floor.timeToUnsafe_s!.toPrecision(10))}\r\n`);
    expect(csv).toContain('safe-dig excavation,time (s),safeFormationLevel (m)');
    expect(csv.split('\r\n').filter((l) => l.startsWith('basement,') && l.split(',').length === 3)).toHaveLength(floor.safeDig.length);
    expect(csv).toContain(FLOOR_ASSUMPTIONS.slice(0, 60));
  });
});
