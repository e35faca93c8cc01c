import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../src/analysis.js';
import { assignedKindWarnings, bandsTooStrongForFit, spinForbiddenEpsilonCeiling } from '../src/analysis-kind-checks.js';
import { NoLigandFieldFit } from '../src/analysis-no-fit.js';
import { caseSpectrum, corpusCases } from './accuracy/cases.js';
import { caseOptions } from './accuracy/run-corpus.js';

/**
 * A band's intensity against its assigned transition (AUDIT2 finding 4): a
 * wrong ion (permanganate analysed as Mn2+) must not pass as a clean
 * high-spin d5 fit. The spectra are synthesized (fixtures/spectra/real-like,
 * the validation corpus of tests/accuracy/).
 */
const fixture = (name: string) => readFileSync(fileURLToPath(new URL(`../fixtures/spectra/real-like/${name}`, import.meta.url)));
const band = (position: number, kind: 'd-d' | 'spin-forbidden', epsilon: number | null, height = 0.1) => ({ position, kind, epsilon, height });
const hsD5 = { d: 5, spinState: 'high-spin' as const, geometry: 'octahedral' as const, ion: 'Mn2+', assignments: [] };

describe('high-spin d5: every d–d band is spin-forbidden and weak', () => {
  it('the ceilings: hexaaqua Mn(II) ε ≈ 0.03, Fe(III) ε ≈ 1–4, MnX4 2- ε ≈ 1–4 all lie below them', () => {
    // Lever, Inorganic Electronic Spectroscopy (1984), as tests/accuracy/families.ts cites it (values from memory there)
    expect(spinForbiddenEpsilonCeiling('octahedral', 'Mn2+')).toBeGreaterThan(0.04);
    expect(spinForbiddenEpsilonCeiling('octahedral', 'Fe3+')).toBeGreaterThan(4);
    expect(spinForbiddenEpsilonCeiling('tetrahedral', 'Mn2+')).toBeGreaterThan(4);
  });

  it('with ε: a band above the ceiling is named; one far above is not d–d', () => {
    const bands = [band(18900, 'spin-forbidden', 0.03), band(25000, 'd-d', 3)];
    const kinds = ['spin-forbidden', 'spin-forbidden'] as const;
    const [warning] = assignedKindWarnings(bands, kinds, hsD5);
    expect(warning).toMatch(/^for high-spin d5 all d–d bands are spin-forbidden and weak/);
    expect(warning).toContain('25000 cm-1 (ε = 3.00 L mol-1 cm-1)');
    expect(warning).not.toContain('18900');
    expect(bandsTooStrongForFit(bands, kinds, hsD5)).toEqual([]);
    expect(bandsTooStrongForFit([band(25000, 'd-d', 30)], ['spin-forbidden'], hsD5)).toEqual([0]);
    // an unassigned band is not the fit's business
    expect(bandsTooStrongForFit([band(25000, 'd-d', 30)], [null], hsD5)).toEqual([]);
  });

  it('weak bands (hexaaqua Mn(II)-like) give no warning', () => {
    expect(assignedKindWarnings([band(18900, 'd-d', 0.03), band(23100, 'd-d', 0.02)], ['spin-forbidden', 'spin-forbidden'], hsD5)).toEqual([]);
  });

  it('permanganate analysed as Mn2+ without --conc: the warning says what concentration the bands would need', () => {
    const result = analyzeSpectrum(fixture('permanganate-visible.csv'), { fileName: 'mn.csv', ion: 'Mn2+' });
    const warning = result.warnings.find((w) => w.startsWith('for high-spin d5'));
    expect(warning).toMatch(/would need a concentration above [\d.]+ mol\/L/);
    expect(warning).toContain('check the ion');
  });

  it('a corpus Fe(III) spectrum given a concentration 1000 times too small: its bands are not taken as d–d', () => {
    const c = corpusCases().find((k) => k.id === 'fe3-o-donor/uvvis')!;
    let error: unknown;
    try {
      analyzeSpectrum(caseSpectrum(c).csv, { ...caseOptions(c), concentration: c.concentration / 1000 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(NoLigandFieldFit);
    expect((error as Error).message).toMatch(/far above any d–d band of high-spin d5/);
  });

  it('the corpus d5 spectra as generated (Mn(II), Fe(III), MnX4 2-) give no such warning', () => {
    for (const c of corpusCases().filter((k) => ['mn2-aqua', 'fe3-o-donor', 'mn2-tet'].includes(k.family.key))) {
      const result = analyzeSpectrum(caseSpectrum(c).csv, caseOptions(c));
      expect(result.warnings.filter((w) => w.includes('high-spin d5')), c.id).toEqual([]);
    }
  });
});

describe('other ions', () => {
  it('a band as strong as the spin-allowed ones assigned to a spin-forbidden transition is doubtful', () => {
    const fit = { d: 3, spinState: 'no-choice' as const, geometry: 'octahedral' as const, ion: 'Cr3+', assignments: [{ spinAllowed: true }] as never[] };
    const [warning] = assignedKindWarnings([band(17400, 'd-d', 15), band(15000, 'd-d', 14)], ['spin-allowed', 'spin-forbidden'], fit);
    expect(warning).toMatch(/band at 15000 cm-1 .*assigned to a spin-forbidden transition: a doubtful assignment/);
    expect(assignedKindWarnings([band(17400, 'd-d', 15), band(15000, 'spin-forbidden', 0.5)], ['spin-allowed', 'spin-forbidden'], fit)).toEqual([]);
  });
});
