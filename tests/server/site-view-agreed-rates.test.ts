/**
 * What a share link shows is one agreed set of rates (issue 13 item 3): the design check is of the
 * stored revision's own rates, so the set-out table, the summary and the report agree; a snapshot
 * frozen with a solver's design for other rates is not shown as the revision's check. And a
 * revision is "issued for construction" only once someone recorded it so (item 14).
 */
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { runDesign } from '../../shared/design';
import { createLink, createStored, demoScenario, signedInMemoryApp } from './scenarios-helpers';

let app: FastifyInstance;
beforeEach(async () => {
  app = await signedInMemoryApp();
});
afterEach(async () => {
  await app.close();
});

describe('GET /api/v1/links/:token — one rate set', () => {
  it('checks the stored rates: the design wells, its total and the set-out rows carry the same rates', async () => {
    const scenario = demoScenario('confined');
    const id = await createStored(app, scenario);
    const token = await createLink(app, id, 'view', 1);
    const view = (await app.inject({ method: 'GET', url: `/api/v1/links/${token}` })).json();
    expect(view.design.rateSource).toBe('scenario');
    const setout = view.setout as Array<{ id: string; rate_m3_s: number }>;
    for (const row of setout) expect(view.design.wells.find((w: { id: string }) => w.id === row.id).rate_m3_s).toBe(row.rate_m3_s);
    expect(view.design.totalRate_m3_s).toBeCloseTo(setout.reduce((s, r) => s + r.rate_m3_s, 0), 12);
    const report = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/export/report-html` });
    expect(report.body).toContain(`Total pumping rate (the revision’s rates)</th><td>${(view.design.totalRate_m3_s * 1000).toFixed(2)} L/s`);
    expect(report.body).not.toContain('<th>Design rate L/s</th>');
  });

  it('does not show a frozen design solved for other rates as the revision’s check', async () => {
    const scenario = demoScenario('confined');
    const id = await createStored(app, scenario);
    const record = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` })).json();
    const solved = await runDesign({ scenario });
    await app.scenarioStore.putSnapshot({ sha256: record.sha256, computedBy: 'drydig 0.0.9', body: JSON.stringify({ resultsError: 'x', design: solved, designError: null }) });
    const token = await createLink(app, id, 'view', 1);
    const view = (await app.inject({ method: 'GET', url: `/api/v1/links/${token}` })).json();
    expect(view.design).toBeNull();
    expect(view.designError).toContain('solved for other rates than the stored ones');
  });
});

describe('GET /api/v1/links/:token — issued for construction', () => {
  it('is null until someone records the revision as issued, then names who and when (also in the report)', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const token = await createLink(app, id, 'view', 1);
    const before = (await app.inject({ method: 'GET', url: `/api/v1/links/${token}` })).json();
    expect(before.issued).toBeNull();
    const report0 = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/export/report-html` });
    expect(report0.body).toContain('Revision 1 is saved; nobody has recorded it as issued for construction.');
    const issued = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/issued`, payload: { revision: 1 } });
    expect(issued.statusCode).toBe(201);
    const after = (await app.inject({ method: 'GET', url: `/api/v1/links/${token}` })).json();
    expect(after.issued).toEqual({ by: issued.json().actor, at: issued.json().at });
    const report = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/export/report-html` });
    expect(report.body).toContain(`Revision 1 was issued for construction by ${issued.json().actor} on ${issued.json().at}.`);
  });
});
