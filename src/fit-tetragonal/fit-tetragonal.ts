import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import { freeIonRacah } from '../chemistry/free-ion-racah.js';
import { parseIon, type Ion } from '../chemistry/ions.js';
import { FieldgapError, invalidArgument } from '../errors.js';
import { normalizeBands, type BandInput, type ObservedBand } from '../fit/bands.js';
import { defaultBandSigma } from '../fit/observations.js';
import type { FieldLevel, ResolvedParameters } from '../ligand-field/field-levels.js';
import { freeIonZeta } from '../ligand-field/free-ion-zeta.js';
import type { Geometry } from '../ligand-field/types.js';
import { labelKeys, modelEnergies, type ModelSetting } from './model.js';
import { levenbergMarquardt, type SolveResult } from './solve.js';

/**
 * Fit of Dq, Ds, Dt (and B, and ζ when asked) to observed band maxima, in a
 * tetragonal field (`--symmetry tetragonal`) or in a cubic one with
 * spin–orbit coupling (`--zeta` > 0 without --symmetry tetragonal).
 *
 * Assignment: the bands (charge-transfer and spin-forbidden ones left out),
 * in ascending order, go to spin-allowed transitions from the ground level
 * (same multiplicity as the ground level; with spin–orbit, that of the
 * dominant spin-free parent), also in ascending order; every such choice
 * among the lowest MAX_CANDIDATES transitions is fitted and the lowest
 * weighted χ² wins (ties: the assignment with fewer skipped levels). Each
 * assigned level shows its octahedral parent, so the two components of a
 * split 4T1g band read as 4Eg[4T1g(F)] and 4A2g[4T1g(F)].
 *
 * Determinacy: with fewer independent bands than free parameters the
 * Jacobian is rank deficient; the step is the minimum-norm one (the
 * undetermined combinations keep their starting values: Ds = Dt = 0, ζ
 * as fixed), the result says which combinations the data fix (the rows of
 * the Jacobian's row space in reduced echelon form) and gives null
 * uncertainties for parameters not fixed on their own.
 * Uncertainties: from the weighted Jacobian, σ_band = the given uncertainty
 * or max(100, 1 % of the position) cm-1 (as the cubic fit), scaled by the
 * reduced χ² when there are more bands than fitted parameters.
 */
export interface TetragonalFitInput {
  ion?: string;
  d?: number;
  geometry?: Geometry;
  bands: readonly (number | BandInput)[] | string;
  /** 'tetragonal' (Dq, Ds, Dt) or 'cubic' (Dq only; with ζ, the spin–orbit fit). Default 'tetragonal'. */
  symmetry?: 'cubic' | 'tetragonal';
  /** Fixed ζ in cm-1, or 'free-ion' for the ion's tabulated value. Default 0. */
  zeta?: number | 'free-ion';
  /** Fit ζ as well (starting from the zeta given, or 0.8 × the free ion's, or 400 cm-1). */
  freeZeta?: boolean;
  /** Fixed C/B. Default: C0/B0 of the free ion, else 4.5. */
  cOverB?: number;
  /** Fixed Racah B in cm-1 (instead of fitting it). */
  b?: number;
}

export interface TetragonalAssignment {
  observed: number;
  calculated: number;
  residual: number;
  term: string;
  parent: string;
  label: string;
  degeneracy: number;
  bands: number[];
}

export interface TetragonalFitResult {
  d: number;
  ion: string | null;
  geometry: Geometry;
  symmetry: 'cubic' | 'tetragonal';
  dq: number;
  tenDq: number;
  ds: number;
  dt: number;
  b: number | null;
  c: number | null;
  cOverB: number;
  zeta: number;
  zetaMode: 'fixed' | 'free-ion' | 'free';
  freeIonZeta: number | null;
  /** Standard uncertainties (cm-1); null when fixed or not determined by the data on its own. */
  uncertainty: { dq: number | null; tenDq: number | null; ds: number | null; dt: number | null; b: number | null; c: number | null; zeta: number | null };
  status: 'exact' | 'converged' | 'underdetermined' | 'not-converged';
  /** The parameter combinations the data fix, e.g. ["Dq", "Ds − 1.667·Dt"]. */
  determined: string[];
  /** Free parameters the data do not fix on their own. */
  undetermined: string[];
  rmsResidual: number;
  groundTerm: string;
  groundLabel: string;
  assignments: TetragonalAssignment[];
  alternatives: Array<{ labels: string[]; rmsResidual: number }>;
  predicted: Array<Pick<FieldLevel, 'energy' | 'degeneracy' | 'irrep' | 'parent' | 'label'>>;
  warnings: string[];
  notes: string[];
}

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

const PARAMETER_NAMES = ['Dq', 'Ds', 'Dt', 'B', 'ζ'] as const;

/**
 * Index lists of length k over 0..n−1 in lexicographic order, at most limit:
 * non-decreasing when repeats are allowed (several bands on one level),
 * increasing otherwise (each band on its own level).
 */
function indexLists(n: number, k: number, limit: number, repeats: boolean): number[][] {
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

/** Reduced row echelon form of the row space (rows with a pivot), for naming fixed combinations. */
function rowSpaceCombinations(J: Matrix, free: number[], tol: number): { combos: string[]; pivots: Set<number> } {
  const rows = J.rows;
  const cols = free.length;
  const a = Array.from({ length: rows }, (_, i) => free.map((j) => J.get(i, j)));
  const pivots: number[] = [];
  let r = 0;
  for (let c = 0; c < cols && r < rows; c++) {
    let best = r;
    for (let i = r + 1; i < rows; i++) if (Math.abs(a[i]![c]!) > Math.abs(a[best]![c]!)) best = i;
    if (Math.abs(a[best]![c]!) <= tol) continue;
    [a[r], a[best]] = [a[best]!, a[r]!];
    const pivot = a[r]![c]!;
    for (let k = 0; k < cols; k++) a[r]![k] = a[r]![k]! / pivot;
    for (let i = 0; i < rows; i++) {
      if (i === r) continue;
      const factor = a[i]![c]!;
      for (let k = 0; k < cols; k++) a[i]![k] = a[i]![k]! - factor * a[r]![k]!;
    }
    pivots.push(c);
    r++;
  }
  const combos = pivots.map((c, row) => {
    let text = PARAMETER_NAMES[free[c]!]!;
    for (let k = 0; k < cols; k++) {
      if (k === c) continue;
      const v = a[row]![k]!;
      if (Math.abs(v) < 1e-6) continue;
      text += ` ${v < 0 ? '−' : '+'} ${Math.abs(v - Math.round(v)) < 1e-6 ? Math.abs(Math.round(v)) : Math.abs(v).toFixed(3)}·${PARAMETER_NAMES[free[k]!]}`;
    }
    return text.replace(/ 1·/g, ' ');
  });
  // A parameter is fixed on its own when its pivot row has no other entries.
  const alone = new Set<number>();
  pivots.forEach((c, row) => {
    if (a[row]!.every((v, k) => k === c || Math.abs(v) < 1e-6)) alone.add(free[c]!);
  });
  return { combos, pivots: alone };
}

interface Trial {
  solve: SolveResult;
  /** Level keys of the bands, in band order. */
  chosen: string[];
  skipped: number;
  /** All five parameters at the start (the fixed ones stay). */
  base: Float64Array;
  /** The ground level at the solution has the multiplicity the candidates were chosen for. */
  keepsGround: boolean;
}

export function fitTetragonal(input: TetragonalFitInput): TetragonalFitResult {
  if (typeof input !== 'object' || input === null) throw invalidArgument('', 'the fit input must be an object with bands and an ion or d');
  const ion: Ion | null = input.ion === undefined ? null : parseIon(input.ion, { path: 'ion' });
  const d = input.d ?? ion?.d;
  if (d === undefined) throw invalidArgument('ion', 'give the metal as an ion (e.g. "Cu2+") or as a d-electron count');
  if (ion && input.d !== undefined && ion.d !== input.d) throw invalidArgument('d', `d = ${input.d} disagrees with ${ion.label}, which is d${ion.d}`);
  if (!Number.isInteger(d) || d < 1 || d > 9) throw invalidArgument(ion ? 'ion' : 'd', `d${d} has no d–d transitions, so there is nothing to fit`);
  const geometry = input.geometry ?? 'octahedral';
  const symmetry = input.symmetry ?? 'tetragonal';
  if (symmetry === 'tetragonal' && geometry !== 'octahedral') {
    throw invalidArgument('geometry', 'the tetragonal fit is for (distorted) octahedra and square-planar complexes: use the octahedral geometry');
  }
  const tabulatedZeta = ion ? freeIonZeta(ion.label) : undefined;
  let zeta = 0;
  let zetaMode: TetragonalFitResult['zetaMode'] = 'fixed';
  if (input.zeta === 'free-ion') {
    if (!tabulatedZeta) throw invalidArgument('zeta', `no free-ion ζ is tabulated for ${ion ? ion.label : `a bare d${d}`}: give ζ in cm-1`);
    zeta = tabulatedZeta.zeta;
    zetaMode = 'free-ion';
  } else if (input.zeta !== undefined) {
    if (typeof input.zeta !== 'number' || !Number.isFinite(input.zeta) || input.zeta < 0) throw invalidArgument('zeta', 'zeta must be ≥ 0 cm-1 or "free-ion"');
    zeta = input.zeta;
  }
  if (input.freeZeta) {
    zetaMode = 'free';
    if (zeta === 0) zeta = tabulatedZeta ? 0.8 * tabulatedZeta.zeta : 400;
  }
  const free = ion ? freeIonRacah(ion) : undefined;
  const cOverB = input.cOverB ?? (free ? free.c / free.b : 4.5);
  const bMatters = d !== 1 && d !== 9;
  const bStart = input.b ?? (free ? 0.75 * free.b : 800);
  const observed: ObservedBand[] = normalizeBands(input.bands, 'bands');
  const fitted = observed.filter((band) => !band.flags.includes('charge-transfer') && !band.flags.includes('spin-forbidden'));
  if (fitted.length === 0) throw invalidArgument('bands', 'no d–d band left to fit (all are charge-transfer or spin-forbidden)');
  fitted.sort((x, y) => x.position - y.position);
  const setting: ModelSetting = { d, geometry, spinOrbit: zeta > 0 };
  // Free parameters, in the order dq, ds, dt, b, zeta.
  const freeParams = [0, ...(symmetry === 'tetragonal' ? [1, 2] : []), ...(bMatters && input.b === undefined ? [3] : []), ...(zetaMode === 'free' ? [4] : [])];
  // Plausible ranges (common practice for d-block complexes): outside them the model only fits by accident.
  const bOf = (v: number): number => Math.min(2000, Math.max(150, v));
  const toParameters = (x: Float64Array): ResolvedParameters => ({
    dq: Math.max(0, x[0]!), ds: x[1]!, dt: x[2]!, b: bOf(x[3]!), c: cOverB * bOf(x[3]!), zeta: Math.min(3000, Math.max(0, x[4]!)),
  });
  const full = (freeX: Float64Array, base: Float64Array): Float64Array => {
    const x = Float64Array.from(base);
    freeParams.forEach((j, i) => (x[j] = freeX[i]!));
    return x;
  };
  const sigmas = fitted.map((band) => band.uncertainty ?? defaultBandSigma(band.position));
  // Starting Dq: the highest band is of order 10Dq–20Dq; scan Dq so that the lowest spin-allowed transition meets the lowest band.
  const base = new Float64Array([0, 0, 0, bStart, zeta]);
  // With spin–orbit in a cubic field the lowest band may belong to the second or third term: try each.
  const startDqs = scanStartDqs(setting, base, toParameters, fitted[0]!.position, setting.spinOrbit && symmetry === 'cubic' ? 3 : 1);
  const startDq = startDqs[0]!;
  base[0] = startDq;
  // Starting points: undistorted, elongated, compressed, and (d7–d9) strongly elongated towards square planar;
  // each gives its own ground level and candidate transitions (a square-planar d8 is a singlet, an octahedral one a triplet).
  const starts: Array<[number, number, number]> =
    symmetry === 'tetragonal'
      ? [[0.02, 0.01], [0.15, 0.06], [-0.15, -0.06], ...(d >= 7 ? [[0.8, 0.3] as [number, number]] : [])].map(([s, t]) => [startDq, s! * startDq, t! * startDq])
      : startDqs.map((dq) => [dq, 0, 0]);
  const steps = new Float64Array([2, 2, 2, 2, 1]);
  const trials: Trial[] = [];
  /** Spin–orbit plans already fitted (the same assignment reached from another start is fitted once). */
  const fittedPlans = new Set<string>();
  /**
   * With spin–orbit, two stages. 1: without ζ, each band goes to a spin-free
   * spin-allowed level, several neighbouring bands possibly to the same one (the
   * components of one multiplet); the best such grouping is fitted. 2: the
   * bands of each group go, in ascending order, to double-group levels whose
   * dominant parent is that spin-free level; every such choice is a plan.
   */
  const spinOrbitPlans = (x0: Float64Array): Array<{ chosen: string[]; skipped: number; x0: Float64Array }> => {
    const spinFree: ModelSetting = { ...setting, spinOrbit: false };
    const sfStartX = Float64Array.from(x0);
    sfStartX[4] = 0;
    const sfStart = toParameters(sfStartX);
    const { byKey: sfBy } = labelKeys(spinFree, sfStart);
    const sfEnergies = modelEnergies(spinFree, sfStart);
    const sfGround = [...sfEnergies].find(([, e]) => e === 0)![0];
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
    const sfFree = freeParams.filter((j) => j !== 4);
    const sfFull = (freeX: Float64Array): Float64Array => {
      const x = Float64Array.from(sfStartX);
      sfFree.forEach((j, i) => (x[j] = freeX[i]!));
      return x;
    };
    const groupings: Array<{ chi2: number; x: Float64Array; pick: number[] }> = [];
    for (const pick of indexLists(sfCandidates.length, fitted.length, 150, true)) {
      const residuals = (freeX: Float64Array): Float64Array => {
        const energies = modelEnergies(spinFree, toParameters(sfFull(freeX)));
        return Float64Array.from(fitted, (band, i) => (energies.get(sfCandidates[pick[i]!]!)! - band.position) / sigmas[i]!);
      };
      const solve = levenbergMarquardt(residuals, Float64Array.from(sfFree, (j) => sfStartX[j]!), Float64Array.from(sfFree, (j) => steps[j]!), 30);
      groupings.push({ chi2: solve.chi2, x: sfFull(solve.x), pick });
    }
    // A multiplet's spread makes the spin-free fit of a grouping approximate: keep the few best groupings.
    groupings.sort((x, y) => x.chi2 - y.chi2);
    return groupings.slice(0, SPIN_FREE_GROUPINGS).flatMap((grouping) => plansFor(grouping, x0[4]!, sfCandidates, sfBy));
  };
  const plansFor = (
    best: { x: Float64Array; pick: number[] },
    zetaStart: number,
    sfCandidates: string[],
    sfBy: Map<string, FieldLevel>,
  ): Array<{ chosen: string[]; skipped: number; x0: Float64Array }> => {
    const start = Float64Array.from(best.x);
    start[4] = zetaStart;
    const p = toParameters(start);
    const { byKey } = labelKeys(setting, p);
    const energies = modelEnergies(setting, p);
    const ground = [...energies].find(([, e]) => e === 0)![0];
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
          if (symmetry === 'cubic' && seen.has(level)) return false;
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
  };
  for (const [dq0, ds0, dt0] of starts) {
    const x0 = Float64Array.from(base);
    x0[0] = dq0;
    x0[1] = ds0;
    x0[2] = dt0;
    const start = toParameters(x0);
    const { byKey } = labelKeys(setting, start);
    const startEnergies = modelEnergies(setting, start);
    const groundKey = [...startEnergies].find(([, e]) => e === 0)![0];
    const groundMultiplicity = byKey.get(groundKey)!.multiplicity;
    // Candidates: spin-allowed transitions from the ground level, lowest first.
    const seen = new Set<FieldLevel>([byKey.get(groundKey)!]);
    const candidates = [...startEnergies]
      .filter(([key, energy]) => key !== groundKey && byKey.get(key)!.multiplicity === groundMultiplicity && (symmetry === 'tetragonal' || energy > 0))
      .sort((x, y) => x[1] - y[1])
      .filter(([key]) => {
        // In a cubic field with spin–orbit a Γ8 is two keys (its D4' halves): keep one.
        if (symmetry === 'tetragonal') return true;
        const level = byKey.get(key)!;
        if (seen.has(level)) return false;
        seen.add(level);
        return true;
      })
      .slice(0, setting.spinOrbit ? MAX_CANDIDATES_SPIN_ORBIT : MAX_CANDIDATES)
      .map(([key]) => key);
    const plans: Array<{ chosen: string[]; skipped: number; x0: Float64Array }> = [];
    if (setting.spinOrbit) {
      plans.push(...spinOrbitPlans(x0));
    } else {
      if (candidates.length < fitted.length) continue;
      for (const pick of indexLists(candidates.length, fitted.length, MAX_ASSIGNMENTS, false)) {
        plans.push({ chosen: pick.map((i) => candidates[i]!), skipped: pick[pick.length - 1]! + 1 - pick.length, x0 });
      }
    }
    for (const { chosen, skipped, x0: planStart } of plans) {
      if (setting.spinOrbit) {
        const id = chosen.join();
        if (fittedPlans.has(id)) continue;
        fittedPlans.add(id);
      }
      // Bands ascending meet the chosen levels ascending at the current parameters (sorted energies are continuous).
      const sortedChosen = (energies: Map<string, number>): string[] => [...chosen].sort((x, y) => energies.get(x)! - energies.get(y)!);
      const residuals = (freeX: Float64Array): Float64Array => {
        const energies = modelEnergies(setting, toParameters(full(freeX, planStart)));
        const order = sortedChosen(energies);
        return Float64Array.from(fitted, (band, i) => (energies.get(order[i]!)! - band.position) / sigmas[i]!);
      };
      // With spin–orbit each evaluation is all C(10, n) states, and the start is already close (stage 1): fewer iterations.
      const solve = levenbergMarquardt(residuals, Float64Array.from(freeParams, (j) => planStart[j]!), Float64Array.from(freeParams, (j) => steps[j]!), setting.spinOrbit ? 30 : 100);
      const at = toParameters(full(solve.x, planStart));
      const energies = modelEnergies(setting, at);
      const groundNow = [...energies].find(([, e]) => e === 0)![0];
      const keepsGround = labelKeys(setting, at).byKey.get(groundNow)!.multiplicity === groundMultiplicity;
      trials.push({ solve, chosen: sortedChosen(energies), skipped, base: planStart, keepsGround });
    }
  }
  if (trials.length === 0) {
    throw new FieldgapError('unexplained', `${fitted.length} bands but fewer spin-allowed transitions from the ground level of d${d}: flag extra bands (:sf, :ct) or check the ion`, 'bands');
  }
  // A fit whose ground level changed spin from the one its candidates assumed is not self-consistent: last.
  trials.sort((x, y) => Number(y.keepsGround) - Number(x.keepsGround) || x.solve.chi2 - y.solve.chi2 || x.skipped - y.skipped);
  const winner = trials[0]!;
  const x = full(winner.solve.x, winner.base);
  const p = toParameters(x);
  const labelled = labelKeys(setting, p);
  const energies = modelEnergies(setting, p);
  const assignments: TetragonalAssignment[] = fitted.map((band, i) => {
    const key = winner.chosen[i]!;
    const level = labelled.byKey.get(key)!;
    const calculated = energies.get(key)!;
    return {
      observed: band.position, calculated, residual: calculated - band.position, term: level.term, parent: level.parent,
      label: level.label, degeneracy: level.degeneracy, bands: [band.index],
    };
  });
  const rmsResidual = Math.sqrt(assignments.reduce((s, a) => s + a.residual * a.residual, 0) / assignments.length);
  // Determinacy and uncertainties from the weighted Jacobian at the solution (columns: free parameters).
  const J = winner.solve.jacobian;
  const scale = Math.max(...J.to1DArray().map(Math.abs), 1e-300);
  const fullJ = new Matrix(J.rows, 5);
  freeParams.forEach((j, c) => {
    for (let i = 0; i < J.rows; i++) fullJ.set(i, j, J.get(i, c));
  });
  const { combos, pivots } = rowSpaceCombinations(fullJ, freeParams, 1e-7 * scale);
  const rank = combos.length;
  const dof = fitted.length - rank;
  const chi2 = winner.solve.chi2;
  const varianceScale = dof > 0 ? Math.max(1, chi2 / dof) : 1;
  const svd = new SingularValueDecomposition(J.transpose().mmul(J), { autoTranspose: true });
  const covariance = svd.inverse().mul(varianceScale);
  const sd = (j: number): number | null => {
    const c = freeParams.indexOf(j);
    if (c < 0 || !pivots.has(j)) return null;
    return Math.sqrt(Math.max(0, covariance.get(c, c)));
  };
  const undetermined = freeParams.filter((j) => !pivots.has(j)).map((j) => PARAMETER_NAMES[j]!);
  const status: TetragonalFitResult['status'] = !winner.solve.converged ? 'not-converged' : rank < freeParams.length ? 'underdetermined' : dof === 0 ? 'exact' : 'converged';
  const warnings: string[] = [];
  const notes: string[] = [];
  if (undetermined.length > 0) {
    warnings.push(
      `${fitted.length} band${fitted.length === 1 ? '' : 's'} cannot fix ${freeParams.length} parameters: the data fix ${combos.join(', ')}; ` +
        `${undetermined.join(', ')} ${undetermined.length === 1 ? 'is' : 'are'} not fixed on ${undetermined.length === 1 ? 'its' : 'their'} own (the values shown keep the undetermined combination at its start, Ds = Dt = 0${zetaMode === 'free' ? ', ζ as started' : ''})`,
    );
  }
  const rival = trials.slice(1).find((t) => t.keepsGround && t.solve.chi2 <= winner.solve.chi2 + 1e-6 * (1 + winner.solve.chi2) && t.chosen.join() !== winner.chosen.join());
  if (rival) {
    const rivalP = toParameters(full(rival.solve.x, rival.base));
    warnings.push(
      `another assignment fits as well (Dq ${rivalP.dq.toFixed(0)}, Ds ${rivalP.ds.toFixed(0)}, Dt ${rivalP.dt.toFixed(0)} cm-1, ground ${labelKeys(setting, rivalP).levels[0]!.label}): ` +
        'the band positions alone cannot tell them apart (polarised spectra or intensities can)',
    );
  }
  if (!bMatters) notes.push(`d${d}: one electron or hole, so Racah B and C play no part; they are not reported`);
  if (zeta > 0) {
    warnings.push(
      'spin–orbit fit: the bands are grouped by spin-free parent first, then matched to its double-group levels; ' +
        'checked on multiplets the engine itself generated, not yet on published spectra: check the assignment',
    );
  }
  if (symmetry === 'tetragonal') notes.push('tetragonal convention: a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt');
  if (tabulatedZeta && p.zeta > 0) notes.push(`ζ = ${p.zeta.toFixed(0)} cm-1 is ${(100 * p.zeta / tabulatedZeta.zeta).toFixed(0)} % of the free ${ion!.label} ion's ${tabulatedZeta.zeta} cm-1 (${tabulatedZeta.source})`);
  const ground = labelled.levels[0]!;
  return {
    d, ion: ion?.label ?? null, geometry, symmetry,
    dq: p.dq, tenDq: 10 * p.dq, ds: p.ds, dt: p.dt,
    b: bMatters ? p.b : null, c: bMatters ? p.c : null, cOverB, zeta: p.zeta, zetaMode, freeIonZeta: tabulatedZeta?.zeta ?? null,
    uncertainty: {
      dq: sd(0), tenDq: sd(0) === null ? null : 10 * sd(0)!, ds: sd(1), dt: sd(2), b: bMatters ? sd(3) : null,
      c: bMatters && sd(3) !== null ? cOverB * sd(3)! : null, zeta: sd(4),
    },
    status, determined: combos, undetermined, rmsResidual,
    groundTerm: ground.term, groundLabel: ground.label,
    assignments,
    alternatives: trials.slice(1, 4).map((t) => ({
      labels: t.chosen.map((key) => labelKeys(setting, toParameters(full(t.solve.x, t.base))).byKey.get(key)!.label),
      rmsResidual: Math.sqrt(t.solve.residuals.reduce((s, v, i) => s + (v * sigmas[i]!) ** 2, 0) / fitted.length),
    })),
    predicted: labelled.levels.filter((l) => l.energy > 0 && l.energy < 50000).map(({ energy, degeneracy, irrep, parent, label }) => ({ energy, degeneracy, irrep, parent, label })),
    warnings, notes,
  };
}

/**
 * Starting Dq values (cm-1): where the lowest band meets the first, second, …
 * spin-allowed transition of the spin-free cubic model (count of them).
 */
function scanStartDqs(setting: ModelSetting, base: Float64Array, toParameters: (x: Float64Array) => ResolvedParameters, lowest: number, count: number): number[] {
  const best = Array.from({ length: count }, () => ({ dq: lowest / 10, miss: Infinity }));
  // Spin-free and cubic: cheap, and close enough for a start.
  const spinFree: ModelSetting = { ...setting, spinOrbit: false };
  for (let dq = 100; dq <= 4000; dq += 50) {
    const x = Float64Array.from(base);
    x[0] = dq;
    x[4] = 0;
    const p = toParameters(x);
    const { byKey, levels } = labelKeys(spinFree, p);
    const multiplicity = levels[0]!.multiplicity;
    const allowed = levels.filter((l) => l.energy > 0 && l.multiplicity === multiplicity).map((l) => l.energy);
    void byKey;
    for (let k = 0; k < count && k < allowed.length; k++) {
      const miss = Math.abs(allowed[k]! - lowest);
      if (miss < best[k]!.miss) best[k] = { dq, miss };
    }
  }
  return best.filter((b) => b.miss < Infinity).map((b) => b.dq);
}
