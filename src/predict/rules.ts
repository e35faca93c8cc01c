import type { Ion } from '../chemistry/ions.js';
import type { Geometry } from '../ligand-field/types.js';

/**
 * The rules of the trade that decide a geometry or a spin state without
 * numbers. Each is named and sourced; "common practice" where no single
 * source holds it. They are applied before the numbers, in the order below,
 * and the prediction says which one decided.
 */
export type PredictGeometry = Geometry | 'square-planar';

export interface Rule {
  /** Short stable id: "row-2-3-low-spin". */
  id: string;
  /** What the rule says, as a user reads it. */
  statement: string;
  source: string;
}

/** What a rule needs to know about the ligands. */
export interface LigandSet {
  /** Ligand keys, one per kind. */
  keys: readonly string[];
}

const COMMON = 'common practice';

/** Ligands at the strong end of the spectrochemical series (σ-donor and π-acceptor). */
export const STRONG_FIELD = new Set(['CN', 'CO']);
/** π-acceptor ligands whose d6 complexes are low-spin. */
export const PI_ACCEPTORS = new Set(['CN', 'CO', 'NO2', 'bpy', 'phen', 'tpy', 'PPh3', 'PMe3', 'PEt3', 'PR3', 'H']);
/** Ligands that make four-coordinate d8 square planar. */
export const SQUARE_PLANAR_LIGANDS = new Set(['CN', 'CO', 'NO2', 'PPh3', 'PMe3', 'PEt3', 'PR3', 'H', 'dtc', 'bpy', 'phen']);
/** The weak-field halides. */
export const HALIDES = new Set(['F', 'Cl', 'Br', 'I']);

export const RULES = {
  squarePlanarHeavy: {
    id: 'square-planar-d8-heavy',
    statement: 'four-coordinate d8 of the second and third row (Pd(II), Pt(II), Au(III), Rh(I), Ir(I)) is square planar and diamagnetic',
    source: COMMON,
  },
  squarePlanarStrong: {
    id: 'square-planar-d8-strong-field',
    statement: 'four-coordinate d8 with strong-field ligands ([Ni(CN)4]2-) is square planar and diamagnetic',
    source: COMMON,
  },
  squarePlanarCopper: {
    id: 'square-planar-d9',
    statement: 'four-coordinate Cu(II) and Ag(II) (d9) with N- or O-donors are square planar (Jahn–Teller)',
    source: COMMON,
  },
  tetrahedralHalide: {
    id: 'tetrahedral-halide-M2',
    statement: 'four-coordinate halide complexes of first-row M(II) ([CoCl4]2-, [NiCl4]2-) are tetrahedral',
    source: COMMON,
  },
  heavyLowSpin: {
    id: 'row-2-3-low-spin',
    statement: 'second- and third-row complexes are low-spin (10Dq is 30–80% larger and the pairing energy smaller than in the 3d row)',
    source: COMMON,
  },
  tetrahedralHighSpin: {
    id: 'tetrahedral-high-spin',
    statement: 'tetrahedral complexes are high-spin: Δt ≈ 4/9 Δo stays below the pairing energy',
    source: COMMON,
  },
  strongField: {
    id: 'cyanide-carbonyl-strong-field',
    statement: 'cyanide and CO are strong-field ligands: their first-row complexes are low-spin',
    source: COMMON,
  },
  piAcceptorD6: {
    id: 'd6-pi-acceptor-low-spin',
    statement: 'd6 with π-acceptor ligands only (diimines, nitro, phosphanes, CN-, CO) is low-spin: t2g6 gains the largest LFSE, 2.4 Δo',
    source: COMMON,
  },
  d4HighSpin: {
    id: 'd4-first-row-high-spin',
    statement: 'first-row d4 ions (Cr(II), Mn(III)) are high-spin except with cyanide and CO',
    source: COMMON,
  },
  weakHalide: {
    id: 'halide-weak-field',
    statement: 'iodide, bromide, chloride (and fluoride) are weak-field ligands: first-row M(II) and M(III) halide complexes are high-spin',
    source: COMMON,
  },
  aquaHighSpin: {
    id: 'aqua-high-spin',
    statement: 'water is weak-field: first-row aqua ions are high-spin, [Co(H2O)6]3+ the well-known exception',
    source: COMMON,
  },
} as const satisfies Record<string, Rule>;

/** The geometry a rule fixes for a four-coordinate complex, or undefined when none applies. */
export function fourCoordinateRule(metal: Pick<Ion, 'd' | 'row' | 'charge'>, ligands: LigandSet): { geometry: PredictGeometry; rule: Rule } | undefined {
  if (metal.d === 8 && metal.row > 1) return { geometry: 'square-planar', rule: RULES.squarePlanarHeavy };
  if (metal.d === 8 && ligands.keys.every((k) => SQUARE_PLANAR_LIGANDS.has(k))) return { geometry: 'square-planar', rule: RULES.squarePlanarStrong };
  const halides = ligands.keys.every((k) => HALIDES.has(k));
  if (metal.row === 1 && metal.charge === 2 && halides) return { geometry: 'tetrahedral', rule: RULES.tetrahedralHalide };
  if (metal.d === 9 && metal.charge === 2 && !halides) return { geometry: 'square-planar', rule: RULES.squarePlanarCopper };
  return undefined;
}

/**
 * The spin state a rule fixes for a complex with a spin choice, or undefined
 * when the numbers must decide. Square-planar d8 is handled by the geometry.
 */
export function spinRule(metal: Pick<Ion, 'd' | 'row' | 'charge' | 'label'>, geometry: PredictGeometry, ligands: LigandSet): { spin: 'high-spin' | 'low-spin'; rule: Rule } | undefined {
  if (metal.row > 1) return { spin: 'low-spin', rule: RULES.heavyLowSpin };
  if (geometry === 'tetrahedral') return { spin: 'high-spin', rule: RULES.tetrahedralHighSpin };
  const all = (set: ReadonlySet<string>) => ligands.keys.length > 0 && ligands.keys.every((k) => set.has(k));
  if (all(STRONG_FIELD)) return { spin: 'low-spin', rule: RULES.strongField };
  if (metal.d === 6 && all(PI_ACCEPTORS)) return { spin: 'low-spin', rule: RULES.piAcceptorD6 };
  if (metal.d === 4 && metal.charge >= 2) return { spin: 'high-spin', rule: RULES.d4HighSpin };
  if (metal.charge >= 2 && metal.charge <= 3 && all(HALIDES)) return { spin: 'high-spin', rule: RULES.weakHalide };
  if (metal.charge >= 2 && metal.charge <= 3 && metal.label !== 'Co3+' && all(new Set(['H2O']))) return { spin: 'high-spin', rule: RULES.aquaHighSpin };
  return undefined;
}
