/** Latitude/longitude for the cursor read-out: decimal degrees to 6 places (≈ 0.1 m) with hemisphere. */
export function formatLonLat(lon: number, lat: number): string {
  if (!Number.isFinite(lon) || !Number.isFinite(lat)) return '—';
  const ns = lat >= 0 ? 'N' : 'S';
  const ew = lon >= 0 ? 'E' : 'W';
  return `${Math.abs(lat).toFixed(6)}° ${ns}, ${Math.abs(lon).toFixed(6)}° ${ew}`;
}
