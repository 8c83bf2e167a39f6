/**
 * Logger readings as the inputs drydig already reads: a pumping-test readings CSV (elapsed
 * seconds and drawdown, one observation well at its distance) for the Test tab, and site
 * readings of a piezometer (level and time) for the monitoring record.
 */
import type { LoggerReading } from '../../shared/import';

/** A readings CSV (`time_s,drawdown_m,distance_m,well`) the pumping-test analysis reads; rows without a drawdown are left out and counted. */
export function loggerToTestCsv(readings: readonly LoggerReading[], well: string, distance_m: number): { csv: string; rows: number; withoutDrawdown: number } {
  const safeWell = well.replace(/[",\r\n]/g, ' ').trim() || 'OBS';
  const lines = ['time_s,drawdown_m,distance_m,well'];
  let withoutDrawdown = 0;
  for (const r of readings) {
    if (r.drawdown_m === null || !(r.time_s > 0)) {
      withoutDrawdown++;
      continue;
    }
    lines.push(`${r.time_s},${r.drawdown_m},${distance_m},${safeWell}`);
  }
  return { csv: `${lines.join('\n')}\n`, rows: lines.length - 1, withoutDrawdown };
}

/** Site readings of one piezometer: level with the time it was read (ISO when the file had one, else elapsed). */
export function loggerToSiteReadings(readings: readonly LoggerReading[], piezometerId: string): Array<{ piezometerId: string; level_m: number; measuredAt?: string; time_s?: number }> {
  return readings
    .filter((r): r is LoggerReading & { level_m: number } => r.level_m !== null)
    .map((r) => ({ piezometerId, level_m: r.level_m, ...(r.at !== null ? { measuredAt: r.at } : { time_s: r.time_s }) }));
}
