/** writeSectionReportHtml and writeSectionFloorCsv carry the section result, its methods and the cautions. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { writeSectionFloorCsv, writeSectionReportHtml } from '../../../shared/exports';
import { runSectionJob } from '../../../shared/section';

const section = JSON.parse(readFileSync(new URL('../../../fixtures/sections/sheet-pile-cofferdam.json', import.meta.url), 'utf8')) as unknown;

describe('section exports', () => {
  const answer = runSectionJob({ section, compare: { toeLevels_m: [1, -3] }, flowNet: false });

  it('writeSectionReportHtml names each check’s method, the options compared and the cautions', () => {
    const html = writeSectionReportHtml(answer, { title: 'Cofferdam <A>', generatedAt: '2027-03-01T07:00:00Z' });
    expect(html).toContain('<title>Cofferdam &lt;A&gt;</title>');
    expect(html).toContain('Terzaghi prism');
    expect(html).toContain('γ′/γw');
    expect(html).toContain('toe driven to -3 m');
    expect(html).toContain('licensed');
    expect(html).toContain(`${Number((answer.flow_m3_s_per_m! * 1000).toPrecision(3))} L/s per m`);
  });

  it('writeSectionFloorCsv writes one row per floor column, then the checks and the cautions', () => {
    const lines = writeSectionFloorCsv(answer).split('\r\n');
    expect(lines[0]).toBe('x_m,floor_level_m,head_m,pressure_kPa,exit_gradient,critical_gradient,fs');
    expect(lines.slice(1, 1 + answer.floor.length).every((l) => l.split(',').length === 7)).toBe(true);
    expect(lines).toContain(`flow_m3_s_per_m,${answer.flow_m3_s_per_m}`);
    expect(lines.some((l) => l.startsWith('heave_fs,') && l.includes('Terzaghi prism'))).toBe(true);
  });
});
