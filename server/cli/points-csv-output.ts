/**
 * `drydig evaluate --csv`: the evaluated points as CSV for a spreadsheet or a survey tool. Comment
 * lines (`# …`) carry the method and the cautions so they travel with the numbers; drydig's own
 * points reader skips them, so the file can be fed back with --points.
 */
import type { EvaluateResponse } from '../request-schemas';

/** Header row of the CSV. */
export const POINTS_CSV_HEADER = 'x,y,time_s,level_m,drawdown_m,flags';

/** CSV text (LF line ends): comments, the header, then one row per point per time. */
export function formatPointsCsv(answer: EvaluateResponse): string {
  const lines: string[] = [];
  for (const { time_s, model } of answer.models) {
    lines.push(`# ${time_s === null ? 'steady state' : `t = ${time_s} s`}: method ${model.method}`);
  }
  for (const caution of answer.cautions) lines.push(`# ${caution}`);
  lines.push('# time_s "steady" = steady state; flags separated by spaces; levels and drawdowns in m');
  lines.push(POINTS_CSV_HEADER);
  for (const p of answer.points ?? []) {
    lines.push([p.x, p.y, p.time_s === null ? 'steady' : p.time_s, p.level_m, p.drawdown_m, p.flags.join(' ')].join(','));
  }
  return `${lines.join('\n')}\n`;
}
