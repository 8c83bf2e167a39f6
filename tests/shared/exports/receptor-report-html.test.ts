/**
 * The neighbours under a design in the report (issue 11 item 4): one row per receptor with its
 * drawdown against its limit, settlement against the allowable (s = m_v·γw·Δh·H, computed by the
 * engine and checked by hand in tests/shared/receptors), angular distortion as 1/N and the status.
 * Demo: fixtures/demo-neighbours-confined.json (invented), its stored rates checked as they stand.
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { createSiteProjection, writeReceptorTableHtml, writeReportHtml } from '../../../shared/exports';
import { runDesign, type DesignResult } from '../../../shared/design';
import type { Scenario } from '../../../shared/schema';

const scenario = JSON.parse(readFileSync(new URL('../../../fixtures/demo-neighbours-confined.json', import.meta.url), 'utf8')) as Scenario;
let design: DesignResult;
let html: string;

beforeAll(async () => {
  design = await runDesign({ scenario, rates: 'scenario' });
  html = writeReportHtml({ scenario, projection: createSiteProjection(scenario), design, revision: { revision: 1, savedAt: '2027-02-01T10:00:00Z', savedBy: 'designer', issued: null } });
});

describe('the receptor table in the report', () => {
  it('has one row per receptor with its figures, as the design result gives them', () => {
    const receptors = design.receptors ?? [];
    expect(receptors.length).toBeGreaterThan(1);
    expect(html).toContain('<h3>Neighbours (receptors)</h3>');
    for (const r of receptors) {
      const row = new RegExp(`<tr data-receptor="${r.id}">(.*?)</tr>`).exec(html)?.[1] ?? '';
      expect(row, r.id).toContain(`<td>${r.maxDrawdownOverDig_m.toFixed(2)}</td>`);
      if (r.settlement_m !== null) expect(row, r.id).toContain(`<td>${(r.settlement_m * 1000).toFixed(1)}</td>`);
      expect(row, r.id).toContain(`data-status="${r.status}"`);
    }
    // β written the way the published limits are: the default 1/500.
    expect(html).toContain('<td>1/500</td>');
  });

  it('is left out where the design has no receptors', () => {
    expect(writeReceptorTableHtml({ receptors: undefined })).toBe('');
    expect(writeReceptorTableHtml({ receptors: [] })).toBe('');
  });
});
