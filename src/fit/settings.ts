/**
 * The checked settings of a fit: d-count and ion, geometry, free-ion B0/C0,
 * and how C is treated.
 *
 * C: a fixed ratio C/B (`cOverB`; default the free ion's C0/B0 where the
 * table has it, else 4.5, a typical value for first-row ions), a fixed C
 * (`c`), or a free third parameter (`freeC`). At most one may be given.
 */
import { freeIonRacah } from '../chemistry/free-ion-racah.js';
import { parseIon, type Ion } from '../chemistry/ions.js';
import { findLigand } from '../chemistry/ligands.js';
import { parseFormula, type ParsedComplex } from '../chemistry/formula.js';
import { jorgensenF, jorgensenG, jorgensenH, jorgensenK, JORGENSEN_SOURCE } from '../chemistry/jorgensen.js';
import { metalG, type FactorValue } from '../predict/factor-table.js';
import { FieldgapError, invalidArgument, isFieldgapError } from '../errors.js';
import { GEOMETRIES, type Geometry } from '../ligand-field/types.js';
import { LIKELIHOOD } from './likelihood.js';
import type { PriorSettings, Window } from './penalties.js';
import type { CMode, FitInput } from './types.js';

/** C/B used when neither the input nor the free-ion table gives one. */
export const DEFAULT_C_OVER_B = 4.5;

export interface FitSettings {
  d: number;
  ion: Ion | null;
  geometry: Geometry;
  b0: number | null;
  c0: number | null;
  freeIonSource: string | null;
  mode: CMode;
  /** The fixed ratio (ratio mode), or the starting ratio (fixed and free modes). */
  cOverB: number;
  /** Where cOverB comes from, for the notes. */
  cOverBSource: string;
  /** Fixed C in cm-1 (fixed mode), else NaN. */
  cFixed: number;
  /** The ratio was given by the user (cOverB): it is never estimated from the bands. */
  cOverBGiven: boolean;
  /** The measured range, or undefined. */
  window: Window | undefined;
  /** Ligand keys given (by formula or list), with their counts. */
  ligands: Array<{ key: string; count: number }>;
  priors: PriorSettings;
  /** What the formula and ligands changed, for the notes. */
  notes: string[];
  /** The Trees α, cm-1 (fixed, or the start when alphaFree); 0 without the correction. */
  alpha: number;
  /** α is fitted. */
  alphaFree: boolean;
  /** The user asked for the Trees correction (fixed or free). */
  treesUsed: boolean;
}

function readFormula(value: unknown): ParsedComplex | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw invalidArgument('formula', `formula must be text such as "[Co(H2O)6]2+", got ${JSON.stringify(value)}`);
  try {
    return parseFormula(value);
  } catch (error) {
    if (isFieldgapError(error)) throw new FieldgapError(error.code, error.message, 'formula');
    throw error;
  }
}

function readLigands(value: unknown): Array<{ key: string; count: number }> {
  if (value === undefined) return [];
  const list = typeof value === 'string' ? value.split(/[,;]/) : Array.isArray(value) ? value : undefined;
  if (!list || list.some((v) => typeof v !== 'string')) {
    throw invalidArgument('ligands', `ligands must be text such as "H2O" or "NH3,Cl", or a list of such, got ${JSON.stringify(value)}`);
  }
  const out: Array<{ key: string; count: number }> = [];
  (list as string[]).forEach((text, i) => {
    const trimmed = text.trim();
    if (trimmed === '') return;
    const ligand = findLigand(trimmed);
    if (!ligand) throw invalidArgument(`ligands[${i}]`, `ligand ${i + 1} ("${trimmed}") is not one fieldgap knows (e.g. H2O, NH3, Cl, en, CN)`);
    out.push({ key: ligand.key, count: 1 });
  });
  return out;
}

function readWindow(value: unknown): Window | undefined {
  if (value === undefined) return undefined;
  const w = value as Partial<Window> | null;
  const ok = typeof w === 'object' && w !== null && typeof w.min === 'number' && typeof w.max === 'number'
    && Number.isFinite(w.min) && Number.isFinite(w.max) && w.min > 0 && w.max > w.min;
  if (!ok) throw invalidArgument('window', `window must be { min, max } in cm-1 with 0 < min < max, got ${JSON.stringify(value)}`);
  return { min: w.min!, max: w.max! };
}

/**
 * The priors of likelihood.ts for this ion, geometry and ligands: 10Dq from
 * Jørgensen's f·g when every ligand has f (count-weighted mean f, the rule of
 * average environment), else the range 0.7·g … 1.75·g; β from 1 − h·k when
 * every ligand has h and the ion has k.
 */
function priorSettings(ion: Ion | null, geometry: Geometry, b0: number | null, cOverB: number, ligands: Array<{ key: string; count: number }>): PriorSettings {
  const g = ion ? jorgensenG(ion) : undefined;
  const gEstimate = ion && g === undefined ? aquaIonGEstimate(ion) : undefined;
  const k = ion ? jorgensenK(ion) : undefined;
  const t = geometry === 'tetrahedral' ? LIKELIHOOD.tetrahedralFactor : 1;
  const total = ligands.reduce((s, l) => s + l.count, 0);
  const mean = (of: (key: string) => number | undefined) => {
    if (total === 0) return undefined;
    let sum = 0;
    for (const l of ligands) {
      const v = of(l.key);
      if (v === undefined) return undefined;
      sum += v * l.count;
    }
    return sum / total;
  };
  const f = mean(jorgensenF);
  const h = mean(jorgensenH);
  const names = [...new Set(ligands.map((l) => l.key))].join(', ');
  const gUsed = g ?? gEstimate?.value;
  const tenDqExpected = f !== undefined && gUsed !== undefined ? f * gUsed * t : null;
  const betaExpected = h !== undefined && k !== undefined ? Math.max(0.2, 1 - h * k) : null;
  const estimated = tenDqExpected !== null && g === undefined && gEstimate !== undefined;
  const priors: PriorSettings = {
    b0, cOverB,
    tenDqExpected,
    tenDqRange: g !== undefined ? [LIKELIHOOD.fLow * g * t, LIKELIHOOD.fHigh * g * t] : null,
    betaExpected,
    ligandNote: tenDqExpected !== null || betaExpected !== null
      ? `${names}; ${JORGENSEN_SOURCE}${estimated ? `; g(${ion!.label}) = ${gEstimate.value} ± ${gEstimate.sigma} cm-1 is an estimate (${gEstimate.source}), not in the table` : ''}`
      : null,
  };
  if (estimated) priors.tenDqSigma = Math.hypot(LIKELIHOOD.tenDqSigma, gEstimate.sigma / gEstimate.value);
  return priors;
}

/**
 * g of an ion Jørgensen's table lacks, when src/predict/factor-table.ts has
 * one from a measured hexaaqua ion (`aquaIon` set in src/predict/factor-table.ts,
 * marked as an estimate with its σ): the fit's ligand prior may then use it,
 * with that σ added to its own (AUDIT3 finding 1: V3+). The rough estimates
 * from the oxidation state and row, or from a neighbour ion, are not used:
 * a prior that wide would only look like knowledge.
 */
function aquaIonGEstimate(ion: Ion): FactorValue | undefined {
  const estimate = metalG(ion);
  return estimate.aquaIon === true ? estimate : undefined;
}

function resolveIon(value: unknown): Ion {
  if (typeof value === 'string') return parseIon(value, { path: 'ion' });
  if (typeof value === 'object' && value !== null) {
    const ion = value as Partial<Ion>;
    if (typeof ion.label === 'string' && typeof ion.d === 'number') return value as Ion;
  }
  throw invalidArgument('ion', `ion must be text such as "Cr3+" or "Co(II)", got ${JSON.stringify(value)}`);
}

function positiveField(value: unknown, path: string, what: string, max: number): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value > max) {
    throw invalidArgument(path, `${path}: ${what} must be a number above 0 and at most ${max}, got ${JSON.stringify(value)}`);
  }
  return value;
}

export function resolveFitSettings(input: FitInput): FitSettings {
  if (typeof input !== 'object' || input === null) throw invalidArgument('', 'the fit input must be an object with bands and an ion or d');
  const formula = readFormula(input.formula);
  const notes: string[] = [];
  let ion = input.ion === undefined ? null : resolveIon(input.ion);
  if (formula) {
    if (ion && ion.label !== formula.metal.label) {
      throw invalidArgument('formula', `the formula ${formula.complexIon} has ${formula.metal.label}, but the ion given is ${ion.label}`);
    }
    ion ??= formula.metal;
  }
  let d: number;
  if (input.d !== undefined) {
    if (typeof input.d !== 'number' || !Number.isInteger(input.d) || input.d < 0 || input.d > 10) {
      throw invalidArgument('d', `d must be a whole number of d electrons from 1 to 9, got ${JSON.stringify(input.d)}`);
    }
    if (ion && ion.d !== input.d) throw invalidArgument('d', `d = ${input.d} disagrees with ${ion.label}, which is d${ion.d}`);
    d = input.d;
  } else if (ion) {
    d = ion.d;
  } else {
    throw invalidArgument('ion', 'give the metal as an ion (e.g. "Cr3+") or as a d-electron count');
  }
  if (d === 0 || d === 10) {
    throw invalidArgument(ion ? 'ion' : 'd', ion?.note ?? `d${d} has no d–d transitions, so there is nothing to fit`);
  }
  let geometry = input.geometry ?? 'octahedral';
  if (input.geometry === undefined && formula?.geometry) {
    geometry = formula.geometry;
    notes.push(`geometry ${geometry} guessed from the coordination number ${formula.coordinationNumber} of ${formula.complexIon}`);
  }
  if (!GEOMETRIES.includes(geometry)) {
    throw invalidArgument('geometry', `geometry must be one of ${GEOMETRIES.join(', ')}, got ${JSON.stringify(geometry)}`);
  }
  const cOverB = positiveField(input.cOverB, 'cOverB', 'C/B', 20);
  const c = positiveField(input.c, 'c', 'C (cm-1)', 200_000);
  if (input.freeC !== undefined && typeof input.freeC !== 'boolean') {
    throw invalidArgument('freeC', `freeC must be true or false, got ${JSON.stringify(input.freeC)}`);
  }
  const freeC = input.freeC === true;
  if (cOverB !== undefined && c !== undefined) throw invalidArgument('c', 'give either a fixed C/B ratio or a fixed C, not both');
  if (freeC && (cOverB !== undefined || c !== undefined)) {
    throw invalidArgument('freeC', `a free C cannot be combined with a fixed ${c !== undefined ? 'C' : 'C/B'}`);
  }
  const free = ion ? freeIonRacah(ion) : undefined;
  const b0 = free?.b ?? null;
  const c0 = free?.c ?? null;
  let ratio = DEFAULT_C_OVER_B;
  let cOverBSource = `default C/B = ${DEFAULT_C_OVER_B} (no free-ion C0/B0 known)`;
  if (cOverB !== undefined) {
    ratio = cOverB;
    cOverBSource = `C/B = ${cOverB} as given`;
  } else if (free) {
    ratio = free.c / free.b;
    cOverBSource = `C/B = C0/B0 = ${ratio.toFixed(2)} of the free ${ion!.label} ion`;
  }
  const mode: CMode = freeC ? 'free' : c !== undefined ? 'fixed' : 'ratio';
  const ligands = [...(formula?.ligands.map((l) => ({ key: l.key, count: l.count })) ?? []), ...readLigands(input.ligands)];
  const window = readWindow(input.window);
  const priorCentre = free ? free.c / free.b : LIKELIHOOD.defaultCOverB;
  const trees = readTrees(input.trees);
  const priors = priorSettings(ion, geometry, b0, priorCentre, ligands);
  if (priors.tenDqSigma !== undefined && priors.tenDqExpected !== null) {
    notes.push(`10Dq prior from the ligands ${Math.round(priors.tenDqExpected)} cm-1 (±${Math.round(100 * priors.tenDqSigma)}%, wider than the usual 15%): ${priors.ligandNote}`);
  }
  return {
    ...trees,
    d, ion, geometry, b0, c0, freeIonSource: free?.source ?? null, mode, cOverB: ratio, cOverBSource,
    cFixed: c ?? Number.NaN, cOverBGiven: cOverB !== undefined, window, ligands,
    priors, notes,
  };
}

/** The largest |α| accepted, cm-1: far beyond any reported value (60–80 cm-1 for first-row ions). */
const MAX_TREES_ALPHA = 500;

/** `trees`: a fixed α (cm-1) or "free"; absent: no correction. */
function readTrees(value: unknown): { alpha: number; alphaFree: boolean; treesUsed: boolean } {
  if (value === undefined) return { alpha: 0, alphaFree: false, treesUsed: false };
  if (value === 'free') return { alpha: 0, alphaFree: true, treesUsed: true };
  if (typeof value !== 'number' || !Number.isFinite(value) || Math.abs(value) > MAX_TREES_ALPHA) {
    throw invalidArgument('trees', `trees must be the Trees α in cm-1 (at most ${MAX_TREES_ALPHA} in size) or "free", got ${JSON.stringify(value)}`);
  }
  return { alpha: value, alphaFree: false, treesUsed: true };
}

/** d5 bands at least this many estimate C/B unasked: 4T1g(G), 4T2g(G) and 4A1g/4Eg(G) fix 10Dq, B and C. */
export const D5_FREE_C_MIN_BANDS = 3;

/**
 * d5 band lists of at least D5_FREE_C_MIN_BANDS bands estimate C/B unasked (returns the
 * note saying so; undefined otherwise): every quartet of high-spin d5 depends
 * on C, and the field-independent 4A1g, 4Eg(G) (10B + 5C) and 4Eg(D)
 * (17B + 5C) fix B and C by themselves, the usual analysis of Mn(II) and
 * Fe(III) spectra (common practice). The free ion's ratio is a poor
 * assumption there: hexaaqua Mn(II) has C/B ≈ 5.5 against 3.46 for the free
 * ion (Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), from
 * memory). The C/B prior still applies; a C the bands do not fix falls back
 * to the ratio with a warning (fit-bands.ts).
 */
export function estimatesCByDefault(settings: FitSettings, bandCount: number): string | undefined {
  if (settings.d !== 5 || settings.mode !== 'ratio' || settings.cOverBGiven || bandCount < D5_FREE_C_MIN_BANDS) return undefined;
  return `C/B estimated from the ${bandCount} bands (d5: every quartet depends on C; prior around ${settings.priors.cOverB.toFixed(2)}), not assumed at ${settings.cOverBSource}`;
}
