/**
 * Scoring a grid candidate on the scan alone (at the scan's C/B: the fixed
 * ratio, or one of the ratios scanned for a free C): the assignment's
 * profile is minimised on the interpolated reduced energies (interpolate.ts)
 * between the grid neighbours of its grid optimum, kept on the branch's side
 * of the spin crossover, so the solution is self-consistent by
 * construction. No engine call: this is how the runners-up are refined; the
 * winner is then polished with the engine (evaluate.ts).
 */
import type { GridCandidate } from './candidates.js';
import { primaryClass } from './enumerate.js';
import { crossoverAt } from './engine.js';
import { branchSpinState, chiSquareOf, type Evaluated } from './evaluate.js';
import { float64Of } from './float64-of.js';
import { refineProfileOnScan, scanEnergyAt } from './interpolate.js';
import type { SortedObservations } from './observations.js';
import { anyWidened, assumedCOverBSd, assumedCPenalty, scanTransitionCDerivatives, sigmaFromCOf } from './c-sensitivity.js';
import { leastSquaresSigma } from './likelihood.js';
import { parameterCount } from './refine.js';
import { penaltyTotal } from './penalties.js';
import { scoreTerms } from './score-terms.js';
import { twoElectronLevels } from './two-electron.js';
import type { FitSettings } from './settings.js';

/** The Dq/B interval the branch may use around grid point j. */
function searchInterval(candidate: GridCandidate, settings: FitSettings): [number, number] {
  const { scan, branch, grid } = candidate;
  const j = grid.point;
  let lo = scan.x[Math.max(0, j - 1)]!;
  let hi = scan.x[Math.min(scan.x.length - 1, j + 1)]!;
  if (scan.ground.some((g) => g !== branch.ground)) {
    const crossover = crossoverAt(settings.d, settings.geometry, scan.cOverB);
    if (crossover !== undefined) {
      const weakField = scan.ground[0] === branch.ground;
      if (weakField) hi = Math.min(hi, crossover * (1 - 1e-9));
      else lo = Math.max(lo, crossover * (1 + 1e-9));
    }
  }
  return lo < hi ? [lo, hi] : [grid.x, grid.x];
}

export function evaluateOnScan(candidate: GridCandidate, settings: FitSettings, sorted: SortedObservations): Evaluated {
  const { scan, branch, variant, levels } = candidate;
  const observations = variant.observations;
  const o = float64Of(observations, (obs) => obs.position);
  // σ_C at the grid optimum weighs the refinement; at the refined point, the χ² (c-sensitivity.ts).
  const cSd = assumedCOverBSd(settings);
  const sigmaCAt = (x: number, b: number) => sigmaFromCOf(scanTransitionCDerivatives(scan, branch.ground, levels, x), b, cSd);
  const gridSigmaC = cSd > 0 ? sigmaCAt(candidate.grid.x, candidate.grid.b) : new Float64Array(observations.length);
  const weighted = sorted.weighted || anyWidened(gridSigmaC);
  const w = float64Of(observations, (obs, i) => leastSquaresSigma(obs.sigma, gridSigmaC[i]!, weighted) ** -2);
  const [lo, hi] = searchInterval(candidate, settings);
  const refined = lo < hi ? refineProfileOnScan(scan, branch.ground, levels, o, w, lo, hi) : { ...candidate.grid };
  // The grid's ssr has the χ² weights of candidates.ts; the refined one these: compare like with like.
  const atGrid = refineProfileOnScan(scan, branch.ground, levels, o, w, candidate.grid.x, candidate.grid.x);
  const { x, b } = Number.isFinite(refined.ssr) && refined.ssr <= atGrid.ssr ? refined : candidate.grid;
  const sigmaFromC = cSd > 0 ? sigmaCAt(x, b) : gridSigmaC;
  const energy = (k: number) => b * scanEnergyAt(scan, k, branch.ground, x);
  const calculated = float64Of(levels, (k) => energy(k));
  const two = twoElectronLevels(scan, branch.ground);
  const transitions = primaryClass(branch).levels.map((k) => ({
    level: k, term: scan.ids[k]!.term, label: scan.ids[k]!.label, energy: energy(k), twoElectron: two[k] === 1,
  }));
  const c = scan.cOverB * b;
  const skip = scoreTerms({ candidate, settings, sorted, transitions, calculated, levels, dq: x * b, b, c, bDetermined: true });
  const cPenalty = assumedCPenalty(observations, sigmaFromC, parameterCount({ mode: settings.mode, alphaFree: settings.alphaFree }));
  const penalties = [...variant.penalties, ...skip.penalties, ...(cPenalty ? [cPenalty] : [])];
  let ssr = 0;
  let wSum = 0;
  observations.forEach((obs, i) => {
    ssr += w[i]! * (calculated[i]! - obs.position) ** 2;
    wSum += w[i]!;
  });
  const wrms = Math.sqrt(ssr / wSum);
  const chiSquare = chiSquareOf(observations, calculated, sigmaFromC);
  return {
    candidate, params: { dq: x * b, b, c }, bDetermined: true, levels: null,
    groundTerm: scan.ids[branch.ground]!.term, spinState: branchSpinState(candidate),
    calculated, levelIndices: levels, wrms, chiSquare, penalties, skipped: skip.skipped, coincident: skip.coincident,
    score: chiSquare + penaltyTotal(penalties), lsq: null, problem: null, keptGrid: false, notes: [], sigmaFromC,
  };
}
