/** Distance and bearing from the user's position to the nearest well (for setting wells out). */
export interface NearestWell {
  index: number;
  id: string;
  distance_m: number;
  /** Grid bearing from the user to the well, degrees clockwise from grid north. */
  bearing_deg: number;
}

/** Nearest of `wells` to (x, y) in site metres, or null when there are none. */
export function findNearestWell(x: number, y: number, wells: ReadonlyArray<{ id: string; x: number; y: number }>): NearestWell | null {
  let best: NearestWell | null = null;
  wells.forEach((w, index) => {
    const dx = w.x - x;
    const dy = w.y - y;
    const distance_m = Math.hypot(dx, dy);
    if (!best || distance_m < best.distance_m) {
      const bearing = (Math.atan2(dx, dy) * 180) / Math.PI;
      best = { index, id: w.id, distance_m, bearing_deg: (bearing + 360) % 360 };
    }
  });
  return best;
}
