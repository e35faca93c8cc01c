import { invalidArgument } from '../errors.js';
import { jorgensenF, jorgensenG, jorgensenH, jorgensenK, JORGENSEN_SOURCE } from '../chemistry/jorgensen.js';
import { ligandByKey } from '../chemistry/ligands.js';
import { parseIon, type Ion } from '../chemistry/ions.js';
import type { LigandShare, SeriesAnalysis } from './types.js';
import { ligandShares, validateSeriesAnalyses } from './validate.js';

export interface FitFactorsOptions {
  /** The metal ion, when the analyses do not name it. */
  ion?: string;
  /** g(metal) in cm-1; default: Jørgensen's table. */
  g?: number;
  /** k(metal); default: Jørgensen's table (h is then not fitted when it has none). */
  k?: number;
  /**
   * Known f and h of ligands in mixed complexes, beyond Jørgensen's table
   * (keys as in ligands.ts or the user's own names). Default: none.
   */
  known?: Record<string, { f?: number; h?: number }>;
}

/** One ligand's fitted factors. Uncertainties are one standard deviation. */
export interface LigandFactor {
  ligand: string;
  f: number;
  fUncertainty: number | undefined;
  /** Indices of the analyses that gave f. */
  fFrom: number[];
  h?: number;
  hUncertainty?: number | undefined;
  hFrom?: number[];
  /** Jørgensen's values for comparison, when tabulated. */
  tabulatedF?: number;
  tabulatedH?: number;
}

export interface FactorFit {
  ion: string;
  g: number;
  k: number | undefined;
  /** Where g and k come from. */
  source: string;
  factors: LigandFactor[];
  /** Analyses that gave nothing, and why. */
  notes: string[];
}

/**
 * Fits Jørgensen's ligand factors from the user's own analyses of one metal
 * ion: f = 10Dq / g(metal), h = (1 − β) / k(metal). A mixed complex gives the
 * factor of its one unknown ligand through the rule of average environment,
 * f_x = (N·10Dq/g − Σ n_j f_j) / n_x (n = coordination positions). Several
 * analyses of one ligand are averaged: weighted by 1/σ² when every one has an
 * uncertainty (σ of the mean = 1/sqrt(Σ 1/σ²)), else a plain mean whose σ is
 * the standard deviation of the mean (undefined for one analysis without σ).
 * The uncertainty of g and k themselves is not known and not included.
 */
export function fitLigandFactors(analyses: readonly SeriesAnalysis[], options: FitFactorsOptions = {}): FactorFit {
  return fitCheckedLigandFactors(analyses, validateSeriesAnalyses(analyses), options);
}

/** fitLigandFactors of analyses that validateSeriesAnalyses has passed, `shared` being the ion it returned. */
export function fitCheckedLigandFactors(analyses: readonly SeriesAnalysis[], shared: Ion | undefined, options: FitFactorsOptions = {}): FactorFit {
  const { ion, g, k, knownF, knownH } = factorConstants(shared, options);
  const fSamples = new Map<string, Sample[]>();
  const hSamples = new Map<string, Sample[]>();
  const notes: string[] = [];
  // What a complex's ligands give (the unknown ligand, its scale and the known rest) depends on its
  // ligands alone: worked out once per distinct set, then applied to each analysis's numbers.
  const plans = new Map<string, CompositionPlan>();
  const planOf = (a: SeriesAnalysis, at: string): CompositionPlan => {
    const key = a.ligand !== undefined ? `1${a.ligand}` : `*${(a.ligands ?? []).map((l) => `${l.ligand}\u0000${l.count}`).join('\u0001')}`;
    let plan = plans.get(key);
    if (plan === undefined) {
      plan = compositionPlan(ligandShares(a, at), g, k, knownF, knownH);
      plans.set(key, plan);
    }
    return plan;
  };
  analyses.forEach((a, index) => {
    const { f, h } = planOf(a, `analyses[${index}]`);
    if (typeof f === 'string') {
      notes.push(`analyses[${index}] (${a.sample}): ${f}: gives no f`);
    } else {
      push(fSamples, f.ligand, { value: a.tenDq * f.scale - f.restPerPosition, sigma: a.tenDqUncertainty === undefined ? undefined : a.tenDqUncertainty * f.scale, index });
    }
    if (a.beta === undefined || h === undefined) return;
    push(hSamples, h.ligand, { value: (1 - a.beta) * h.scale - h.restPerPosition, sigma: a.betaUncertainty === undefined ? undefined : a.betaUncertainty * h.scale, index });
  });
  if (k === undefined) notes.push(noTabulatedKNote(ion));
  const factors: LigandFactor[] = [...fSamples].map(([ligand, samples]) => {
    const mean = combine(samples);
    const factor: LigandFactor = { ligand, f: mean.value, fUncertainty: mean.sigma, fFrom: samples.map((s) => s.index) };
    const hs = hSamples.get(ligand);
    if (hs) {
      const h = combine(hs);
      factor.h = h.value;
      factor.hUncertainty = h.sigma;
      factor.hFrom = hs.map((s) => s.index);
    }
    const tf = jorgensenF(ligand);
    const th = jorgensenH(ligand);
    if (tf !== undefined) factor.tabulatedF = tf;
    if (th !== undefined) factor.tabulatedH = th;
    return factor;
  });
  const source = options.g === undefined ? JORGENSEN_SOURCE : 'g (and k) given by the user';
  return { ion: ion.label, g, k, source, factors, notes };
}

/** The note of a fit without k. */
export function noTabulatedKNote(ion: Ion): string {
  return `no tabulated k for ${ion.label}: h is not fitted (give k yourself)`;
}

/** The metal's g and k and the factors taken as known, for a fit of `shared` (the analyses' ion) with these options; throws when g is not known. */
export function factorConstants(shared: Ion | undefined, options: FitFactorsOptions = {}): {
  ion: Ion; g: number; k: number | undefined; knownF: (key: string) => number | undefined; knownH: (key: string) => number | undefined;
} {
  const ion = metalIon(shared, options.ion);
  const g = options.g ?? jorgensenG(ion);
  if (g === undefined || !(g > 0)) throw invalidArgument('g', `no tabulated g for ${ion.label} in Jørgensen's table: give g (cm-1) yourself`);
  const k = options.k ?? jorgensenK(ion);
  const known = options.known ?? {};
  return { ion, g, k, knownF: (key) => known[key]?.f ?? jorgensenF(key), knownH: (key) => known[key]?.h ?? jorgensenH(key) };
}

/**
 * What a complex of these ligands (canonical keys, as ligandShares gives
 * them) contributes to the factor fit: the one ligand whose f (and h) it
 * measures, with scale = N / (g·n_x) and Σ n_j f_j / n_x of the others, so
 * f_x = 10Dq·scale − restPerPosition; or why it gives none. `knownF`/`knownH`
 * give the factors taken as known (the user's, else Jørgensen's table).
 */
export function compositionPlan(
  ligandShareList: readonly LigandShare[], g: number, k: number | undefined,
  knownF: (key: string) => number | undefined, knownH: (key: string) => number | undefined,
): CompositionPlan {
  const shares = ligandShareList.map((s) => ({ ...s, positions: s.count * (ligandByKey(s.ligand)?.denticity ?? 1) }));
  const positions = shares.reduce((n, s) => n + s.positions, 0);
  const fUnknown = shares.length === 1 ? shares : shares.filter((s) => knownF(s.ligand) === undefined);
  let f: CompositionPlan['f'];
  if (fUnknown.length !== 1) {
    f = fUnknown.length === 0 ? 'every ligand already has an f' : 'more than one ligand without an f';
  } else {
    const x = fUnknown[0] as (typeof shares)[number];
    const rest = shares.filter((s) => s !== x).reduce((sum, s) => sum + s.positions * (knownF(s.ligand) as number), 0);
    f = { ligand: x.ligand, scale: positions / (g * x.positions), restPerPosition: rest / x.positions };
  }
  let h: CompositionPlan['h'];
  const hUnknown = shares.length === 1 ? shares : shares.filter((s) => knownH(s.ligand) === undefined);
  if (k !== undefined && hUnknown.length === 1) {
    const x = hUnknown[0] as (typeof shares)[number];
    const rest = shares.filter((s) => s !== x).reduce((sum, s) => sum + s.positions * (knownH(s.ligand) as number), 0);
    h = { ligand: x.ligand, scale: positions / (k * x.positions), restPerPosition: rest / x.positions };
  }
  return { f, h };
}

/** What one set of ligands gives: the ligand whose factor it measures, scale = N / (g·n_x), and Σ n_j f_j / n_x of the others; or why it gives none. */
export interface CompositionPlan {
  f: { ligand: string; scale: number; restPerPosition: number } | string;
  /** Undefined when k is unknown or the set has no single ligand without an h. */
  h: { ligand: string; scale: number; restPerPosition: number } | undefined;
}

interface Sample {
  value: number;
  sigma: number | undefined;
  index: number;
}

function push(map: Map<string, Sample[]>, key: string, sample: Sample): void {
  const list = map.get(key);
  if (list) list.push(sample);
  else map.set(key, [sample]);
}

/** Inverse-variance weighted mean when every σ > 0, else plain mean with σ of the mean. */
export function combine(samples: readonly { value: number; sigma: number | undefined }[]): { value: number; sigma: number | undefined } {
  if (samples.every((s) => s.sigma !== undefined && s.sigma > 0)) {
    let sw = 0;
    let swx = 0;
    for (const s of samples) {
      const w = 1 / ((s.sigma as number) ** 2);
      sw += w;
      swx += w * s.value;
    }
    return { value: swx / sw, sigma: 1 / Math.sqrt(sw) };
  }
  const n = samples.length;
  const mean = samples.reduce((sum, s) => sum + s.value, 0) / n;
  if (n < 2) return { value: mean, sigma: samples[0]?.sigma };
  const variance = samples.reduce((sum, s) => sum + (s.value - mean) ** 2, 0) / (n - 1);
  return { value: mean, sigma: Math.sqrt(variance / n) };
}

function metalIon(shared: Ion | undefined, given: string | undefined): Ion {
  const fromOption = given === undefined ? undefined : parseIon(given, { path: 'ion' });
  if (shared && fromOption && shared.label !== fromOption.label) {
    throw invalidArgument('ion', `ion: ${fromOption.label} differs from the analyses' ${shared.label}`);
  }
  const ion = fromOption ?? shared;
  if (!ion) throw invalidArgument('ion', 'ion: name the metal ion (in the analyses or as an option)');
  return ion;
}
