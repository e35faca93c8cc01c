import type { FieldLevel } from '../ligand-field/field-levels.js';
import { labelKeys, modelEnergies, type ModelSetting } from './model.js';
import type { FitSettings } from './settings.js';
import { levenbergMarquardt } from './solve.js';
import type { Plan } from './types.js';

/**
 * Which assignments a tetragonal (or spin–orbit) fit tries: the starting
 * points, the candidate levels at each, and the plans (bands → levels).
 *
 * Spin-free: the bands, ascending, go to spin-allowed transitions from the
 * ground level (the ground level's multiplicity), also ascending; every such
 * choice among the lowest MAX_CANDIDATES is a plan. Each tetragonal
 * component of an octahedral level is its own candidate, so two bands may
 * sit on two components of one parent (a split 4T1g band of a trans
 * complex), and a band may sit on one component while the other hides under
 * it (score.ts charges nothing for a component within the band's half
 * width).
 * Spin–orbit: two stages (spinOrbitPlans).
 */

/** Spin-allowed transitions considered for the assignment. */
const MAX_CANDIDATES = 8;
/** With spin–orbit a term splits into several levels: more candidates (a T1 term of a quartet gives four). */
const MAX_CANDIDATES_SPIN_ORBIT = 13;
/** At most this many assignments are fitted per start (the lowest-energy ones first). */
const MAX_ASSIGNMENTS = 200;
/** With spin–orbit every evaluation diagonalises all C(10, n) states: fewer assignments per start. */
const MAX_ASSIGNMENTS_SPIN_ORBIT = 30;
/** With spin–orbit: the best few spin-free groupings of the bands are carried into the second stage. */
const SPIN_FREE_GROUPINGS = 3;

/**
 * Index lists of length k over 0..n−1 in lexicographic order, at most limit:
 * non-decreasing when repeats are allowed (several bands on one level),
 * increasing otherwise (each band on its own level).
 */
export function indexLists(n: number, k: number, limit: number, repeats: boolean): number[][] {
  const out: number[][] = [];
  const pick: number[] = [];
  const walk = (from: number): void => {
    if (out.length >= limit) return;
    if (pick.length === k) {
      out.push([...pick]);
      return;
    }
    const last = repeats ? n - 1 : n - (k - pick.length);
    for (let i = from; i <= last; i++) {
      pick.push(i);
      walk(repeats ? i : i + 1);
      pick.pop();
    }
  };
  walk(0);
  return out;
}

/** The key of the ground level (energy 0) among model energies. */
export function groundKeyOf(energies: Map<string, number>): string {
  return [...energies].find(([, e]) => e === 0)![0];
}

/**
 * Starting Dq values (cm-1): where the lowest band meets the first, second, …
 * spin-allowed transition of the spin-free cubic model (count of them).
 */
export function scanStartDqs(s: FitSettings, base: Float64Array, count: number): number[] {
  const lowest = s.fitted[0]!.position;
  const best = Array.from({ length: count }, () => ({ dq: lowest / 10, miss: Infinity }));
  // Spin-free and cubic: cheap, and close enough for a start.
  const spinFree: ModelSetting = { ...s.setting, spinOrbit: false };
  for (let dq = 100; dq <= 4000; dq += 50) {
    const x = Float64Array.from(base);
    x[0] = dq;
    x[4] = 0;
    const { levels } = labelKeys(spinFree, s.toParameters(x));
    const multiplicity = levels[0]!.multiplicity;
    const allowed = levels.filter((l) => l.energy > 0 && l.multiplicity === multiplicity).map((l) => l.energy);
    for (let k = 0; k < count && k < allowed.length; k++) {
      const miss = Math.abs(allowed[k]! - lowest);
      if (miss < best[k]!.miss) best[k] = { dq, miss };
    }
  }
  return best.filter((b) => b.miss < Infinity).map((b) => b.dq);
}

/**
 * Starting vectors: undistorted, elongated, compressed, and (d7–d9) strongly
 * elongated towards square planar; each gives its own ground level and
 * candidates (a square-planar d8 is a singlet, an octahedral one a triplet).
 * In a cubic field with spin–orbit the lowest band may belong to the second
 * or third term: one start per reading.
 */
export function startingPoints(s: FitSettings): Float64Array[] {
  const base = new Float64Array([0, 0, 0, s.bStart, s.zeta]);
  const startDqs = scanStartDqs(s, base, s.setting.spinOrbit && s.symmetry === 'cubic' ? 3 : 1);
  const startDq = startDqs[0]!;
  const triples: Array<[number, number, number]> =
    s.symmetry === 'tetragonal'
      ? [[0.02, 0.01], [0.15, 0.06], [-0.15, -0.06], ...(s.d >= 7 ? [[0.8, 0.3] as [number, number]] : [])].map(([ds, dt]) => [startDq, ds! * startDq, dt! * startDq])
      : startDqs.map((dq) => [dq, 0, 0]);
  return triples.map(([dq, ds, dt]) => {
    const x = Float64Array.from(base);
    x[0] = dq;
    x[1] = ds;
    x[2] = dt;
    return x;
  });
}

/** The ground level's multiplicity and the spin-allowed candidate keys at a start, lowest first. */
export function spinAllowedCandidates(s: FitSettings, x0: Float64Array): { groundMultiplicity: number; candidates: string[] } {
  const start = s.toParameters(x0);
  const { byKey } = labelKeys(s.setting, start);
  const energies = modelEnergies(s.setting, start);
  const groundKey = groundKeyOf(energies);
  const groundMultiplicity = byKey.get(groundKey)!.multiplicity;
  const seen = new Set<FieldLevel>([byKey.get(groundKey)!]);
  const candidates = [...energies]
    .filter(([key, energy]) => key !== groundKey && byKey.get(key)!.multiplicity === groundMultiplicity && (s.symmetry === 'tetragonal' || energy > 0))
    .sort((x, y) => x[1] - y[1])
    .filter(([key]) => {
      // In a cubic field with spin–orbit a Γ8 is two keys (its D4' halves): keep one.
      if (s.symmetry === 'tetragonal') return true;
      const level = byKey.get(key)!;
      if (seen.has(level)) return false;
      seen.add(level);
      return true;
    })
    .slice(0, s.setting.spinOrbit ? MAX_CANDIDATES_SPIN_ORBIT : MAX_CANDIDATES)
    .map(([key]) => key);
  return { groundMultiplicity, candidates };
}

/** Spin-free plans at a start: every increasing choice of candidates, one per band. */
export function spinFreePlans(s: FitSettings, x0: Float64Array, candidates: readonly string[]): Plan[] {
  if (candidates.length < s.fitted.length) return [];
  return indexLists(candidates.length, s.fitted.length, MAX_ASSIGNMENTS, false).map((pick) => ({
    chosen: pick.map((i) => candidates[i]!), skipped: pick[pick.length - 1]! + 1 - pick.length, x0,
  }));
}

/**
 * With spin–orbit, two stages. 1: without ζ, each band goes to a spin-free
 * spin-allowed level, several neighbouring bands possibly to the same one (the
 * components of one multiplet); the best few such groupings are fitted. 2: the
 * bands of each group go, in ascending order, to double-group levels whose
 * dominant parent is that spin-free level; every such choice is a plan.
 */
export function spinOrbitPlans(s: FitSettings, x0: Float64Array): Plan[] {
  const spinFree: ModelSetting = { ...s.setting, spinOrbit: false };
  const sfStartX = Float64Array.from(x0);
  sfStartX[4] = 0;
  const sfStart = s.toParameters(sfStartX);
  const { byKey: sfBy } = labelKeys(spinFree, sfStart);
  const sfEnergies = modelEnergies(spinFree, sfStart);
  const sfGround = groundKeyOf(sfEnergies);
  const multiplicity = sfBy.get(sfGround)!.multiplicity;
  const seenLevels = new Set<FieldLevel>([sfBy.get(sfGround)!]);
  const sfCandidates = [...sfEnergies]
    .filter(([key, e]) => key !== sfGround && e > 0 && sfBy.get(key)!.multiplicity === multiplicity)
    .sort((x, y) => x[1] - y[1])
    .filter(([key]) => {
      const level = sfBy.get(key)!;
      if (seenLevels.has(level)) return false;
      seenLevels.add(level);
      return true;
    })
    .slice(0, 6)
    .map(([key]) => key);
  const sfFree = s.freeParams.filter((j) => j !== 4);
  const sfFull = (freeX: Float64Array): Float64Array => {
    const x = Float64Array.from(sfStartX);
    sfFree.forEach((j, i) => (x[j] = freeX[i]!));
    return x;
  };
  const groupings: Array<{ chi2: number; x: Float64Array; pick: number[] }> = [];
  for (const pick of indexLists(sfCandidates.length, s.fitted.length, 150, true)) {
    const residuals = (freeX: Float64Array): Float64Array => {
      const energies = modelEnergies(spinFree, s.toParameters(sfFull(freeX)));
      return Float64Array.from(s.fitted, (band, i) => (energies.get(sfCandidates[pick[i]!]!)! - band.position) / s.sigmas[i]!);
    };
    const solve = levenbergMarquardt(residuals, Float64Array.from(sfFree, (j) => sfStartX[j]!), Float64Array.from(sfFree, (j) => s.steps[j]!), 30);
    groupings.push({ chi2: solve.chi2, x: sfFull(solve.x), pick });
  }
  // A multiplet's spread makes the spin-free fit of a grouping approximate: keep the few best groupings.
  groupings.sort((x, y) => x.chi2 - y.chi2);
  return groupings.slice(0, SPIN_FREE_GROUPINGS).flatMap((grouping) => plansFor(s, grouping, x0[4]!, sfCandidates, sfBy));
}

function plansFor(
  s: FitSettings,
  best: { x: Float64Array; pick: number[] },
  zetaStart: number,
  sfCandidates: string[],
  sfBy: Map<string, FieldLevel>,
): Plan[] {
  const start = Float64Array.from(best.x);
  start[4] = zetaStart;
  const p = s.toParameters(start);
  const { byKey } = labelKeys(s.setting, p);
  const energies = modelEnergies(s.setting, p);
  const ground = groundKeyOf(energies);
  // Bands per spin-free level (in band order), and the double-group levels of each.
  const groups = new Map<number, number[]>();
  best.pick.forEach((c, i) => groups.set(c, [...(groups.get(c) ?? []), i]));
  const options: string[][][] = [];
  for (const [c, bandsOf] of groups) {
    const parent = sfBy.get(sfCandidates[c]!)!.label;
    const seen = new Set<FieldLevel>([byKey.get(ground)!]);
    const keys = [...energies]
      .filter(([key]) => byKey.get(key)!.parent === parent)
      .sort((x, y) => x[1] - y[1])
      .filter(([key]) => {
        const level = byKey.get(key)!;
        if (s.symmetry === 'cubic' && seen.has(level)) return false;
        seen.add(level);
        return true;
      })
      .map(([key]) => key);
    if (keys.length < bandsOf.length) return [];
    options.push(indexLists(keys.length, bandsOf.length, 50, false).map((pick) => pick.map((i) => keys[i]!)));
  }
  // The product of the groups' choices, bands in ascending order.
  let product: string[][] = [[]];
  for (const choices of options) product = product.flatMap((prefix) => choices.map((choice) => [...prefix, ...choice])).slice(0, MAX_ASSIGNMENTS_SPIN_ORBIT);
  return product.map((chosen) => ({ chosen, skipped: 0, x0: start }));
}
