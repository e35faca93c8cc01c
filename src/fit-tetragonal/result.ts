import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import { probabilitiesOf } from '../fit/likelihood.js';
import { labelKeys, modelEnergies } from './model.js';
import { PARAMETER_NAMES, type FitSettings } from './settings.js';
import type { ParentComponents, TetragonalAssignment, TetragonalFitResult, Trial } from './types.js';

/**
 * The result of a tetragonal fit from its ranked trials (best first): the
 * parameters, what the data determine, uncertainties, the assignment with
 * octahedral parents, split parents, runners-up with probabilities, and the
 * warnings and notes.
 *
 * Determinacy: with fewer independent bands than free parameters the
 * Jacobian is rank deficient; the step is the minimum-norm one (the
 * undetermined combinations keep their starting values: Ds = Dt = 0, ζ as
 * fixed), the result says which combinations the data fix (the rows of the
 * Jacobian's row space in reduced echelon form) and gives null
 * uncertainties for parameters not fixed on their own.
 * Uncertainties: from the weighted Jacobian, scaled by the reduced χ² when
 * there are more bands than fitted parameters.
 */

/** Reduced row echelon form of the row space (rows with a pivot), for naming fixed combinations. */
export function rowSpaceCombinations(J: Matrix, free: number[], tol: number): { combos: string[]; pivots: Set<number> } {
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

/** Parents carrying two or more bands on different components: a cubic band split by the distortion (or spin–orbit). */
export function splitParents(assignments: readonly TetragonalAssignment[]): ParentComponents[] {
  const byParent = new Map<string, TetragonalAssignment[]>();
  for (const a of assignments) byParent.set(a.parent, [...(byParent.get(a.parent) ?? []), a]);
  const out: ParentComponents[] = [];
  for (const [parent, list] of byParent) {
    if (new Set(list.map((a) => a.label)).size < 2) continue;
    const sorted = [...list].sort((x, y) => x.observed - y.observed);
    const calcs = sorted.map((a) => a.calculated);
    out.push({ parent, bands: sorted.map((a) => a.observed), labels: sorted.map((a) => a.label), splitting: Math.max(...calcs) - Math.min(...calcs) });
  }
  return out;
}

export function buildResult(s: FitSettings, ranked: readonly Trial[]): TetragonalFitResult {
  const winner = ranked[0]!;
  const { setting, fitted, freeParams, sigmas, cOverB, bMatters, zetaMode, tabulatedZeta, ion, d, geometry, symmetry } = s;
  const p = s.toParameters(s.full(winner.solve.x, winner.base));
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
  const rmsResidual = Math.sqrt(assignments.reduce((sum, a) => sum + a.residual * a.residual, 0) / assignments.length);
  // Determinacy and uncertainties from the weighted Jacobian at the solution (columns: free parameters).
  const J = winner.solve.jacobian;
  const scale = Math.max(...J.to1DArray().map(Math.abs), 1e-300);
  // What the data fix: the band rows only (a prior row, refine.ts, would make every parameter look determined).
  const fullJ = new Matrix(fitted.length, 5);
  freeParams.forEach((j, c) => {
    for (let i = 0; i < fitted.length; i++) fullJ.set(i, j, J.get(i, c));
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
  // Probabilities over the distinct assignments (the same one reached from two starts counts once, at its best).
  const distinct: Trial[] = [];
  const seen = new Set<string>();
  for (const t of ranked) {
    const id = t.chosen.join();
    if (seen.has(id) || !t.keepsGround) continue;
    seen.add(id);
    distinct.push(t);
  }
  const probabilities = probabilitiesOf(distinct.map((t) => t.score));
  const probabilityOf = (t: Trial): number => {
    const i = distinct.indexOf(t);
    return i < 0 ? 0 : probabilities[i]!;
  };
  const warnings: string[] = [];
  const notes: string[] = [];
  if (undetermined.length > 0) {
    warnings.push(
      `${fitted.length} band${fitted.length === 1 ? '' : 's'} cannot fix ${freeParams.length} parameters: the data fix ${combos.join(', ')}; ` +
        `${undetermined.join(', ')} ${undetermined.length === 1 ? 'is' : 'are'} not fixed on ${undetermined.length === 1 ? 'its' : 'their'} own (the values shown keep the undetermined combination at its start, Ds = Dt = 0${zetaMode === 'free' ? ', ζ as started' : ''})`,
    );
  }
  // A rival: another assignment that places the bands as well (same χ²) and scores within 2 (a probability ratio above e^−1).
  const rival = distinct.slice(1).find((t) => t.solve.chi2 <= winner.solve.chi2 + 1e-6 * (1 + winner.solve.chi2) && t.score <= winner.score + 2);
  if (rival) {
    const rivalP = s.toParameters(s.full(rival.solve.x, rival.base));
    warnings.push(
      `another assignment fits as well (Dq ${rivalP.dq.toFixed(0)}, Ds ${rivalP.ds.toFixed(0)}, Dt ${rivalP.dt.toFixed(0)} cm-1, ground ${labelKeys(setting, rivalP).levels[0]!.label}): ` +
        'the band positions alone cannot tell them apart (polarised spectra or intensities can)',
    );
  }
  const components = splitParents(assignments);
  const cause = symmetry === 'tetragonal' ? 'the tetragonal field' : 'spin–orbit coupling';
  for (const c of components) {
    notes.push(`${c.bands.map((b) => b.toFixed(0)).join(' and ')} cm-1 are components of one ${c.parent} band (${c.labels.join(', ')}), split by ${c.splitting.toFixed(0)} cm-1 by ${cause}`);
  }
  if (!bMatters) notes.push(`d${d}: one electron or hole, so Racah B and C play no part; they are not reported`);
  if (s.zeta > 0) {
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
    score: winner.score, probability: probabilityOf(winner), penalties: winner.penalties,
    groundTerm: ground.term, groundLabel: ground.label,
    assignments, components,
    alternatives: distinct.slice(distinct[0] === winner ? 1 : 0, 4).map((t) => ({
      labels: t.chosen.map((key) => labelKeys(setting, s.toParameters(s.full(t.solve.x, t.base))).byKey.get(key)!.label),
      rmsResidual: Math.sqrt(t.solve.residuals.subarray(0, fitted.length).reduce((sum, v, i) => sum + (v * sigmas[i]!) ** 2, 0) / fitted.length),
      score: t.score, probability: probabilityOf(t),
    })),
    predicted: labelled.levels.filter((l) => l.energy > 0 && l.energy < 50000).map(({ energy, degeneracy, irrep, parent, label }) => ({ energy, degeneracy, irrep, parent, label })),
    warnings, notes,
  };
}
