import { describe, expect, it } from 'vitest';
import { freeIonTerms } from '../../src/ligand-field/index.js';

/**
 * Free-ion term energies above the ground term, in B and C, for every d^n.
 * Source: Racah, Phys. Rev. 62, 438 (1942) and Griffith, The Theory of
 * Transition-Metal Ions (1961), Table A20, written relative to the ground term
 * (A drops out). Found (docs/sources.md JORGENSEN-1962-T2, RACAH-WIKI-DE):
 * Jørgensen, Absorption Spectra and Chemical Bonding in Complexes (1962),
 * Table 2 "Excitation energies of some multiplet terms in spherical symmetry"
 * (excerpt on uniterpacademy.com) gives every d2/d8 term, the d3/d7 terms 4P,
 * 2G, 2P, 2H and the d5 quartets 4G, 4P, 4D, 4F exactly as below; the German
 * Wikipedia "Racah-Parameter" (de.zxc.wiki copy) gives the d2 terms as
 * A − 8B, A + 7B, A − 3B + 2C, A + 4B + 2C, A + 14B + 7C, the same differences.
 * The rest (d3 2F, 2D; all of d4/d6; the d5 doublets) is recalled from those
 * tables (from memory).
 * d^n and d^(10−n) have the same term energies. An outside check of the model
 * against observed free-ion terms (NIST Atomic Spectra Database levels of 13
 * ions) is in tests/chemistry/free-ion-nist.test.ts.
 */
type Expected = Record<string, (b: number, c: number) => number[]>;

const root = (x: number): number => Math.sqrt(x);

const D2: Expected = {
  '3F': () => [0],
  '3P': (b) => [15 * b],
  '1D': (b, c) => [5 * b + 2 * c],
  '1G': (b, c) => [12 * b + 2 * c],
  '1S': (b, c) => [22 * b + 7 * c],
};

const D3: Expected = {
  '4F': () => [0],
  '4P': (b) => [15 * b],
  '2G': (b, c) => [4 * b + 3 * c],
  '2P': (b, c) => [9 * b + 3 * c],
  '2H': (b, c) => [9 * b + 3 * c],
  '2F': (b, c) => [24 * b + 3 * c],
  '2D': (b, c) => [-1, 1].map((s) => 20 * b + 5 * c + s * root(193 * b * b + 8 * b * c + 4 * c * c)),
};

const D4: Expected = {
  '5D': () => [0],
  '3H': (b, c) => [4 * b + 4 * c],
  '3G': (b, c) => [9 * b + 4 * c],
  '3D': (b, c) => [16 * b + 4 * c],
  '3P': (b, c) => [-1, 1].map((s) => 16 * b + 5.5 * c + 0.5 * s * root(912 * b * b - 24 * b * c + 9 * c * c)),
  '3F': (b, c) => [-1, 1].map((s) => 16 * b + 5.5 * c + 1.5 * s * root(68 * b * b + 4 * b * c + c * c)),
  '1I': (b, c) => [6 * b + 6 * c],
  '1G': (b, c) => [-1, 1].map((s) => 16 * b + 7.5 * c + 0.5 * s * root(708 * b * b - 12 * b * c + 9 * c * c)),
  '1D': (b, c) => [-1, 1].map((s) => 30 * b + 7.5 * c + 1.5 * s * root(144 * b * b + 8 * b * c + c * c)),
  '1S': (b, c) => [-1, 1].map((s) => 31 * b + 10 * c + 2 * s * root(193 * b * b + 8 * b * c + 4 * c * c)),
  '1F': (b, c) => [21 * b + 6 * c],
};

const D5: Expected = {
  '6S': () => [0],
  '4G': (b, c) => [10 * b + 5 * c],
  '4P': (b, c) => [7 * b + 7 * c],
  '4D': (b, c) => [17 * b + 5 * c],
  '4F': (b, c) => [22 * b + 7 * c],
  '2I': (b, c) => [11 * b + 8 * c],
  '2H': (b, c) => [13 * b + 10 * c],
  '2G': (b, c) => [22 * b + 8 * c, 38 * b + 10 * c],
  '2F': (b, c) => [10 * b + 10 * c, 26 * b + 8 * c],
  '2S': (b, c) => [32 * b + 8 * c],
  '2P': (b, c) => [55 * b + 10 * c],
  '2D': (b, c) => [31 * b + 10 * c, ...[-1, 1].map((s) => 32 * b + 11 * c + 3 * s * root(57 * b * b + 2 * b * c + c * c))],
};

const D1: Expected = { '2D': () => [0] };

const TABLES: Array<[number, Expected]> = [
  [1, D1], [2, D2], [3, D3], [4, D4], [5, D5], [6, D4], [7, D3], [8, D2], [9, D1],
];

/** Computed terms grouped by symbol without repetition number: "2D2" → "2D". */
function grouped(d: number, b: number, c: number): Map<string, number[]> {
  const map = new Map<string, number[]>();
  for (const term of freeIonTerms(d, b, c)) {
    const symbol = term.term.replace(/\d+$/, '').replace(/^(\d+[A-Z]).*$/, '$1');
    map.set(symbol, [...(map.get(symbol) ?? []), term.energy]);
  }
  return map;
}

describe('free-ion terms of d^n', () => {
  // Two (B, C) pairs with different C/B so both coefficients of every term are tested.
  it.each(TABLES)('d%i matches the published term energies at two (B, C)', (d, table) => {
    for (const [b, c] of [[1000, 4000], [700, 2200]] as const) {
      const computed = grouped(d, b, c);
      expect([...computed.keys()].sort()).toEqual(Object.keys(table).sort());
      for (const [symbol, energies] of Object.entries(table)) {
        const want = energies(b, c).sort((x, y) => x - y);
        const got = computed.get(symbol)!.sort((x, y) => x - y);
        expect(got.length, symbol).toBe(want.length);
        want.forEach((value, i) => expect(got[i]!, `${symbol} at B=${b}, C=${c}`).toBeCloseTo(value, 6));
      }
    }
  });

  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i: Σ (2S+1)(2L+1) = C(10, n)', (d) => {
    const binomial = (n: number, k: number): number => (k === 0 ? 1 : (binomial(n - 1, k - 1) * n) / k);
    const total = freeIonTerms(d, 800, 3200).reduce((sum, t) => sum + t.multiplicity * (2 * t.L + 1), 0);
    expect(total).toBe(binomial(10, d));
  });

  it('repeated terms are numbered by ascending energy and the list is ascending', () => {
    const terms = freeIonTerms(5, 800, 3200);
    const d = terms.filter((t) => t.term.startsWith('2D'));
    expect(d.map((t) => t.term)).toEqual(['2D1', '2D2', '2D3']);
    for (let i = 1; i < terms.length; i++) expect(terms[i]!.energy).toBeGreaterThanOrEqual(terms[i - 1]!.energy);
    expect(terms[0]).toEqual({ term: '6S', multiplicity: 6, L: 0, energy: 0 });
  });

  it('d0 and d10: the single 1S term', () => {
    expect(freeIonTerms(0, 800, 3200)).toEqual([{ term: '1S', multiplicity: 1, L: 0, energy: 0 }]);
    expect(freeIonTerms(10, 800, 3200)).toEqual([{ term: '1S', multiplicity: 1, L: 0, energy: 0 }]);
  });
});
