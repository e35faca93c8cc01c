import { FieldgapError } from '../errors.js';
import { freeIonRacah } from '../chemistry/free-ion.js';
import { parseFormula, type LigandCount } from '../chemistry/formula.js';
import { JORGENSEN_F, JORGENSEN_G, JORGENSEN_SOURCE, jorgensenF, jorgensenG, jorgensenH, jorgensenK } from '../chemistry/jorgensen.js';
import { computeLevels, spinStateChoice, type Geometry, type SpinState } from '../ligand-field/index.js';
import { averageEnvironmentFactor } from './average-environment.js';

/** A predicted number or word, always marked as an estimate with how it was made. */
export interface Estimate<T> {
  value: T;
  unit?: string;
  estimate: true;
  method: string;
}

export interface PredictOptions {
  /** Overrides the geometry guessed from the coordination number. Default: the guess. */
  geometry?: Geometry;
  /** The user's own ligand factors (e.g. from fitLigandFactors), by ligand key; they win over the table. Default: none. */
  factors?: Record<string, { f?: number; h?: number }>;
  /** g(metal) in cm-1, overriding Jørgensen's table. Default: the table. */
  g?: number;
  /** k(metal), overriding Jørgensen's table. Default: the table. */
  k?: number;
}

export interface PredictedLigand extends LigandCount {
  /** Jørgensen f used for it. */
  f: number;
  /** Jørgensen h used for it, when known. */
  h: number | undefined;
}

export interface Prediction {
  formula: string;
  complexIon: string;
  /** "Co3+". */
  ion: string;
  d: number;
  oxidationState: number;
  ligands: PredictedLigand[];
  coordinationNumber: number;
  geometry: Estimate<Geometry>;
  /** cm-1. */
  tenDq: Estimate<number>;
  /** β = B/B0; null when h, k or B0 is not tabulated. */
  beta: Estimate<number> | null;
  /** Racah B, cm-1; null when it cannot be estimated. */
  b: Estimate<number> | null;
  /** Racah C, cm-1; null when it cannot be estimated. */
  c: Estimate<number> | null;
  spinState: Estimate<SpinState>;
  unpairedElectrons: Estimate<number>;
  groundTerm: Estimate<string>;
  /** √(n(n+2)) in Bohr magnetons. */
  spinOnlyMoment: Estimate<number>;
  estimate: true;
  method: string;
  sources: string[];
  warnings: string[];
}

const TETRAHEDRAL_RATIO = 4 / 9;

/**
 * Predicts a complex's ligand-field parameters and spin state from its
 * formula alone, by Jørgensen's factorisations:
 *   10Dq = f·g (rule of average environment, g·Σ n_i f_i / N, when mixed;
 *   Δt ≈ 4/9 of the octahedral value for a tetrahedron),
 *   β = 1 − h·k,  B = β·B0,  C = B·C0/B0 (free-ion table),
 * then runs the ligand-field engine at those values for the spin state,
 * unpaired electrons and ground term. Every output is an estimate.
 * When B cannot be estimated (no h, k or B0), the spin state still follows
 * for configurations with no spin choice, and for 4d/5d ions from the
 * strong-field limit (second- and third-row complexes are low-spin: common
 * practice); otherwise a FieldgapError says what is missing.
 */
export function predictComplex(formula: string, options: PredictOptions = {}): Prediction {
  const parsed = parseFormula(formula);
  const { metal } = parsed;
  const warnings = [...parsed.warnings];
  const geometry = options.geometry ?? parsed.geometry;
  if (!geometry) {
    throw new FieldgapError('invalid-argument', `coordination number ${parsed.coordinationNumber} of ${parsed.complexIon}: give the geometry (octahedral or tetrahedral)`, 'geometry');
  }
  const own = options.factors ?? {};
  const g = options.g ?? jorgensenG(metal);
  if (g === undefined) {
    throw new FieldgapError('invalid-argument', `no Jørgensen g for ${metal.label} in fieldgap's table (it has ${tabulatedMetals()}): cannot estimate 10Dq (give g yourself: option g, --g on the command line)`, 'formula');
  }
  const ligands: PredictedLigand[] = parsed.ligands.map((l) => {
    const f = own[l.key]?.f ?? jorgensenF(l.key);
    if (f === undefined) {
      throw new FieldgapError('invalid-argument', `no Jørgensen f for the ligand ${l.key} (${l.name}) in fieldgap's table (it has ${[...JORGENSEN_F.keys()].join(', ')}): cannot estimate 10Dq (give f yourself: option factors, --f LIGAND=VALUE on the command line)`, 'formula');
    }
    return { ...l, f, h: own[l.key]?.h ?? jorgensenH(l.key) };
  });
  const shares = (key: 'f' | 'h') => ligands.map((l) => ({ factor: l[key] as number, positions: l.count * l.denticity }));
  const mixed = ligands.length > 1;
  const octahedralTenDq = g * averageEnvironmentFactor(shares('f'));
  const tenDqValue = geometry === 'tetrahedral' ? TETRAHEDRAL_RATIO * octahedralTenDq : octahedralTenDq;
  let tenDqMethod = mixed ? "rule of average environment: 10Dq = g·Σ n_i f_i / N (Jørgensen's factors)" : "Jørgensen: 10Dq = f·g";
  if (geometry === 'tetrahedral') {
    tenDqMethod += '; tetrahedral: Δt ≈ 4/9 of the octahedral value with the same ligands';
    warnings.push('tetrahedral 10Dq taken as 4/9 of the octahedral f·g: a point-charge ratio, an estimate');
  }
  if (options.g !== undefined) tenDqMethod += ' (g given by the user)';

  const missing: string[] = [];
  const racah = estimateRacah(metal, ligands, options.k, shares, warnings, missing);
  const { dq, b, c, spinMethod } = engineInputs(metal, geometry, tenDqValue, racah, missing);
  const levels = computeLevels(metal.d, geometry, { dq, b, c });
  warnings.push(...levels.notes);
  const n = levels.unpairedElectrons;
  const est = <T>(value: T, method: string, unit?: string): Estimate<T> => (unit === undefined ? { value, estimate: true, method } : { value, unit, estimate: true, method });
  return {
    formula: parsed.formula,
    complexIon: parsed.complexIon,
    ion: metal.label,
    d: metal.d,
    oxidationState: parsed.oxidationState,
    ligands,
    coordinationNumber: parsed.coordinationNumber,
    geometry: est(geometry, options.geometry ? 'given by the user' : `guessed from the coordination number ${parsed.coordinationNumber}`),
    tenDq: est(tenDqValue, tenDqMethod, 'cm-1'),
    beta: racah ? est(racah.beta, racah.betaMethod) : null,
    b: racah ? est(racah.b, racah.bMethod, 'cm-1') : null,
    c: racah ? est(racah.c, racah.cMethod, 'cm-1') : null,
    spinState: est(levels.spinState, spinMethod),
    unpairedElectrons: est(n, spinMethod),
    groundTerm: est(levels.groundTerm, spinMethod),
    spinOnlyMoment: est(Math.sqrt(n * (n + 2)), 'spin only: μ = √(n(n+2)) μB', 'μB'),
    estimate: true,
    method: "Jørgensen's factorisations of 10Dq and β, then the ligand-field engine at the estimated Dq, B and C",
    sources: [JORGENSEN_SOURCE, ...(racah ? [racah.source] : [])],
    warnings,
  };
}

interface RacahEstimate {
  beta: number;
  b: number;
  c: number;
  betaMethod: string;
  bMethod: string;
  cMethod: string;
  source: string;
}

/** β, B and C from h·k and the free-ion table; undefined (with a warning) when a factor is missing. */
function estimateRacah(
  metal: ReturnType<typeof parseFormula>['metal'],
  ligands: PredictedLigand[],
  kOption: number | undefined,
  shares: (key: 'f' | 'h') => { factor: number; positions: number }[],
  warnings: string[],
  missing: string[],
): RacahEstimate | undefined {
  if (metal.d === 0 || metal.d === 10) return undefined;
  const free = freeIonRacah(metal);
  const k = kOption ?? jorgensenK(metal);
  const noH = ligands.filter((l) => l.h === undefined).map((l) => l.key);
  if (noH.length) missing.push(`Jørgensen h for ${noH.join(', ')}`);
  if (k === undefined) missing.push(`Jørgensen k for ${metal.label}`);
  if (free === undefined) missing.push(`free-ion B0 for ${metal.label}`);
  if (missing.length > 0) {
    warnings.push(`B and C not estimated: no ${missing.join(', no ')} in fieldgap's tables`);
    return undefined;
  }
  const h = averageEnvironmentFactor(shares('h'));
  const beta = 1 - h * (k as number);
  if (!(beta > 0)) {
    warnings.push(`h·k = ${(h * (k as number)).toFixed(2)} leaves no positive β: B and C not estimated`);
    missing.push('a positive β');
    return undefined;
  }
  const b0 = (free as NonNullable<typeof free>).b;
  const c0 = (free as NonNullable<typeof free>).c;
  return {
    beta,
    b: beta * b0,
    c: beta * c0,
    betaMethod: `Jørgensen: 1 − β = h·k${ligands.length > 1 ? ' with h averaged over the coordination positions' : ''}${kOption === undefined ? '' : ' (k given by the user)'}`,
    bMethod: `B = β·B0 with B0 = ${b0} cm-1 (free ion)`,
    cMethod: `C = B·C0/B0 with C0 = ${c0} cm-1 (free ion): C/B kept at the free-ion ratio`,
    source: `free-ion B0, C0 of ${metal.label}: ${(free as NonNullable<typeof free>).source}`,
  };
}

/** Dq, B, C for the engine, and how the spin state follows from them. */
function engineInputs(
  metal: ReturnType<typeof parseFormula>['metal'],
  geometry: Geometry,
  tenDq: number,
  racah: RacahEstimate | undefined,
  missing: readonly string[],
): { dq: number; b: number; c: number; spinMethod: string } {
  const dq = tenDq / 10;
  if (racah) return { dq, b: racah.b, c: racah.c, spinMethod: 'ligand-field engine at the estimated Dq, B and C' };
  // Without B the ground state is still fixed where there is no spin choice (any B gives it),
  // and in the strong-field limit (B ≪ Dq) for 4d and 5d ions.
  if (!spinStateChoice(metal.d, geometry)) {
    return { dq, b: 1000, c: 4000, spinMethod: `d${metal.d} ${geometry} has no spin choice: ground state from the ligand-field engine (independent of B)` };
  }
  if (metal.row > 1) {
    return { dq, b: tenDq / 1000, c: tenDq / 250, spinMethod: `B unknown: strong-field limit, as ${metal.row === 2 ? '4d' : '5d'} complexes are low-spin (common practice)` };
  }
  throw new FieldgapError(
    'invalid-argument',
    `${metal.label} (d${metal.d}, ${geometry}) can be high- or low-spin, and the spin state needs Racah B, which cannot be estimated: fieldgap's tables have no ${missing.join(', no ')} (give them yourself: options k and factors; on the command line --k and --h LIGAND=VALUE)`,
    'formula',
  );
}

function tabulatedMetals(): string {
  return [...JORGENSEN_G.keys()].join(', ');
}
