import { oxidationStateWarning } from '../chemistry/oxidation-states.js';
import { FieldgapError } from '../errors.js';
import { freeIonRacah } from '../chemistry/free-ion-racah.js';
import { parseFormula, type LigandCount, type ParsedComplex } from '../chemistry/formula.js';
import type { Ion } from '../chemistry/ions.js';
import { computeLevels, type SpinState } from '../ligand-field/index.js';
import { ligandF, ligandH, ligandsWithF, metalG, metalK, type FactorKind, type FactorValue } from '../predict/factor-table.js';
import { orbitalOccupation, type Occupation } from '../predict/occupation.js';
import { decideSpin, orbitalContribution, type SpinDecision } from '../predict/decide-spin.js';
import { lowSpinAdjustment } from '../predict/low-spin-g.js';
import { fourCoordinateRule, type PredictGeometry, type Rule } from '../predict/rules.js';
import { averageEnvironmentFactor } from './average-environment.js';

export type { PredictGeometry, Rule } from '../predict/rules.js';
export type { SpinDecision } from '../predict/decide-spin.js';

/** A predicted number or word, always marked as an estimate with how it was made. */
export interface Estimate<T> {
  value: T;
  unit?: string;
  estimate: true;
  method: string;
  /** One standard deviation, same unit as value, where one can be given. */
  uncertainty?: number;
}

/** A ligand's own factors (from the user or the library); they win over the tables. */
export interface OwnFactor {
  f?: number;
  /** One standard deviation of f. */
  fUncertainty?: number;
  h?: number;
  hUncertainty?: number;
  /** Where they come from: "your library (3 analyses)". Default "given by the user". */
  source?: string;
}

export interface PredictOptions {
  /** Overrides the geometry from the coordination number and the rules. Default: those. */
  geometry?: PredictGeometry;
  /** The user's own ligand factors (e.g. from fitLigandFactors), by ligand key; they win over the table. Default: none. */
  factors?: Record<string, OwnFactor>;
  /** g(metal) in cm-1, overriding Jørgensen's table. Default: the table. */
  g?: number;
  /** k(metal), overriding Jørgensen's table. Default: the table. */
  k?: number;
}

/** A factor as used, with where it came from. */
export interface UsedFactor {
  value: number;
  uncertainty: number;
  kind: FactorKind;
  source: string;
}

export interface PredictedLigand extends LigandCount {
  /** Jørgensen f used for it. */
  f: number;
  /** Jørgensen h used for it: published or estimated, always set now; the type keeps undefined for existing readers. */
  h: number | undefined;
  /** f with its uncertainty and source. */
  fFactor: UsedFactor;
  /** h with its uncertainty and source. */
  hFactor: UsedFactor;
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
  geometry: Estimate<PredictGeometry>;
  /** The rule that fixed the geometry, when one did. */
  geometryRule: Rule | null;
  /** cm-1. For square planar: the octahedral f·g of the same ligands (the square-planar splitting is not modelled). */
  tenDq: Estimate<number>;
  /** β = B/B0; null when B0 is not tabulated (4d, 5d) or there is no B (d0, d1, d9, d10). */
  beta: Estimate<number> | null;
  /** Racah B, cm-1; null when it cannot be estimated. */
  b: Estimate<number> | null;
  /** Racah C, cm-1; null when it cannot be estimated. */
  c: Estimate<number> | null;
  spinState: Estimate<SpinState>;
  spinDecision: SpinDecision;
  unpairedElectrons: Estimate<number>;
  groundTerm: Estimate<string>;
  /** √(n(n+2)) in Bohr magnetons. */
  spinOnlyMoment: Estimate<number>;
  /** Where the moment departs from spin-only: expected for T ground terms. */
  orbitalContribution: { expected: boolean; why: string };
  /** The one-electron picture: orbital sets, arrows, configuration. */
  occupation: Occupation;
  /** Ligand-field stabilisation energy without pairing energy: negative is stabilising. */
  lfse: { dq: number; deltaUnits: number; value: number; unit: 'cm-1'; method: string; /** One standard deviation, cm-1, from that of 10Dq. */ uncertainty: number };
  /** g and k of the metal as used. */
  metalFactors: { g: UsedFactor; k: UsedFactor };
  estimate: true;
  method: string;
  sources: string[];
  warnings: string[];
}

const TETRAHEDRAL_RATIO = 4 / 9;
/** Relative scatter of Jørgensen's 10Dq = f·g about measured values (common practice: "about 10%"). */
const METHOD_SCATTER = 0.08;
/** Below this β the factorisation is outside where it was fitted. */
const MIN_BETA = 0.4;

const used = (v: FactorValue): UsedFactor => ({ value: v.value, uncertainty: v.sigma, kind: v.kind, source: v.source });

/**
 * Predicts a complex's ligand-field parameters, spin state and magnetism from
 * its formula alone:
 *   10Dq = g·Σ n_i f_i / N (Jørgensen; rule of average environment when mixed;
 *   Δt ≈ 4/9 of the octahedral value for a tetrahedron),
 *   β = 1 − h·k,  B = β·B0,  C = B·C0/B0 (free-ion table),
 * then the spin state: a named rule of the trade where one applies
 * (src/predict/rules.ts), else 10Dq against the engine's exact crossover with
 * a probability from the propagated uncertainties (src/predict/spin-decision.ts).
 * The ground term comes from the ligand-field engine on the decided side of
 * the crossover. Every output is an estimate and says how it was made.
 */
export function predictComplex(formula: string, options: PredictOptions = {}): Prediction {
  const parsed = parseFormula(formula);
  const { metal } = parsed;
  const oxidation = oxidationStateWarning(metal);
  const warnings: string[] = oxidation !== null ? [oxidation] : [];
  const { geometry, geometryRule, geometryMethod } = chooseGeometry(parsed, options.geometry, warnings);
  const own = options.factors ?? {};
  const gFactor = options.g === undefined ? used(metalG(metal)) : { value: options.g, uncertainty: 0.05 * options.g, kind: 'user' as const, source: 'g given by the user' };
  const kFactor = options.k === undefined ? used(metalK(metal)) : { value: options.k, uncertainty: 0.03, kind: 'user' as const, source: 'k given by the user' };
  const ligands = parsed.ligands.map((l) => predictedLigand(l, own[l.key]));
  const positions = ligands.map((l) => l.count * l.denticity);
  const total = positions.reduce((a, b) => a + b, 0);
  const fAverage = averageEnvironmentFactor(ligands.map((l, i) => ({ factor: l.f, positions: positions[i] as number })));
  const fSigma = Math.hypot(...ligands.map((l, i) => ((positions[i] as number) * l.fFactor.uncertainty) / total));
  const mixed = ligands.length > 1;
  const octahedralTenDq = gFactor.value * fAverage;
  let tenDqSigmaRel = Math.hypot(gFactor.uncertainty / gFactor.value, fSigma / fAverage, METHOD_SCATTER);
  let tenDqMethod = mixed ? "rule of average environment: 10Dq = g·Σ n_i f_i / N (Jørgensen's factors)" : 'Jørgensen: 10Dq = f·g';
  let tenDqValue = octahedralTenDq;
  if (geometry === 'tetrahedral') {
    tenDqValue = TETRAHEDRAL_RATIO * octahedralTenDq;
    tenDqMethod += '; tetrahedral: Δt ≈ 4/9 of the octahedral value with the same ligands';
    warnings.push('tetrahedral 10Dq taken as 4/9 of the octahedral f·g: a point-charge ratio, an estimate');
  } else if (geometry === 'square-planar') {
    tenDqMethod += '; square planar: the octahedral value of the same ligands, the square-planar splitting is not modelled';
  }
  if (options.g !== undefined) tenDqMethod += ' (g given by the user)';
  tenDqMethod += `; ±${Math.round(100 * tenDqSigmaRel)}% (factors' uncertainties and the method's ${Math.round(100 * METHOD_SCATTER)}% scatter)`;

  const racah = estimateRacah(metal, ligands, positions, kFactor, warnings);
  const spinWarnings: string[] = [];
  let decision = decideSpin(metal, geometry, tenDqValue, tenDqSigmaRel, racah, ligands.map((l) => l.key), spinWarnings);
  // A g measured on a high-spin aqua ion does not carry to the ion's low-spin complexes (src/predict/low-spin-g.ts).
  const lowSpin = lowSpinAdjustment(metal.label, geometry, decision.state, options.g !== undefined);
  if (lowSpin?.kind === 'low-spin-g') {
    tenDqValue = lowSpin.g.value * fAverage;
    tenDqSigmaRel = Math.hypot(lowSpin.g.sigma / lowSpin.g.value, fSigma / fAverage, METHOD_SCATTER);
    tenDqMethod += `; low-spin: g replaced by the ion's low-spin g ${lowSpin.g.value} cm-1 (${lowSpin.g.source}), ±${Math.round(100 * tenDqSigmaRel)}%`;
    warnings.push(lowSpin.warning);
  } else if (lowSpin?.kind === 'widened') {
    tenDqSigmaRel = Math.hypot(tenDqSigmaRel, lowSpin.scatter);
    tenDqMethod += `; low-spin with a high-spin g: ±${Math.round(100 * tenDqSigmaRel)}%, f·g likely too low`;
    warnings.push(lowSpin.warning);
  }
  if (lowSpin) {
    // The numbers' probability is shown beside the spin state: recomputed with the 10Dq actually reported.
    spinWarnings.length = 0;
    decision = decideSpin(metal, geometry, tenDqValue, tenDqSigmaRel, racah, ligands.map((l) => l.key), spinWarnings);
  }
  warnings.push(...spinWarnings);
  const ground = groundTermFor(metal, geometry, tenDqValue, racah, decision, warnings);
  const highSpinFill = decision.state !== 'low-spin';
  const occupation = orbitalOccupation(metal.d, geometry, highSpinFill);
  const n = occupation.unpairedElectrons;
  const dq = tenDqValue / 10;
  const est = <T>(value: T, method: string, unit?: string, uncertainty?: number): Estimate<T> => {
    const e: Estimate<T> = { value, estimate: true, method };
    if (unit !== undefined) e.unit = unit;
    if (uncertainty !== undefined) e.uncertainty = uncertainty;
    return e;
  };
  const sources = [...new Set([
    ...ligands.flatMap((l) => [l.fFactor.source, l.hFactor.source]),
    gFactor.source, kFactor.source, ...(lowSpin?.kind === 'low-spin-g' ? [lowSpin.g.source] : []),
    ...(racah ? [racah.source] : []),
    ...(decision.numbers?.pairingEnergy ? [decision.numbers.pairingEnergy.source] : []),
    ...(decision.rule ? [`${decision.rule.statement} (${decision.rule.source})`] : []),
    ...(geometryRule ? [`${geometryRule.statement} (${geometryRule.source})`] : []),
  ])];
  return {
    formula: parsed.formula,
    complexIon: parsed.complexIon,
    ion: metal.label,
    d: metal.d,
    oxidationState: parsed.oxidationState,
    ligands,
    coordinationNumber: parsed.coordinationNumber,
    geometry: est(geometry, geometryMethod),
    geometryRule,
    tenDq: est(tenDqValue, tenDqMethod, 'cm-1', tenDqSigmaRel * tenDqValue),
    beta: racah ? est(racah.beta, racah.betaMethod, undefined, racah.betaSigma) : null,
    b: racah ? est(racah.b, racah.bMethod, 'cm-1', racah.bSigmaRel * racah.b) : null,
    c: racah ? est(racah.c, racah.cMethod, 'cm-1', racah.bSigmaRel * racah.c) : null,
    spinState: est(decision.state, decision.summary),
    spinDecision: decision,
    unpairedElectrons: est(n, decision.summary),
    groundTerm: est(ground.term, ground.method),
    spinOnlyMoment: est(Math.sqrt(n * (n + 2)), 'spin only: μ = √(n(n+2)) μB', 'μB'),
    orbitalContribution: orbitalContribution(ground.term, geometry, metal.d),
    occupation,
    lfse: {
      dq: occupation.lfseDq,
      deltaUnits: occupation.lfseDq / 10,
      value: occupation.lfseDq * dq,
      uncertainty: Math.abs(occupation.lfseDq * dq) * tenDqSigmaRel,
      unit: 'cm-1',
      method: `Σ n·E over the occupied orbital sets, E in Dq (${geometry === 'square-planar' ? 'point-charge square-planar energies' : geometry === 'tetrahedral' ? 'e −6Dq, t2 +4Dq' : 't2g −4Dq, eg +6Dq'}); pairing energy not included`,
    },
    metalFactors: { g: gFactor, k: kFactor },
    estimate: true,
    method: "Jørgensen's factorisations of 10Dq and β; the spin state from the named rules of the trade or from 10Dq against the engine's crossover; the ground term from the ligand-field engine",
    sources,
    warnings: [...parsed.warnings.filter((w) => !/^geometry guessed|four-coordinate d8 complexes are/.test(w)), ...warnings],
  };
}

function predictedLigand(l: LigandCount, own: OwnFactor | undefined): PredictedLigand {
  const source = own?.source ?? 'given by the user';
  let fFactor: UsedFactor;
  if (own?.f !== undefined) fFactor = { value: own.f, uncertainty: own.fUncertainty ?? 0.05 * own.f, kind: 'user', source: `f(${l.key}) ${source}` };
  else {
    const table = ligandF(l.key);
    if (!table) {
      throw new FieldgapError('invalid-argument', `no f for the ligand ${l.key} (${l.name}) in fieldgap's tables (it has ${ligandsWithF().join(', ')}): cannot estimate 10Dq (give f yourself: option factors, --f LIGAND=VALUE on the command line)`, 'formula');
    }
    fFactor = used(table);
  }
  const hFactor = own?.h !== undefined ? { value: own.h, uncertainty: own.hUncertainty ?? 0.2, kind: 'user' as const, source: `h(${l.key}) ${source}` } : used(ligandH(l.key));
  return { ...l, f: fFactor.value, h: hFactor.value, fFactor, hFactor };
}

/** The geometry: the user's, else a rule for four-coordinate complexes, else the guess from the coordination number. */
function chooseGeometry(parsed: ParsedComplex, given: PredictGeometry | undefined, warnings: string[]): { geometry: PredictGeometry; geometryRule: Rule | null; geometryMethod: string } {
  if (given) return { geometry: given, geometryRule: null, geometryMethod: 'given by the user' };
  if (parsed.coordinationNumber === 4) {
    const ruled = fourCoordinateRule(parsed.metal, { keys: parsed.ligands.map((l) => l.key) });
    if (ruled) return { geometry: ruled.geometry, geometryRule: ruled.rule, geometryMethod: `rule: ${ruled.rule.statement} (${ruled.rule.source})` };
    if (parsed.metal.d === 8 || parsed.metal.d === 9) {
      warnings.push(`${parsed.metal.label} is d${parsed.metal.d}: four-coordinate d${parsed.metal.d} complexes are often square planar; tetrahedral assumed (override with --geometry square-planar)`);
    }
  }
  if (!parsed.geometry) {
    throw new FieldgapError('invalid-argument', `coordination number ${parsed.coordinationNumber} of ${parsed.complexIon}: give the geometry (octahedral, tetrahedral or square-planar)`, 'geometry');
  }
  return { geometry: parsed.geometry, geometryRule: null, geometryMethod: `guessed from the coordination number ${parsed.coordinationNumber}` };
}

interface RacahEstimate {
  beta: number;
  betaSigma: number;
  b: number;
  c: number;
  bSigmaRel: number;
  betaMethod: string;
  bMethod: string;
  cMethod: string;
  source: string;
}

/** β, B and C from h·k and the free-ion table; undefined for d0, d1, d9, d10 and for ions without free-ion B0 (4d, 5d). */
function estimateRacah(metal: Ion, ligands: readonly PredictedLigand[], positions: readonly number[], k: UsedFactor, warnings: string[]): RacahEstimate | undefined {
  if (metal.d <= 1 || metal.d >= 9) return undefined;
  const free = freeIonRacah(metal);
  if (!free) {
    warnings.push(`B and C not estimated: fieldgap has no free-ion B0 for ${metal.label}`);
    return undefined;
  }
  const total = positions.reduce((a, b) => a + b, 0);
  const h = averageEnvironmentFactor(ligands.map((l, i) => ({ factor: l.hFactor.value, positions: positions[i] as number })));
  const hSigma = Math.hypot(...ligands.map((l, i) => ((positions[i] as number) * l.hFactor.uncertainty) / total));
  let beta = 1 - h * k.value;
  let betaSigma = Math.hypot(k.value * hSigma, h * k.uncertainty);
  let betaMethod = `Jørgensen: 1 − β = h·k${ligands.length > 1 ? ' with h averaged over the coordination positions' : ''}${k.kind === 'user' ? ' (k given by the user)' : ''}`;
  if (beta < MIN_BETA) {
    warnings.push(`h·k = ${(h * k.value).toFixed(2)} would leave β = ${beta.toFixed(2)}, outside the range the factorisation was fitted on: β taken as ${MIN_BETA} ± 0.15`);
    betaMethod += `; clamped to ${MIN_BETA}`;
    beta = MIN_BETA;
    betaSigma = 0.15;
  }
  const bSigmaRel = betaSigma / beta;
  return {
    beta,
    betaSigma,
    b: beta * free.b,
    c: beta * free.c,
    bSigmaRel,
    betaMethod,
    bMethod: `B = β·B0 with B0 = ${free.b} cm-1 (free ion)`,
    cMethod: `C = B·C0/B0 with C0 = ${free.c} cm-1 (free ion): C/B kept at the free-ion ratio`,
    source: `free-ion B0, C0 of ${metal.label}: ${free.source}`,
  };
}

/** The ground term from the engine, on the decided side of the crossover when the estimates sit on the other. */
function groundTermFor(
  metal: Ion,
  geometry: PredictGeometry,
  tenDq: number,
  racah: RacahEstimate | undefined,
  decision: SpinDecision,
  warnings: string[],
): { term: string; method: string } {
  if (geometry === 'square-planar') {
    if (metal.d === 8) return { term: '1A1g', method: 'square-planar d8 (D4h): closed-shell lower four orbitals (common practice)' };
    if (metal.d === 0 || metal.d === 10) return { term: '1A1g', method: 'closed configuration' };
    if (metal.d === 9) return { term: '2B1g', method: 'square-planar d9 (D4h): one hole in x²−y² (common practice)' };
    return { term: 'not modelled', method: 'the square-planar field is not modelled by the engine' };
  }
  const dq = tenDq / 10;
  const cOverB = racah ? racah.c / racah.b : 4;
  let b = racah?.b ?? 1000;
  let method = racah ? 'ligand-field engine at the estimated Dq, B and C' : 'ligand-field engine (B not estimated: B chosen on the decided side of the crossover)';
  if (decision.state !== 'no-choice') {
    // Place B so that Dq/B lies on the decided side: the weak-field limit (Dq/B = 0.5) or the strong-field one (Dq/B = 10).
    const first = computeLevels(metal.d, geometry, { dq, b, c: cOverB * b });
    if (first.spinState !== decision.state) {
      b = decision.state === 'low-spin' ? dq / 10 : dq / 0.5;
      method = `ligand-field engine on the ${decision.state} side of the crossover (the rule decided; the estimates sit on the other side)`;
    } else {
      warnings.push(...first.notes);
      return { term: first.groundTerm, method };
    }
  }
  const levels = computeLevels(metal.d, geometry, { dq, b, c: cOverB * b });
  warnings.push(...levels.notes);
  return { term: levels.groundTerm, method };
}
