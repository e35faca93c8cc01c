/**
 * A narrow residual candidate (a would-be spin-forbidden line) that the
 * refinement broadens into a weak broad band is not kept (fitBands.ts,
 * broadenedWeak): on low-noise UV-vis-NIR spectra of octahedral and
 * tetrahedral Co(II) such a band, 3 % of the tallest and 1 600–1 800 cm-1
 * wide, took up the heavy tail of an asymmetric band between the two
 * spin-allowed bands and was assigned as a doublet, halving 10Dq.
 *
 * The spectra come from the validation corpus generator (tests/accuracy/),
 * whose band positions are the project's own ligand-field engine: NOT an
 * outside check; the property checked needs no truth beyond the generator's
 * own statement that it placed no band there.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';

describe('no weak broad band grown from a narrow residual candidate', () => {
  for (const c of corpusCases().filter((k) => ['co2-tet/nir-2', 'co2-aqua/nir-2'].includes(k.id))) {
    it(`${c.id}: between the two spin-allowed bands, every band broader than a spin-flip line (≥ 1200 cm-1) is at least a tenth of the tallest`, () => {
      const spectrum = parseSpectrumText(caseSpectrum(c).csv).spectra[0]!;
      const result = processSpectrum(spectrum, { geometry: c.family.geometry, ...(c.concentrationGiven && { concentration: c.concentration }), ...(c.pathLength !== 1 && { pathLength: c.pathLength }) });
      const tallest = Math.max(...result.bands.map((b) => b.height));
      // The two spin-allowed bands are still there.
      const strong = result.bands.filter((b) => b.height >= 0.5 * tallest);
      expect(strong).toHaveLength(2);
      const between = result.bands.filter((b) => b.position > strong[0]!.position && b.position < strong[1]!.position);
      const weakBroad = between.filter((b) => b.fwhm >= 1200 && b.height < 0.1 * tallest);
      expect(weakBroad.map((b) => Math.round(b.position))).toEqual([]);
    });
  }
});
