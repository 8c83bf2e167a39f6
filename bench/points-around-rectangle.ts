/**
 * n points evenly spaced (at half-steps) around the perimeter of a W × H rectangle whose corner is
 * at the origin, anticlockwise from the origin — the invented well rings of the benchmarks.
 */
export function pointsAroundRectangle(width_m: number, height_m: number, count: number): Array<[number, number]> {
  const perimeter = 2 * (width_m + height_m);
  const points: Array<[number, number]> = [];
  for (let k = 0; k < count; k++) {
    let d = (k + 0.5) * (perimeter / count);
    if (d < width_m) points.push([d, 0]);
    else if ((d -= width_m) < height_m) points.push([width_m, d]);
    else if ((d -= height_m) < width_m) points.push([width_m - d, height_m]);
    else points.push([0, height_m - (d - width_m)]);
  }
  return points;
}
