/**
 * The lower convex hull of (x, y) evaluated at every x (a "rubber band"
 * stretched under the spectrum). Used only as a first baseline guess for
 * band finding: it touches the data between bands and never cuts into
 * them; the final baseline is fitted together with the bands.
 * x must be ascending.
 */
export function xyLowerHull(x: Float64Array, y: Float64Array): Float64Array {
  const n = x.length;
  const hull: number[] = [];
  for (let i = 0; i < n; i++) {
    while (hull.length >= 2) {
      const a = hull[hull.length - 2] as number;
      const b = hull[hull.length - 1] as number;
      // Drop b when it lies on or above the segment a–i.
      const cross = ((x[b] as number) - (x[a] as number)) * ((y[i] as number) - (y[a] as number)) - ((y[b] as number) - (y[a] as number)) * ((x[i] as number) - (x[a] as number));
      if (cross <= 0) hull.pop();
      else break;
    }
    hull.push(i);
  }
  const out = new Float64Array(n);
  for (let h = 0; h < hull.length - 1; h++) {
    const a = hull[h] as number;
    const b = hull[h + 1] as number;
    for (let i = a; i <= b; i++) {
      const t = b === a ? 0 : ((x[i] as number) - (x[a] as number)) / ((x[b] as number) - (x[a] as number));
      out[i] = (y[a] as number) * (1 - t) + (y[b] as number) * t;
    }
  }
  if (hull.length === 1) out[0] = y[0] as number;
  return out;
}
