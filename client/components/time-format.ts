/** Human durations for the time control and captions: "45 min", "6.5 h", "14 d". Null → "steady state". */
export function formatDuration(time_s: number | null): string {
  if (time_s === null) return 'steady state';
  if (!Number.isFinite(time_s)) return '—';
  const s = Math.abs(time_s);
  const fmt = (v: number) => String(Number(v.toPrecision(v < 10 ? 2 : 3)));
  if (s < 120) return `${fmt(s)} s`;
  if (s < 7200) return `${fmt(s / 60)} min`;
  if (s < 172800) return `${fmt(s / 3600)} h`;
  return `${fmt(s / 86400)} d`;
}
