import { describe, expect, it } from 'vitest';
import { freeIonRacah } from '../../src/chemistry/free-ion-racah.js';
import { parseIon } from '../../src/chemistry/ions.js';
import { freeIonZeta } from '../../src/ligand-field/free-ion-zeta.js';
import { freeIonTerms } from '../../src/ligand-field/public-free-ion.js';
import { racahFromTerms, termCentroids, zetaFromGroundTerm } from './nist-derive.js';
import { NIST_LEVELS } from './nist-levels.js';

/**
 * The free-ion tables against the free ions' observed levels (NIST Atomic
 * Spectra Database; sources in nist-levels.ts). The check values are derived
 * here from the level lists, not taken from the tables:
 * - B, C: least squares of the two-parameter Racah model over every observed
 *   3d^n term (centroids). A table B0 is either that fit (source says
 *   "least-squares Racah fit") or a recalled/published value within 5 % of it.
 * - ζ: the ground term's J levels in intermediate coupling (d1: 5ζ/2 exactly).
 * The coefficients of the Racah model are the engine's; the three closed
 * forms spot-checked below (15B for 3P–3F of d2/d8 and 4P–4F of d3/d7,
 * 4B+4C and 9B+4C for 3H, 3G of d4/d6) are common practice.
 */

/** Ions whose B0/C0 the table derives from the fit (rounded); the others are kept within 5 % of it. */
const DERIVED = ['Mn4+', 'Mn3+', 'Fe2+', 'Ni3+'];
/**
 * Recalled values kept although outside 5 % (see src/chemistry/free-ion.ts): the
 * check is that the table says so and names the fitted value, and that the
 * difference stays what it is (so a later change is seen).
 */
const KEPT_OUTSIDE: Readonly<Record<string, number>> = { 'Mn2+': 880, 'Co2+': 994 };

describe('free-ion B0, C0 against the NIST levels', () => {
  it('the Racah coefficients of the engine are the textbook ones for the terms used', () => {
    expect(freeIonTerms(2, 1000, 4000).find((t) => t.term === '3P')!.energy).toBeCloseTo(15000, 6); // 15B (common practice)
    expect(freeIonTerms(3, 1000, 4000).find((t) => t.term === '4P')!.energy).toBeCloseTo(15000, 6); // 15B
    const d6 = freeIonTerms(6, 1000, 4000);
    expect(d6.find((t) => t.term === '3H')!.energy).toBeCloseTo(4 * 1000 + 4 * 4000, 6); // 4B + 4C above 5D
    expect(d6.find((t) => t.term === '3G')!.energy).toBeCloseTo(9 * 1000 + 4 * 4000, 6); // 9B + 4C above 5D
  });

  for (const [label, ion] of Object.entries(NIST_LEVELS)) {
    if (ion.d === 1) continue;
    it(`${label}: the table's B0 is the NIST-level fit, within 5 % of it, or a documented exception`, () => {
      const fit = racahFromTerms(ion);
      const entry = freeIonRacah(parseIon(label));
      if (!entry) {
        expect(label).toBe('Cr4+'); // not tabulated: the fit (about 1 041 and 3 956) is there for whoever adds it
        return;
      }
      if (label in KEPT_OUTSIDE) {
        expect(Math.round(fit.b)).toBe(KEPT_OUTSIDE[label]);
        expect(entry.source).toContain(`NIST-level fit gives B = ${KEPT_OUTSIDE[label]}`);
        expect(Math.abs(entry.b - fit.b) / fit.b).toBeLessThan(0.15);
      } else if (DERIVED.includes(label)) {
        // Rounded to the cm-1.
        expect(Math.abs(entry.b - fit.b)).toBeLessThanOrEqual(1);
        expect(Math.abs(entry.c - fit.c)).toBeLessThanOrEqual(1);
        expect(entry.source).toMatch(/least-squares Racah fit/);
      } else {
        expect(Math.abs(entry.b - fit.b) / fit.b).toBeLessThanOrEqual(0.05);
        expect(entry.source).toMatch(/within 5 %/);
      }
      // The model reproduces the observed terms to about 1 000 cm-1 at worst (configuration interaction it leaves out).
      expect(fit.rms).toBeLessThan(1100);
    });
  }

  it('Fe3+: C0 is the least-squares C of the quartets 4G, 4P, 4D, 4F at B0 = 1015', () => {
    const entry = freeIonRacah(parseIon('Fe3+'))!;
    expect(entry.b).toBe(1015); // Jolly, Modern Inorganic Chemistry (1989), p. 411
    const centroids = termCentroids(NIST_LEVELS['Fe3+']!.levels);
    // Quartets above 6S: 4G = 10B+5C, 4P = 7B+7C, 4D = 17B+5C, 4F = 22B+7C (the engine's, checked here).
    const coefficients = { '4G': [10, 5], '4P': [7, 7], '4D': [17, 5], '4F': [22, 7] } as const;
    let num = 0;
    let den = 0;
    for (const [term, [kb, kc]] of Object.entries(coefficients)) {
      expect(freeIonTerms(5, 1000, 4000).find((t) => t.term === term)!.energy).toBeCloseTo(kb * 1000 + kc * 4000, 6);
      num += kc * (centroids.get(term)! - kb * entry.b);
      den += kc * kc;
    }
    expect(entry.c).toBe(Math.round(num / den));
  });

  it('Ni3+: B from 4P − 4F = 15B alone is within 2 % of the all-term fit', () => {
    const centroids = termCentroids(NIST_LEVELS['Ni3+']!.levels);
    const fromP = (centroids.get('4P')! - centroids.get('4F')!) / 15;
    expect(fromP).toBeCloseTo(1146, 0);
    expect(Math.abs(fromP - freeIonRacah(parseIon('Ni3+'))!.b) / fromP).toBeLessThan(0.02);
  });
});

describe('free-ion ζ against the NIST levels', () => {
  for (const [label, ion] of Object.entries(NIST_LEVELS)) {
    const groundLevels = ion.levels.filter(([term]) => term === ion.ground).length;
    if (groundLevels < 2) continue; // d5 (6S) and the Ni IV term list have no fine structure to fit
    it(`${label}: ζ from the ${ion.ground} fine structure`, () => {
      const entry = freeIonZeta(label)!;
      expect(entry.source).toMatch(/NIST/);
      if (ion.d === 1) {
        // 2D5/2 − 2D3/2 = 5ζ/2 for one d electron (common practice).
        const interval = ion.levels[1]![2] - ion.levels[0]![2];
        expect(entry.zeta).toBe(Math.round(interval / 2.5));
        return;
      }
      const racah = freeIonRacah(parseIon(label)) ?? racahFromTerms(ion);
      const { zeta, rms } = zetaFromGroundTerm(ion, racah.b, racah.c);
      expect(rms).toBeLessThan(10); // the J levels are reproduced to a few cm-1
      // ±2 cm-1: the fitted ζ moves by about that with the B and C used.
      expect(Math.abs(entry.zeta - zeta)).toBeLessThanOrEqual(2);
    });
  }
});
