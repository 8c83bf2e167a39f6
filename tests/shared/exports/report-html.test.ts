/**
 * The printable report: every section the issue lists, a print stylesheet, cautions at the top and
 * on each printed page, no scripts, and user text escaped.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildMonitoringPlan, computePlanResults, createSiteProjection, writeReportHtml, writeScenarioJson } from '../../../shared/exports';
import type { Scenario } from '../../../shared/schema';
import { runDesign } from '../../../shared/design';
import { engine } from './export-test-helpers';

const demo = (file: string) => JSON.parse(readFileSync(new URL(`../../../fixtures/${file}`, import.meta.url), 'utf8')) as Scenario;

describe('writeReportHtml(options)', () => {
  const scenario = demo('demo-deepwells-confined.json');
  const html = writeReportHtml({
    scenario,
    projection: createSiteProjection(scenario),
    results: computePlanResults({ scenario, engine }),
    monitoring: buildMonitoringPlan({ scenario, engine }),
    revision: { revision: 4, savedAt: '2027-02-01T10:00:00Z', savedBy: 'designer', sha256: 'ab'.repeat(32) },
    generatedAt: '2027-02-02T09:00:00Z',
  });

  it.each(['1. The job', '2. Plan', '3. Well schedule', '4. Design and bid summary', '5. Checks', '6. Monitoring plan', '7. Assumptions and methods', '8. Cautions'])(
    'has the section "%s"',
    (heading) => expect(html).toContain(`<h2>${heading}</h2>`),
  );

  it('has a print stylesheet with a page size and a caution footer on every page', () => {
    expect(html).toMatch(/@media print\{[^]*@page\{size:A4/);
    expect(html).toContain('footer.print-caution{display:block;position:fixed');
    expect(html).toContain('licensed engineer must review');
  });

  it('names the method with its published source and lists every well', () => {
    expect(html).toContain('Theis (confined, transient)');
    expect(html).toContain('Theis, C.V. (1935)');
    for (const w of scenario.wells) expect(html).toContain(`<td>${w.id}</td>`);
    expect(html).toContain('<svg');
    expect(html).toContain('revision 4');
  });

  it('contains no script and escapes text from the scenario', () => {
    const hostile = { ...scenario, name: '<script>alert(1)</script> & co' };
    const out = writeReportHtml({ scenario: hostile, projection: null });
    expect(out).not.toMatch(/<script/i);
    expect(out).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; co');
  });

  it('says plainly when no design run is attached', () => {
    expect(html).toContain('No design run is attached');
  });

  it('shows the design and bid summary of an attached design run, rate by rate', async () => {
    const design = await runDesign({ scenario });
    const withDesign = writeReportHtml({ scenario, projection: createSiteProjection(scenario), design });
    expect(withDesign).toContain(`Design (${design.mode}) — ${design.feasible ? '<span class="ok">feasible</span>' : '<span class="bad">NOT feasible</span>'}`);
    expect(withDesign).toContain(`<tr><th>Total design rate</th><td>${(design.totalRate_m3_s * 1000).toFixed(2)} L/s</td></tr>`);
    expect(withDesign).toContain(`<tr><th>Duty / standby pumps</th><td>${design.summary.dutyPumps} / ${design.summary.standbyPumps}</td></tr>`);
    expect(withDesign).toContain('<th>Design rate L/s</th>');
    for (const w of design.wells) expect(withDesign).toContain(`<td>${(w.rate_m3_s * 1000).toFixed(2)}</td>`);
    expect(withDesign).not.toContain('No design run is attached');
  });
});

describe('writeScenarioJson(scenario)', () => {
  it('round-trips the document exactly', () => {
    const scenario = demo('demo-wellpoints-unconfined.json');
    expect(JSON.parse(writeScenarioJson(scenario))).toEqual(scenario);
  });
});
