/**
 * The bands of one corpus spectrum, from its true Dq, B and C.
 *
 * Positions: the band maxima are the energies of the project's own ligand-
 * field engine (computeLevels) at the chosen Dq, B, C. That engine is itself
 * checked against published tables elsewhere (tests/ligand-field/); here it
 * only places the bands. The truth of a corpus case is therefore the engine's
 * parameters: the corpus checks that the spectrum stage and the assignment
 * recover them from a spectrum that looks measured, not that the engine is
 * right.
 *
 * Everything else imitates measured spectra (the intensities and widths are
 * common practice for d–d spectra, see cases.ts for the sources of the ranges):
 * - widths follow the slope of the level against 10Dq (the Franck–Condon
 *   breadth of a transition grows with the change of equilibrium geometry,
 *   which follows dE/d(10Dq)): spin-allowed 2000–4000 cm-1, spin-forbidden
 *   levels parallel to the ground level 100–500 cm-1 (the sharp "spin-flip"
 *   lines such as 2Eg of Cr(III));
 * - asymmetric log-normal shapes (band-shape.ts), skewness 1.05–1.35;
 * - Jahn–Teller and spin–orbit splittings as components whose
 *   intensity-weighted centroid is the level energy;
 * - two-electron and other weak spin-allowed transitions weaker by a factor the
 *   family gives; sharp spin-forbidden lines at 0.3–3 % of the allowed ε.
 */
import { computeLevels } from '../../src/ligand-field/index.js';
import type { Geometry, Level, LevelsResult } from '../../src/ligand-field/types.js';
import { mulberry32 } from '../../src/spectrum/random.js';

export type TruthBandKind = 'spin-allowed' | 'spin-forbidden' | 'charge-transfer';

/** One absorption component of a corpus spectrum. Energies in cm-1. */
export interface TruthBand {
  /** The level's label ("4T1g(P)"), or "CT". */
  label: string;
  /** Level identity `${term}#${rank}`, shared by the components of a split band. */
  level: string;
  /** The level's energy (the band's centroid), cm-1. */
  centre: number;
  /** This component's maximum, cm-1. */
  position: number;
  fwhm: number;
  /** Log-normal skewness ρ (1: Gaussian). */
  skew: number;
  /** Peak ε, L mol-1 cm-1. */
  epsilon: number;
  kind: TruthBandKind;
  /** True for a weak spin-allowed transition (two-electron, orbitally forbidden). */
  weak: boolean;
}

/** A splitting of one level's band into components (Jahn–Teller or spin–orbit). */
export interface BandSplit {
  /** Level label to split; @default the lowest spin-allowed level */
  label?: string;
  /** Component offsets from the level energy, cm-1, before centring on the centroid. */
  offsets: number[];
  /** Relative peak heights of the components. */
  weights: number[];
  /** Each component's FWHM as a fraction of the unsplit band's. @default 0.75 */
  widthFactor?: number;
}

/** What the family of a corpus case says about its bands. */
export interface BandRecipe {
  d: number;
  geometry: Geometry;
  dq: number;
  b: number;
  c: number;
  /** Peak ε of the strongest spin-allowed band (d5 high-spin: of the strongest quartet). */
  epsilon: number;
  /** Intensity factor of named weak spin-allowed transitions (two-electron, …). */
  weak?: Readonly<Record<string, number>>;
  /** Spin-forbidden levels given a band of their own: ε factor and FWHM (overrides the sharp-line rule). */
  forbidden?: Readonly<Record<string, { factor: number; fwhm: number }>>;
  /** Jahn–Teller or spin–orbit components. */
  splits?: readonly BandSplit[];
  /** Levels above this are left out (they lie under the charge-transfer bands), cm-1. @default 40 000 */
  limit?: number;
  /**
   * How many of the lowest spin-allowed levels give a band (ν1, ν2, ν3: the higher ones are weak or hidden under
   * charge transfer in measured spectra, common practice). @default 3
   */
  allowedCount?: number;
  seed: number;
}

/** |dE/d(10Dq)| below which a spin-forbidden level runs parallel to the ground level: a sharp line. */
export const SHARP_SLOPE = 0.2;
/** At most this many sharp spin-forbidden lines per spectrum (the ones in the d–d region, lowest first). */
export const MAX_SHARP_LINES = 3;

const clamp = (v: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, v));

export function levelKey(level: Pick<Level, 'term' | 'rank'>): string {
  return `${level.term}#${level.rank}`;
}

/** dE/d(10Dq) of every level (central difference at ±1 % of Dq), keyed by levelKey. */
export function levelSlopes(d: number, geometry: Geometry, dq: number, b: number, c: number): Map<string, number> {
  const h = 0.01 * dq;
  const up = computeLevels(d, geometry, { dq: dq + h, b, c });
  const down = computeLevels(d, geometry, { dq: dq - h, b, c });
  const downEnergy = new Map(down.levels.map((l) => [levelKey(l), l.energy]));
  const slopes = new Map<string, number>();
  for (const l of up.levels) {
    const other = downEnergy.get(levelKey(l));
    // A crossover inside ±1 % changes the ground level and the zero: then the slope is not defined; call it steep.
    slopes.set(levelKey(l), other === undefined || up.groundTerm !== down.groundTerm ? 1 : (l.energy - other) / (20 * h));
  }
  return slopes;
}

/** The d–d bands of one spectrum (no charge transfer: see generate-spectrum.ts). */
export function truthBands(recipe: BandRecipe): { bands: TruthBand[]; levels: LevelsResult } {
  const { d, geometry, dq, b, c, epsilon, weak = {}, forbidden = {}, splits = [], limit = 40_000, allowedCount = 3 } = recipe;
  const random = mulberry32(recipe.seed * 7919 + 17);
  const between = (lo: number, hi: number): number => lo + (hi - lo) * random();
  const levels = computeLevels(d, geometry, { dq, b, c });
  const slopes = levelSlopes(d, geometry, dq, b, c);
  const ground = levels.levels[0]!;
  const excited = levels.levels.filter((l) => l.energy > 1 && l.energy < limit);
  const quartetOnly = d === 5 && ground.multiplicity === 6;
  const allowed = quartetOnly
    ? excited.filter((l) => l.multiplicity === 4 && l.energy < 33_000)
    : excited.filter((l) => l.multiplicity === ground.multiplicity).slice(0, allowedCount);
  const slope = (l: Level): number => Math.abs(slopes.get(levelKey(l)) ?? 1);
  const bands: TruthBand[] = [];
  for (const l of allowed) {
    const s = slope(l);
    // d5 high-spin: every band is spin-forbidden; widths run from sharp (4A1g,4Eg(G), parallel to the ground level) to broad.
    const fwhm = quartetOnly ? clamp(250 + 2200 * s, 250, 3500) * between(0.9, 1.1) : clamp(1800 + 1400 * s, 2000, 4000) * between(0.9, 1.1);
    const weakFactor = weak[l.label];
    const factor = quartetOnly ? clamp(700 / fwhm, 0.3, 1) * between(0.8, 1) : (weakFactor ?? between(0.55, 1));
    bands.push({
      label: l.label, level: levelKey(l), centre: l.energy, position: l.energy, fwhm, skew: between(1.05, 1.3),
      epsilon: epsilon * factor, kind: quartetOnly ? 'spin-forbidden' : 'spin-allowed', weak: weakFactor !== undefined && weakFactor < 0.3,
    });
  }
  // Keep the strongest allowed band (d5 high-spin: quartet) at the family's ε.
  const top = Math.max(...bands.map((x) => x.epsilon));
  for (const x of bands) x.epsilon *= epsilon / top;
  if (!quartetOnly && bands.length > 0) {
    const lowest = bands[0]!.centre;
    const highest = bands[bands.length - 1]!.centre;
    const sharp = excited
      .filter((l) => l.multiplicity !== ground.multiplicity && forbidden[l.label] === undefined)
      .filter((l) => slope(l) < SHARP_SLOPE && l.energy > 0.6 * lowest && l.energy < highest + 3000)
      .slice(0, MAX_SHARP_LINES);
    for (const l of sharp) {
      bands.push({
        label: l.label, level: levelKey(l), centre: l.energy, position: l.energy, fwhm: clamp(120 + 1500 * slope(l), 100, 500) * between(0.9, 1.1),
        skew: between(1, 1.1), epsilon: epsilon * between(0.003, 0.03), kind: 'spin-forbidden', weak: false,
      });
    }
  }
  for (const [label, { factor, fwhm }] of Object.entries(forbidden)) {
    const l = excited.find((x) => x.label === label);
    if (!l) throw new Error(`corpus recipe: no level ${label} for d${d} ${geometry}`);
    bands.push({
      label, level: levelKey(l), centre: l.energy, position: l.energy, fwhm, skew: between(1, 1.15),
      epsilon: epsilon * factor, kind: 'spin-forbidden', weak: false,
    });
  }
  for (const split of splits) applySplit(bands, split, random);
  bands.sort((x, y) => x.position - y.position);
  return { bands, levels };
}

/** Replaces one level's band by components whose height-weighted centroid is the level energy. */
function applySplit(bands: TruthBand[], split: BandSplit, random: () => number): void {
  const index = split.label === undefined ? bands.findIndex((x) => x.kind !== 'charge-transfer') : bands.findIndex((x) => x.label === split.label);
  if (index < 0) throw new Error(`corpus recipe: no band ${split.label ?? '(lowest)'} to split`);
  const band = bands[index]!;
  const total = split.weights.reduce((s, w) => s + w, 0);
  const mean = split.offsets.reduce((s, o, i) => s + o * split.weights[i]!, 0) / total;
  const top = Math.max(...split.weights);
  const components = split.offsets.map((o, i): TruthBand => ({
    ...band,
    position: band.centre + o - mean,
    fwhm: band.fwhm * (split.widthFactor ?? 0.75) * (0.95 + 0.1 * random()),
    epsilon: (band.epsilon * split.weights[i]!) / top,
  }));
  bands.splice(index, 1, ...components);
}
