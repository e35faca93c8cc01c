/**
 * Issue 13, "Done when": the numbers the pipeline must reach. Written to
 * fail where the pipeline is wrong today: those cases are `it.fails(...)`
 * ("fails until issue 13 lands"). Once the pipeline is fixed the marker
 * itself fails, and the coordinator turns it into a plain `it`.
 *
 * Check values: the four visible-only spectra are synthesized from published
 * band positions, ε and widths (fixtures/spectra/real-like/README.md names
 * the sources); the published band sets name theirs in published-sets.ts;
 * the corpus truth is the engine's own parameters (cases.ts), an internal
 * check, not an outside one.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum, type AnalyzeResult } from '../../src/analysis.js';
import { FieldgapError } from '../../src/errors.js';
import { fitBands } from '../../src/fit/index.js';
import { corpusCases, caseSpectrum } from './cases.js';
import { PUBLISHED_SETS } from './published-sets.js';
import { REAL_LIKE, realLikeCsv } from './real-like.js';
import { analyzeCase, correctedSteps, gradeRealLike, runCase, stepCheck, type CaseOutcome } from './run-corpus.js';
import { summarize } from './report.js';

const FIXTURES = join(import.meta.dirname, '..', '..', 'fixtures', 'spectra', 'real-like');

function fixture(file: string): string {
  return readFileSync(join(FIXTURES, file), 'utf8');
}

function analyzeFixture(file: string, ion: string): AnalyzeResult {
  return analyzeSpectrum(fixture(file), { fileName: file, ion });
}

describe('the real-like fixtures are what their recipe makes', () => {
  it.each(REAL_LIKE.map((s) => [s.file, s] as const))('%s', (_file, s) => {
    expect(fixture(s.file)).toBe(realLikeCsv(s));
    const rows = fixture(s.file).trim().split('\n').slice(3);
    expect(rows).toHaveLength(401); // 380–780 nm, 1 nm steps
    expect(rows.every((r) => /^\d+,-?\d+\.\d\d$/.test(r))).toBe(true); // rounded to 0.01
  });
});

describe('visible-only spectra (380–780 nm, 0.01)', () => {
  // The grading is gradeRealLike's (run-corpus.ts), shared with docs/accuracy.md; the check values are in its wording:
  // Ni(II) 10Dq 8 000–9 000 and β < 1 (10Dq = ν1 ≈ 8 500, found: docs/sources.md NI-AQUA-VN), Co(II) high-spin (common practice),
  // Cu(II) maximum near 12 350 cm-1 (published calibration data, see the fixtures README) within ±1 000 cm-1.
  const graded = (file: string, ion: string) => {
    let outcome: CaseOutcome;
    try {
      outcome = { result: analyzeFixture(file, ion), error: null, ms: 0 };
    } catch (error) {
      outcome = { result: null, error, ms: 0 };
    }
    return gradeRealLike(file, ion, outcome);
  };

  it('aqueous Ni(II): 10Dq 8 000–9 000 cm-1 and β < 1 from its two visible bands', () => {
    const row = graded('ni-aqua-visible.csv', 'Ni2+');
    expect(row.pass, row.result).toBe(true);
  });

  it('aqueous Co(II) is high-spin', () => {
    const row = graded('co-aqua-visible.csv', 'Co2+');
    expect(row.pass, row.result).toBe(true);
  });

  it('aqueous Cu(II): the band beyond the red end within ±1 000 cm-1, with a note that its maximum lies outside', () => {
    const row = graded('cu-aqua-visible.csv', 'Cu2+');
    expect(row.pass, row.result).toBe(true);
  });

  it('permanganate (d0) gives no ligand-field fit, with a clear message', () => {
    let error: unknown;
    try {
      analyzeFixture('permanganate-visible.csv', 'Mn7+');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(FieldgapError);
    expect((error as FieldgapError).message).toMatch(/d0/);
    expect((error as FieldgapError).message).not.toMatch(/\/work\/|at .*\.ts/);
  });
});

describe('published band sets', () => {
  const set = (id: string) => PUBLISHED_SETS.find((s) => s.id === id)!;
  const within3 = (id: string): void => {
    const s = set(id);
    const r = fitBands({ ion: s.ion, geometry: s.geometry, bands: s.bands, ...(s.freeC && { freeC: true }) });
    expect(Math.abs(r.tenDq - s.tenDq) / s.tenDq).toBeLessThanOrEqual(0.03); // source: published-sets.ts
  };
  it('hexaaqua Mn(II), five quartets, C free: 10Dq within 3 %', () => within3('mn2-aqua'));
  it('hexaaqua Mn(II), five quartets flagged spin-forbidden, C free: 10Dq within 3 %', () => within3('mn2-aqua-sf'));
  // A reading of the issue ("flagged or not", item 5: the data decide what is fitted): five quartets fix C, so the fit
  // should free it without being told. If the coordinator decides --free-c stays the user's choice, drop these two.
  it('hexaaqua Mn(II), five quartets, C not freed by the user: 10Dq within 3 %', () => within3('mn2-aqua-c-ratio'));
  it('hexaaqua Mn(II), five quartets flagged, C not freed by the user: 10Dq within 3 % and every band explained', () => {
    within3('mn2-aqua-c-ratio-sf');
    const s = set('mn2-aqua-c-ratio-sf');
    expect(fitBands({ ion: s.ion, geometry: s.geometry, bands: s.bands }).unassigned).toEqual([]);
  });
  // Fails: 10Dq ≈ 7 200 (−15 %). The cubic model cannot put 4T1g(P) at 32 400 cm-1 together with the other six bands
  // (rms 448 cm-1). The engine now has the Trees term (fit option `trees`, tests/fit/trees.test.ts), and with α fitted
  // every band fits (rms 46 cm-1, α 90 ± 7, B 823, C 3 020, C/B 3.67, β 0.86), 4T1g(G) and 4T2g(G) then giving the same
  // 10Dq (7 623 and 7 589) where without α they disagree by 1 300 (8 951 and 7 619 at the B, C of the field-independent
  // bands): but that 10Dq is 7 630 ± 70, −10 % from the check value 8 500, which comes from an analysis without α
  // (Ballhausen's F2, F4 and a 10Dq from memory). So α is the cause of the misfit of 32 400, not a way to 8 500; the
  // marker stays until a published α analysis of these bands (Heidt, Koster & Johnson 1958, not found) gives the value
  // to check against. Without the 32 400 band the six give 10Dq ≈ 8 415 (−1 %) without α, see the next test.
  it.fails('hexaaqua Mn(II), seven quartets, C free: 10Dq within 3 %', () => within3('mn2-aqua-7'));
  it('hexaaqua Mn(II), the six quartets below 30 000 cm-1 of the seven-band set, C free: 10Dq within 3 %', () => {
    const s = set('mn2-aqua-7');
    const six = s.bands.split(',').filter((b) => !b.startsWith('32400')).join(',');
    const r = fitBands({ ion: s.ion, geometry: s.geometry, bands: six, freeC: true });
    expect(Math.abs(r.tenDq - s.tenDq) / s.tenDq).toBeLessThanOrEqual(0.03); // source: published-sets.ts
  });
  // Honest uncertainty (issue 13, helper honest): whatever the 10Dq, its reported ± must reach the published value when the
  // weak-band labellings span it (src/fit/assignment-spread.ts); before the spread was counted it was 7 198 ± 529.
  it('hexaaqua Mn(II), seven quartets, C free: the reported ± of 10Dq reaches the published value', () => {
    const s = set('mn2-aqua-7');
    const r = fitBands({ ion: s.ion, geometry: s.geometry, bands: s.bands, freeC: true });
    expect(Math.abs(r.tenDq - s.tenDq)).toBeLessThanOrEqual(r.uncertainty.tenDq!); // source: published-sets.ts (from memory)
  });
  // Fails, as above (flagged): the Trees fit gives 7 627 here too.
  it.fails('hexaaqua Mn(II), seven quartets flagged spin-forbidden, C free: 10Dq within 3 %', () => within3('mn2-aqua-7-sf'));
  it('tetrahedral [NiCl4]2-: 10Dq within 3 %', () => within3('ni2-tet-cl'));
});

/** Each corpus case is analysed once and shared by the tests below (the corpus takes a while on a busy machine). */
const CORPUS_TIMEOUT_MS = 900_000;

describe('honest when underdetermined (issue 13, item 5)', () => {
  it('Ni(II) 8 500, 13 800, 25 300 with C free: no astronomical uncertainty called exact', () => {
    let fit: ReturnType<typeof fitBands>;
    try {
      fit = fitBands({ ion: 'Ni2+', bands: [8500, 13800, 25300], freeC: true });
    } catch (error) {
      expect(error).toBeInstanceOf(FieldgapError); // refusing with a clear message is an honest answer
      return;
    }
    const c = fit.c ?? 0;
    const sigma = fit.uncertainty.c;
    // Either C is reported with an uncertainty smaller than itself, or not reported as determined at all.
    expect(sigma === null || (Number.isFinite(sigma) && sigma < Math.abs(c))).toBe(true);
  });
});

describe('the validation corpus', () => {
  const cases = corpusCases();
  const outcomes = new Map<string, CaseOutcome>();
  const outcomeOf = (c: (typeof cases)[number]): CaseOutcome => {
    let outcome = outcomes.get(c.id);
    if (!outcome) {
      outcome = analyzeCase(c);
      outcomes.set(c.id, outcome);
    }
    return outcome;
  };

  it('passes at 95 % or better within 3 % (10Dq) and 8 % (B) with every spin state right', () => {
    const rows = cases.map((c) => runCase(c, outcomeOf(c)));
    const s = summarize(rows);
    expect(s.rate).toBeGreaterThanOrEqual(0.95);
    expect(rows.filter((r) => !r.pass.spin).map((r) => r.id)).toEqual([]);
  }, CORPUS_TIMEOUT_MS);

  it('corrects no step on data without one', () => {
    const smooth = cases.filter((c) => c.distortions.step === undefined);
    const corrected = smooth.flatMap((c) => {
      const { result } = outcomeOf(c);
      return result === null ? [] : correctedSteps(result).map((at) => `${c.id} at ${Math.round(at)} cm-1`);
    });
    expect(corrected).toEqual([]);
  }, CORPUS_TIMEOUT_MS);

  it('corrects the real detector steps the corpus places', () => {
    const stepped = cases.filter((c) => c.distortions.step !== undefined);
    const missed = stepped.flatMap((c) => {
      const { result } = outcomeOf(c);
      if (result === null) return []; // a refused analysis (too few bands) shows no steps to judge
      return stepCheck(correctedSteps(result), c.distortions.step).realFound ? [] : [`${c.id} (${c.distortions.step!.size} at ${c.distortions.step!.atNm} nm)`];
    });
    // The corpus's steps are 15–30 times the noise: a correction method must find nearly all of them. A choice of
    // this corpus, not an outside figure: at most a tenth may be missed (a step on a steep flank is harder).
    expect(missed.length, missed.join(', ')).toBeLessThanOrEqual(Math.floor(0.1 * stepped.length));
  }, CORPUS_TIMEOUT_MS);

  it('finds no spurious band on quantized, noise-free data', () => {
    const quantized = cases.filter((c) => c.distortions.noise === 0);
    const spurious: string[] = [];
    for (const c of quantized) {
      const spectrum = caseSpectrum(c);
      const { result } = outcomeOf(c);
      if (result === null) continue;
      for (const band of result.bands) {
        // A found band is real when a drawn band (any component, the CT band included) lies within its width.
        const near = spectrum.bands.some((b) => Math.abs(b.position - band.position) <= Math.max(band.fwhm, b.fwhm, 1000));
        if (!near) spurious.push(`${c.id}: ${Math.round(band.position)} cm-1`);
      }
    }
    expect(spurious).toEqual([]);
  }, CORPUS_TIMEOUT_MS);
});
