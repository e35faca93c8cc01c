import { ligandByKey } from '../../src/chemistry/ligands.js';
import { jorgensenF, jorgensenH } from '../../src/chemistry/jorgensen.js';
import { ligandShares } from '../../src/series/validate.js';
import type { SeriesAnalysis } from '../../src/series/types.js';

export interface ReferenceSample {
  value: number;
  sigma: number | undefined;
  index: number;
}

/**
 * The per-analysis f and h samples of src/series/factors.ts worked out
 * afresh for every analysis, as that file first did (no plan shared between
 * analyses with the same ligands): the slow reference for its fast path.
 * f_x = (N·10Dq/g − Σ n_j f_j) / n_x, h likewise with 1 − β and k.
 */
export function referenceFactorSamples(analyses: readonly SeriesAnalysis[], g: number, k: number | undefined) {
  const f = new Map<string, ReferenceSample[]>();
  const h = new Map<string, ReferenceSample[]>();
  const notes: string[] = [];
  const add = (map: Map<string, ReferenceSample[]>, key: string, sample: ReferenceSample) => map.set(key, [...(map.get(key) ?? []), sample]);
  analyses.forEach((a, index) => {
    const at = `analyses[${index}]`;
    const shares = ligandShares(a, at).map((s) => ({ ...s, positions: s.count * (ligandByKey(s.ligand)?.denticity ?? 1) }));
    const positions = shares.reduce((n, s) => n + s.positions, 0);
    const fUnknown = shares.length === 1 ? shares : shares.filter((s) => jorgensenF(s.ligand) === undefined);
    if (fUnknown.length !== 1) {
      notes.push(`${at} (${a.sample}): ${fUnknown.length === 0 ? 'every ligand already has an f' : 'more than one ligand without an f'}: gives no f`);
    } else {
      const x = fUnknown[0]!;
      const rest = shares.filter((s) => s !== x).reduce((sum, s) => sum + s.positions * jorgensenF(s.ligand)!, 0);
      const scale = positions / (g * x.positions);
      add(f, x.ligand, { value: a.tenDq * scale - rest / x.positions, sigma: a.tenDqUncertainty === undefined ? undefined : a.tenDqUncertainty * scale, index });
    }
    if (a.beta === undefined || k === undefined) return;
    const hUnknown = shares.length === 1 ? shares : shares.filter((s) => jorgensenH(s.ligand) === undefined);
    if (hUnknown.length !== 1) return;
    const x = hUnknown[0]!;
    const rest = shares.filter((s) => s !== x).reduce((sum, s) => sum + s.positions * jorgensenH(s.ligand)!, 0);
    const scale = positions / (k * x.positions);
    add(h, x.ligand, { value: (1 - a.beta) * scale - rest / x.positions, sigma: a.betaUncertainty === undefined ? undefined : a.betaUncertainty * scale, index });
  });
  return { f, h, notes };
}
