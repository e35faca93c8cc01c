import { describe, expect, it } from 'vitest';
import { erf } from 'mathjs';
import { normalCdf } from '../../src/predict/normal.js';
import { meanPairingEnergy, pairingEnergyExpression } from '../../src/predict/pairing-energy.js';
import { boxArrows, orbitalOccupation } from '../../src/predict/occupation.js';
import { ligandF, ligandH, metalG, metalK } from '../../src/predict/factor-table.js';
import { LIGANDS } from '../../src/chemistry/ligands.js';
import { parseIon } from '../../src/chemistry/ions.js';
import { freeIonRacah } from '../../src/chemistry/free-ion-racah.js';

describe('normalCdf', () => {
  it('agrees with mathjs erf to 1e-7', () => {
    for (let z = -6; z <= 6; z += 0.25) {
      const reference = 0.5 * (1 + erf(z / Math.SQRT2)); // mathjs 15 erf as reference
      expect(Math.abs(normalCdf(z) - reference), String(z)).toBeLessThan(1e-7);
    }
    expect(normalCdf(0)).toBeCloseTo(0.5, 7);
  });
});

describe('mean pairing energy', () => {
  it("Griffith's expressions, d4–d7 only", () => {
    expect(pairingEnergyExpression(4)).toBe('6B + 5C'); // Griffith (1961), from memory
    expect(pairingEnergyExpression(5)).toBe('7.5B + 5C'); // Griffith (1961), from memory
    expect(meanPairingEnergy(6, 100, 1000)).toBe(2.5 * 100 + 4 * 1000);
    expect(meanPairingEnergy(7, 100, 1000)).toBe(4 * 100 + 4 * 1000);
    expect(meanPairingEnergy(3, 100, 1000)).toBeUndefined();
    expect(meanPairingEnergy(8, 100, 1000)).toBeUndefined();
  });

  it('free-ion pairing energies within 10% of the tabulated ones', () => {
    // Free-ion Π (cm-1) after Orgel, as tabulated in Huheey, Inorganic Chemistry: from memory.
    const cases: [string, number][] = [['Mn2+', 25500], ['Fe3+', 30000], ['Co3+', 21000], ['Co2+', 22500]];
    for (const [label, pi] of cases) {
      const free = freeIonRacah(parseIon(label))!;
      const value = meanPairingEnergy(parseIon(label).d, free.b, free.c)!;
      expect(Math.abs(value - pi) / pi, label).toBeLessThan(0.1);
    }
  });
});

describe('orbital occupation', () => {
  /** Slow reference: place electrons one by one, always into the lowest-energy place (a pairing costs P). */
  function slowUnpaired(d: number, energies: number[], pairing: number): number {
    const occ = energies.map(() => 0);
    for (let e = 0; e < d; e++) {
      let best = -1;
      let bestCost = Infinity;
      occ.forEach((n, i) => {
        if (n === 2) return;
        const cost = (energies[i] as number) + (n === 1 ? pairing : 0);
        if (cost < bestCost - 1e-12) { bestCost = cost; best = i; }
      });
      occ[best] = (occ[best] as number) + 1;
    }
    return occ.filter((n) => n === 1).length;
  }

  it('high-spin and low-spin unpaired counts match an electron-by-electron reference', () => {
    const oct = [-4, -4, -4, 6, 6];
    const tet = [-6, -6, 4, 4, 4];
    for (let d = 0; d <= 10; d++) {
      expect(orbitalOccupation(d, 'octahedral', true).unpairedElectrons, `oct HS d${d}`).toBe(slowUnpaired(d, oct, 1e6));
      expect(orbitalOccupation(d, 'octahedral', false).unpairedElectrons, `oct LS d${d}`).toBe(slowUnpaired(d, oct, 1e-3));
      expect(orbitalOccupation(d, 'tetrahedral', true).unpairedElectrons, `tet HS d${d}`).toBe(slowUnpaired(d, tet, 1e6));
      expect(orbitalOccupation(d, 'tetrahedral', false).unpairedElectrons, `tet LS d${d}`).toBe(slowUnpaired(d, tet, 1e-3));
    }
  });

  it('LFSE in Dq and the arrows', () => {
    expect(orbitalOccupation(3, 'octahedral', true).lfseDq).toBe(-12); // common practice: d3 −1.2 Δo
    expect(orbitalOccupation(5, 'octahedral', true).lfseDq).toBe(0); // common practice: high-spin d5 has none
    expect(orbitalOccupation(7, 'tetrahedral', true).lfseDq).toBe(-12); // common practice: e4 t2^3, −1.2 Δt
    expect(orbitalOccupation(8, 'square-planar', false).lfseDq).toBeCloseTo(-24.56, 9); // Day & Selbin, Theoretical Inorganic Chemistry (1962), p. 292: 4(−5.14) + 2(−4.28) + 2(2.28)
    const ls6 = orbitalOccupation(6, 'octahedral', false);
    expect(ls6.sets[0]?.boxes.map(boxArrows)).toEqual(['↑↓', '↑↓', '↑↓']);
    expect(orbitalOccupation(4, 'octahedral', true).sets.map((s) => s.boxes.map(boxArrows).join('|'))).toEqual(['↑ |↑ |↑ ', '↑ |  ']);
  });
});

describe('factor table', () => {
  it('every known ligand has an f with a source and an uncertainty; estimates are marked', () => {
    for (const l of LIGANDS) {
      const f = ligandF(l.key);
      expect(f, l.key).toBeDefined();
      expect(f!.sigma, l.key).toBeGreaterThan(0);
      expect(f!.source.length, l.key).toBeGreaterThan(10);
      if (f!.kind === 'estimate') expect(f!.source, l.key).toMatch(/estimate/);
      expect(ligandH(l.key).sigma, l.key).toBeGreaterThan(0);
    }
  });

  it('spectrochemical order of the estimates among the published (common practice)', () => {
    const order = ['I', 'Br', 'Cl', 'F', 'OH', 'H2O', 'NH3', 'en', 'NO2', 'CN', 'CO'];
    const values = order.map((k) => ligandF(k)!.value);
    for (let i = 1; i < values.length; i++) expect(values[i]!, order[i]).toBeGreaterThan(values[i - 1]!);
  });

  it('every common ion has a g and a k, estimates marked with a wider σ', () => {
    const ions = ['Ti3+', 'V3+', 'V2+', 'Cr3+', 'Cr2+', 'Mn2+', 'Mn3+', 'Fe2+', 'Fe3+', 'Co2+', 'Co3+', 'Ni2+', 'Cu2+',
      'Ru2+', 'Ru3+', 'Rh3+', 'Pd2+', 'Ag+', 'Os2+', 'Os3+', 'Ir3+', 'Pt2+', 'Pt4+', 'Au3+'];
    for (const label of ions) {
      const ion = parseIon(label);
      const g = metalG(ion);
      expect(g.value, label).toBeGreaterThan(0);
      expect(g.sigma / g.value, label).toBeGreaterThanOrEqual(g.kind === 'published' ? 0.049 : 0.07);
      expect(metalK(ion).value, label).toBeGreaterThan(0);
    }
    expect(metalG(parseIon('Fe2+'))).toMatchObject({ value: 8500, kind: 'published' }); // Jørgensen (1971), pp. 347–348
  });
});
