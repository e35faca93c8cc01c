/**
 * A starting point for the free-C polish with the engine.
 *
 * With C free the candidates are refined on scans at fixed C/B ratios
 * (spaced `step` apart), so the winner's C/B is only the nearest scanned
 * ratio r0. Each Levenberg–Marquardt iteration at a new C/B costs the engine
 * fresh parent tables, so a start near the optimum saves most of the fit's
 * time. The same assignment (same level keys) is refined on the interpolated
 * scans at r0 − step, r0 and r0 + step (the two inner neighbours at an end of
 * the range) without calling the engine; the vertex of the parabola through
 * the three profile minima S(r), kept between the outer two ratios, gives
 * C/B, and Dq/B and B are interpolated linearly between the two nearest
 * ratios. Undefined when the assignment does not exist on a neighbouring scan
 * or leaves its spin branch there: the caller then starts from the winner.
 */
import type { FieldParameters } from '../ligand-field/types.js';
import type { GridCandidate } from './candidates.js';
import { refineProfileOnScan } from './interpolate.js';
import type { SortedObservations } from './observations.js';
import { cachedLevelScan, type LevelScan } from './scan.js';
import { float64Of } from './float64-of.js';

interface RatioFit {
  ratio: number;
  x: number;
  b: number;
  ssr: number;
}

/** Index j of the grid point nearest x. */
function nearestPoint(grid: Float64Array, x: number): number {
  let best = 0;
  for (let j = 1; j < grid.length; j++) if (Math.abs(grid[j]! - x) < Math.abs(grid[best]! - x)) best = j;
  return best;
}

function fitAtRatio(candidate: GridCandidate, scan: LevelScan, x0: number, sorted: SortedObservations): RatioFit | undefined {
  const { scan: own, branch, variant, levels } = candidate;
  const ground = scan.index.get(own.ids[branch.ground]!.key);
  const mapped = Array.from(levels, (k) => scan.index.get(own.ids[k]!.key));
  if (ground === undefined || mapped.some((k) => k === undefined)) return undefined;
  const o = float64Of(variant.observations, (obs) => obs.position);
  const w = float64Of(variant.observations, (obs) => (sorted.weighted ? 1 / obs.sigma ** 2 : 1));
  const lo = Math.max(scan.x[0]!, 0.85 * x0);
  const hi = Math.min(scan.x[scan.x.length - 1]!, 1.15 * x0);
  const fit = refineProfileOnScan(scan, ground, mapped as number[], o, w, lo, hi);
  if (!Number.isFinite(fit.ssr) || !(fit.b > 0)) return undefined;
  // The solution must stay on the branch's side of a spin crossover.
  if (scan.ground[nearestPoint(scan.x, fit.x)] !== ground) return undefined;
  return { ratio: scan.cOverB, ...fit };
}

export function freeCStart(
  candidate: GridCandidate,
  from: FieldParameters,
  ratios: readonly number[],
  sorted: SortedObservations,
): FieldParameters | undefined {
  const r0 = candidate.scan.cOverB;
  const i0 = ratios.findIndex((r) => Math.abs(r - r0) < 1e-9);
  if (i0 < 0 || ratios.length < 3) return undefined;
  const centre = Math.min(Math.max(i0, 1), ratios.length - 2);
  const x0 = from.dq / from.b;
  const fits: RatioFit[] = [];
  for (const r of [ratios[centre - 1]!, ratios[centre]!, ratios[centre + 1]!]) {
    const scan = cachedLevelScan(candidate.scan.d, candidate.scan.geometry, r);
    const fit = fitAtRatio(candidate, scan, x0, sorted);
    if (!fit) return undefined;
    fits.push(fit);
  }
  const [a, b, c] = fits as [RatioFit, RatioFit, RatioFit];
  const h = b.ratio - a.ratio;
  const curvature = a.ssr - 2 * b.ssr + c.ssr;
  let ratio = curvature > 0 ? b.ratio + (h * (a.ssr - c.ssr)) / (2 * curvature) : [a, b, c].sort((p, q) => p.ssr - q.ssr)[0]!.ratio;
  ratio = Math.min(c.ratio, Math.max(a.ratio, ratio));
  const [lo, hi] = ratio <= b.ratio ? [a, b] : [b, c];
  const t = (ratio - lo.ratio) / (hi.ratio - lo.ratio);
  const x = lo.x + t * (hi.x - lo.x);
  const bValue = lo.b + t * (hi.b - lo.b);
  return { dq: x * bValue, b: bValue, c: ratio * bValue };
}
