import { combine, valuesOverlap, type FactorFit, type OverlapCriterion, type SeriesAnalysis } from '../series/index.js';

/**
 * A series at the level a chemist reads it: one row per ligand (per label,
 * "NH3" or "NH3×5 Cl" for a mixed complex) with how many analyses it has,
 * its mean 10Dq and β with their uncertainties, its place in the two series
 * of ligands, and the f and h fitted for it. Means follow src/series's
 * `combine`: weighted by 1/σ² when every analysis has σ > 0 (σ of the mean
 * 1/sqrt(Σ 1/σ²)), else the plain mean with the standard deviation of the
 * mean (for one analysis, its own σ or null). Energies in cm-1.
 */
export interface LigandSummary {
  ligand: string;
  /** Analyses of this ligand in the spectrochemical ranking. */
  count: number;
  tenDq: number;
  tenDqUncertainty: number | null;
  /** 1-based place among the ligands by mean 10Dq, weakest first. */
  spectrochemicalPosition: number;
  /** True when this ligand's mean 10Dq and the next one's are not resolved by the criterion. */
  spectrochemicalOverlapsNext: boolean;
  /** Analyses of this ligand with a β (0 < β ≤ 1.2). */
  betaCount: number;
  beta: number | null;
  betaUncertainty: number | null;
  /** 1-based place among the ligands with a β by mean 1 − β, least nephelauxetic first; null without β. */
  nephelauxeticPosition: number | null;
  nephelauxeticOverlapsNext: boolean | null;
  /** Jørgensen's f and h fitted for this ligand (a label of one ligand that the factor fit measured), else null. */
  f: number | null;
  fUncertainty: number | null;
  h: number | null;
  hUncertainty: number | null;
}

/** The two series of ligands in one line each: "Cl < F < H2O ~ ox < NH3" ("~" joins ligands whose means overlap). */
export interface LigandSeries {
  spectrochemical: string;
  nephelauxetic: string;
}

/** A ligand's means before ranking; `first` orders ties: the index of its newest analysis (smaller first). */
export interface LigandMeans {
  ligand: string;
  first: number;
  count: number;
  tenDq: { value: number; sigma: number | undefined };
  betaCount: number;
  beta: { value: number; sigma: number | undefined } | undefined;
}

/**
 * The slow, obvious path (and the one for a series held in memory): each
 * label's analyses collected in the order given, then `combine` over their
 * 10Dq and their β. `labels[i]` is analysis i's label.
 */
export function ligandMeansOfAnalyses(analyses: readonly SeriesAnalysis[], labels: readonly string[]): LigandMeans[] {
  const byLabel = new Map<string, { first: number; t: { value: number; sigma: number | undefined }[]; b: { value: number; sigma: number | undefined }[] }>();
  analyses.forEach((a, i) => {
    const label = labels[i] as string;
    let entry = byLabel.get(label);
    if (entry === undefined) {
      entry = { first: i, t: [], b: [] };
      byLabel.set(label, entry);
    }
    entry.t.push({ value: a.tenDq, sigma: a.tenDqUncertainty });
    if (a.beta !== undefined) entry.b.push({ value: a.beta, sigma: a.betaUncertainty });
  });
  return [...byLabel].map(([ligand, e]) => ({
    ligand, first: e.first, count: e.t.length, tenDq: combine(e.t), betaCount: e.b.length, beta: e.b.length > 0 ? combine(e.b) : undefined,
  }));
}

/**
 * The ligands ranked: by mean 10Dq and by 1 − mean β, smallest first, ties
 * in the order of their newest analysis; neighbours flagged by valuesOverlap
 * (a missing σ counts as 0). f and h from the factor fit where it measured
 * that ligand.
 */
export function ligandSummaries(means: readonly LigandMeans[], factors: FactorFit | null, criterion: OverlapCriterion): { ligands: LigandSummary[]; ligandSeries: LigandSeries } {
  const byFirst = [...means].sort((x, y) => x.first - y.first);
  const spectro = [...byFirst].sort((x, y) => x.tenDq.value - y.tenDq.value);
  const withBeta = byFirst.filter((m) => m.beta !== undefined);
  const neph = [...withBeta].sort((x, y) => (1 - x.beta!.value) - (1 - y.beta!.value));
  const overlapsNext = (list: readonly LigandMeans[], value: (m: LigandMeans) => { value: number; sigma: number | undefined }) =>
    list.map((m, i) => {
      const next = list[i + 1];
      if (next === undefined) return false;
      const a = value(m);
      const b = value(next);
      return valuesOverlap(a.value, a.sigma ?? 0, b.value, b.sigma ?? 0, criterion);
    });
  const spectroOverlaps = overlapsNext(spectro, (m) => m.tenDq);
  const nephOverlaps = overlapsNext(neph, (m) => ({ value: 1 - m.beta!.value, sigma: m.beta!.sigma }));
  const nephPlace = new Map(neph.map((m, i) => [m.ligand, i]));
  const factorOf = new Map((factors?.factors ?? []).map((f) => [f.ligand, f]));
  const ligands = spectro.map((m, i): LigandSummary => {
    const place = nephPlace.get(m.ligand);
    const factor = factorOf.get(m.ligand);
    return {
      ligand: m.ligand,
      count: m.count,
      tenDq: m.tenDq.value,
      tenDqUncertainty: m.tenDq.sigma ?? null,
      spectrochemicalPosition: i + 1,
      spectrochemicalOverlapsNext: spectroOverlaps[i] as boolean,
      betaCount: m.betaCount,
      beta: m.beta?.value ?? null,
      betaUncertainty: m.beta?.sigma ?? null,
      nephelauxeticPosition: place === undefined ? null : place + 1,
      nephelauxeticOverlapsNext: place === undefined ? null : (nephOverlaps[place] as boolean),
      f: factor?.f ?? null,
      fUncertainty: factor?.fUncertainty ?? null,
      h: factor?.h ?? null,
      hUncertainty: factor?.hUncertainty ?? null,
    };
  });
  const line = (list: readonly LigandMeans[], overlaps: readonly boolean[]) =>
    list.map((m, i) => (i === 0 ? m.ligand : `${overlaps[i - 1] ? ' ~ ' : ' < '}${m.ligand}`)).join('');
  return { ligands, ligandSeries: { spectrochemical: line(spectro, spectroOverlaps), nephelauxetic: line(neph, nephOverlaps) } };
}
