import { describe, expect, it } from 'vitest';
import { coordinateUnit, defaultDisplayUnits, fromSi, toSi } from '../../../shared/units';
import { designResultToCsv, headerWithUnit, runDesign } from '../../../shared/design';
import { runCli } from '../../../server/cli';
import { captureIo } from '../../cli/capture-io';
import { singleWellScenario } from '../design/design-test-helpers';

describe('US units cover well loss, volume and coordinates', () => {
  it('US display gives well loss in s²/ft⁵ and volume in US gallons (exact NIST SP 811 factors)', () => {
    const us = defaultDisplayUnits('us');
    expect([us.wellLoss, us.volume]).toEqual(['s²/ft⁵', 'gal']);
    // C·Q² must be the same head: 1 s²/m⁵ with Q = 1 m³/s gives 1 m = 3.2808 ft; in ft and ft³/s: C_us·(35.3147)² ft.
    const c_us = fromSi(1, 's²/ft⁵');
    const q_cfs = 1 / 0.3048 ** 3;
    expect(c_us * q_cfs * q_cfs).toBeCloseTo(1 / 0.3048, 9);
    expect(fromSi(1, 'gal')).toBeCloseTo(1 / 3.785411784e-3, 9);
    expect(toSi(1, 'gal')).toBe(3.785411784e-3);
  });

  it('a UTM easting stays in metres in US display; a local grid follows the length system, and the caption says so', () => {
    const us = defaultDisplayUnits('us');
    const utm = coordinateUnit({ crs: 'EPSG:32633', units: us });
    expect(utm).toEqual({ unit: 'm E/N', caption: 'EPSG:32633 grid, metres' });
    expect(fromSi(456789.12, utm.unit)).toBe(456789.12);
    expect(coordinateUnit({ units: us })).toEqual({ unit: 'ft E/N', caption: 'Site grid, feet' });
    expect(coordinateUnit({ units: defaultDisplayUnits('si') }).caption).toBe('Site grid, metres');
  });
});

describe('units where the user types them and in the CSV', () => {
  it('design CSV table headers state each column’s unit', async () => {
    const csv = designResultToCsv(await runDesign({ scenario: singleWellScenario(), mode: 'uniform' }));
    const header = csv.split('\r\n').find((l) => l.startsWith('well,'))!;
    expect(header).toContain('rate (m3/s)');
    expect(header).toContain('x (m)');
    expect(header).toContain('utilisation (-)');
    expect(csv.split('\r\n').find((l) => l.startsWith('excavation,'))).toContain('timeToTarget (s)');
    expect(headerWithUnit('well')).toBe('well');
  });

  it('drydig design --pump-capacity takes a unit as the UI does (20L/s = 72m3/h = 0.02)', async () => {
    const { mkdtempSync, writeFileSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const dir = mkdtempSync(`${tmpdir()}/drydig-units-`);
    writeFileSync(`${dir}/s.json`, JSON.stringify(singleWellScenario()));
    const capacity = async (text: string) => {
      const io = captureIo(dir);
      expect(await runCli(['design', 's.json', '--mode', 'uniform', '--pump-capacity', text], io), io.err()).toBe(0);
      return (JSON.parse(io.out()) as { summary: { pumpCapacity_m3_s: number } }).summary.pumpCapacity_m3_s;
    };
    expect(await capacity('20L/s')).toBeCloseTo(0.02, 12);
    expect(await capacity('72m3/h')).toBeCloseTo(0.02, 12);
    expect(await capacity('0.02')).toBe(0.02);
    const bad = captureIo(dir);
    expect(await runCli(['design', 's.json', '--pump-capacity', '20 furlongs'], bad)).toBe(2);
    expect(bad.err()).toMatch(/--pump-capacity: unit "furlongs" is not a rate unit/);
  }, 60_000);
});
