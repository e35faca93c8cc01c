import { describe, expect, it } from 'vitest';
import { freeIonRacah } from '../../src/chemistry/free-ion.js';
import { parseIon } from '../../src/chemistry/ions.js';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { freeIonZeta } from '../../src/ligand-field/free-ion-zeta.js';
import { freeIonTerms } from '../../src/ligand-field/public-free-ion.js';

/**
 * The free-ion table against the free ions' observed levels: B0, C0 (and ζ)
 * of Fe2+, Fe3+ and Ni3+ are derived here from published level lists, so the
 * table is checked against the outside world, not against itself.
 *
 * Level lists (J, energy in cm-1), observed energies of the NIST Atomic
 * Spectra Database as copied in the CHIANTI atomic database
 * (github.com/wtbarnes/chianti-database, fe/fe_3/fe_3.elvlc and
 * fe/fe_4/fe_4.elvlc, "observed energies: NIST ASD"). Ni IV: NIST (2000)
 * term energies in Rydberg as tabulated in Astron. Astrophys. (2005),
 * https://www.aanda.org/articles/aa/full/2005/24/aa2025-04/table2.html.
 * A term's energy is the (2J+1)-weighted centroid of its levels (common practice).
 */
type Levels = ReadonlyArray<readonly [j: number, energy: number]>;

const centroid = (levels: Levels): number => {
  let weight = 0;
  let sum = 0;
  for (const [j, e] of levels) {
    weight += 2 * j + 1;
    sum += (2 * j + 1) * e;
  }
  return sum / weight;
};

// Fe III (Fe2+, 3d6), NIST ASD via CHIANTI fe_3.elvlc, observed column.
const FE3_5D: Levels = [[4, 0], [3, 436.2], [2, 738.9], [1, 932.4], [0, 1027.3]];
const FE3_3H: Levels = [[6, 20051.1], [5, 20300.801], [4, 20481.9]];
const FE3_3G: Levels = [[5, 24558.801], [4, 24940.9], [3, 25142.4]];
// Fe IV (Fe3+, 3d5), NIST ASD via CHIANTI fe_4.elvlc, observed column.
const FE4: Record<'4G' | '4P' | '4D' | '4F', Levels> = {
  '4G': [[5.5, 32245.5], [4.5, 32292.8], [2.5, 32301.2], [3.5, 32305.7]],
  '4P': [[2.5, 35253.8], [1.5, 35333.3], [0.5, 35406.6]],
  '4D': [[3.5, 38779.4], [0.5, 38896.7], [2.5, 38935.1], [1.5, 38938.2]],
  '4F': [[4.5, 52620.7], [3.5, 52695.4], [1.5, 52837.1], [2.5, 52838.0]],
};
// Ni IV (Ni3+, 3d7) term energies above 4F, Ry (NIST 2000 column of the A&A 2005 table).
const NI4_4P_RY = 0.15664;
const NI4_2G_RY = 0.17473;
const RYDBERG = 109737.316; // R∞ in cm-1 (CODATA)

/** Energy of a term above the ground term with the project's free-ion model (checks the Racah coefficients used below). */
const termAbove = (d: number, b: number, c: number, term: string): number => freeIonTerms(d, b, c).find((t) => t.term === term)!.energy;

describe('free-ion B0, C0 against the NIST levels', () => {
  it('Fe2+: 3H and 3G (4B+4C and 9B+4C above 5D) give B0 = 917, C0 = 4040', () => {
    const ground = centroid(FE3_5D);
    const h = centroid(FE3_3H) - ground;
    const g = centroid(FE3_3G) - ground;
    const b = (g - h) / 5;
    const c = h / 4 - b;
    expect(b).toBeCloseTo(917.13, 1);
    const entry = freeIonRacah(parseIon('Fe2+'))!;
    expect(entry.b).toBe(Math.round(b));
    expect(entry.c).toBe(Math.round(c));
    // The coefficients are those of the Racah model the engine uses.
    expect(termAbove(6, b, c, '3H')).toBeCloseTo(h, 6);
    expect(termAbove(6, b, c, '3G')).toBeCloseTo(g, 6);
    expect(entry.source).toMatch(/NIST/);
  });

  it('Fe3+: the quartet terms at B0 = 1015 give C0 = 4249 (least squares), and the model then misses no quartet by more than 5 %', () => {
    const entry = freeIonRacah(parseIon('Fe3+'))!;
    expect(entry.b).toBe(1015); // Jolly, Modern Inorganic Chemistry (1989), p. 411
    // Quartets above 6S: 4G = 10B+5C, 4P = 7B+7C, 4D = 17B+5C, 4F = 22B+7C (checked against the engine below).
    const coefficients = { '4G': [10, 5], '4P': [7, 7], '4D': [17, 5], '4F': [22, 7] } as const;
    let num = 0;
    let den = 0;
    for (const [term, [kb, kc]] of Object.entries(coefficients)) {
      const observed = centroid(FE4[term as keyof typeof FE4]);
      num += kc * (observed - kb * entry.b);
      den += kc * kc;
      expect(termAbove(5, 1000, 4000, term)).toBeCloseTo(kb * 1000 + kc * 4000, 6);
    }
    const c = num / den;
    expect(entry.c).toBe(Math.round(c));
    for (const term of Object.keys(coefficients)) {
      const observed = centroid(FE4[term as keyof typeof FE4]);
      expect(Math.abs(termAbove(5, entry.b, entry.c, term) - observed) / observed).toBeLessThan(0.05);
    }
  });

  it('Ni3+: 4P (15B) and 2G (4B+3C above 4F) give B0 = 1146, C0 = 4864', () => {
    const p = NI4_4P_RY * RYDBERG;
    const g = NI4_2G_RY * RYDBERG;
    const b = p / 15;
    const c = (g - 4 * b) / 3;
    const entry = freeIonRacah(parseIon('Ni3+'))!;
    expect(entry.b).toBe(Math.round(b));
    expect(entry.c).toBe(Math.round(c));
    expect(termAbove(7, b, c, '4P')).toBeCloseTo(p, 6);
    expect(termAbove(7, b, c, '2G')).toBeCloseTo(g, 6);
  });
});

describe('free-ion ζ against the NIST levels', () => {
  it('Fe2+: the 5D fine structure (5D4…5D0) fixes ζ = 418 cm-1 in intermediate coupling', () => {
    // Intermediate coupling with the engine (B0, C0 from the table; Dq = 0): the J levels of 5D are the five lowest.
    const { b, c } = freeIonRacah(parseIon('Fe2+'))!;
    const observed = FE3_5D.map(([, e]) => e);
    const misfit = (zeta: number): number => {
      const energies = [...new Set(computeFieldLevels(6, 'octahedral', { dq: 0, b, c, zeta, ds: 0, dt: 0 }).levels.map((l) => Math.round(l.energy * 1000) / 1000))].sort((x, y) => x - y);
      return observed.reduce((sum, e, i) => sum + (energies[i]! - e) ** 2, 0);
    };
    // Golden-section search on 300–550 cm-1 (the misfit is unimodal there: one multiplet, ζ scales it).
    let [lo, hi] = [300, 550];
    const phi = (Math.sqrt(5) - 1) / 2;
    for (let i = 0; i < 40; i++) {
      const x1 = hi - phi * (hi - lo);
      const x2 = lo + phi * (hi - lo);
      if (misfit(x1) < misfit(x2)) hi = x2;
      else lo = x1;
    }
    const zeta = (lo + hi) / 2;
    expect(Math.sqrt(misfit(zeta) / 4)).toBeLessThan(10); // the five levels are reproduced to a few cm-1
    expect(freeIonZeta('Fe2+')!.zeta).toBe(Math.round(zeta));
    // First-order check (Landé interval rule, λ = −ζ/2S = −ζ/4 for d6): 5D4–5D0 spans 10|λ|, i.e. 2.5ζ.
    expect(1027.3 / 2.5).toBeGreaterThan(0.95 * zeta);
    expect(1027.3 / 2.5).toBeLessThan(1.05 * zeta);
  });
});
