/** Number wording shared by the design's reasons and cautions (one place for how figures read). */

/** A figure to `digits` significant digits, without trailing zeros. */
export const formatFigure = (v: number, digits = 3): string => Number(v.toPrecision(digits)).toString();

/** A rate in m³/s as litres per second, e.g. "1.25 L/s". */
export const formatLitres = (q_m3_s: number): string => `${formatFigure(q_m3_s * 1000)} L/s`;

/** A list of ids, the first eight and a count of the rest. */
export const listIds = (ids: readonly string[]): string => (ids.length > 8 ? `${ids.slice(0, 8).join(', ')} and ${ids.length - 8} more` : ids.join(', '));
