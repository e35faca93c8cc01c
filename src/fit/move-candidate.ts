/**
 * The same assignment on another scan (another C/B): the levels and the
 * assumed ground level are matched by identity key ("4T1g#0"), and the grid
 * optimum is recomputed over the points where that level is the ground
 * level. Used with a free C to refine candidates found on a coarse set of
 * C/B ratios on the ratios in between, without enumerating every assignment
 * there.
 */
import type { GridCandidate } from './candidates.js';
import { scanBranches } from './enumerate.js';
import type { SortedObservations } from './observations.js';
import { effectiveWeight } from './likelihood.js';
import { penaltyTotal } from './penalties.js';
import type { LevelScan } from './scan.js';

export function candidateOnScan(candidate: GridCandidate, scan: LevelScan, _sorted?: SortedObservations): GridCandidate | undefined {
  const { scan: own, variant } = candidate;
  const groundKey = own.ids[candidate.branch.ground]!.key;
  const branch = scanBranches(scan).find((b) => scan.ids[b.ground]!.key === groundKey);
  if (!branch) return undefined;
  const levels = Int32Array.from(candidate.levels, (k) => scan.index.get(own.ids[k]!.key) ?? -1);
  if (levels.some((k) => k < 0)) return undefined;
  const n = scan.ids.length;
  const m = levels.length;
  const o = variant.observations.map((obs) => obs.position);
  // The χ² weights of candidates.ts (σ² + σm²).
  const w = variant.observations.map((obs) => effectiveWeight(obs.position, obs.sigma));
  let best = { point: -1, b: 0, ssr: Infinity };
  for (const j of branch.points) {
    const zero = scan.energies[j * n + branch.ground]!;
    let num = 0;
    let den = 0;
    let soo = 0;
    for (let i = 0; i < m; i++) {
      const e = scan.energies[j * n + levels[i]!]! - zero;
      num += w[i]! * o[i]! * e;
      den += w[i]! * e * e;
      soo += w[i]! * o[i]! * o[i]!;
    }
    if (!(den > 0) || !(num > 0)) continue;
    const ssr = Math.max(0, soo - (num * num) / den);
    if (ssr < best.ssr) best = { point: j, b: num / den, ssr };
  }
  if (best.point < 0) return undefined;
  return {
    ...candidate, scan, branch, levels,
    grid: { assignment: -1, point: best.point, x: scan.x[best.point]!, b: best.b, ssr: best.ssr },
    wrms: best.ssr + penaltyTotal(variant.penalties), approxScore: Number.NaN,
  };
}
