/**
 * No reported band is undetermined: the band fit prunes bands whose
 * position deviation exceeds half their FWHM during model selection, and
 * again after the chosen model is refined to convergence (fitBands.ts), where
 * a band can still drift onto the baseline's curvature or into a corner of
 * its bounds (one such band reported ±1e298 cm-1).
 *
 * The spectra come from the validation corpus generator (tests/accuracy/),
 * whose band positions are the project's own ligand-field engine: NOT an
 * outside check; the invariant checked (σ ≤ FWHM/2, finite) needs no truth.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';

// The cases where a converged band was left undetermined before the final pruning.
const IDS = ['v3-aqua/nir', 'cr3-n-donor/nir', 'cu2-aqua/nir', 'fe2-tet/nir'];

describe('no undetermined band is reported', () => {
  for (const c of corpusCases().filter((k) => IDS.includes(k.id))) {
    it(`${c.id}: every band's position σ is finite and at most half its FWHM`, () => {
      const spectrum = parseSpectrumText(caseSpectrum(c).csv).spectra[0]!;
      const result = processSpectrum(spectrum, { geometry: c.family.geometry, ...(c.concentrationGiven && { concentration: c.concentration }), ...(c.pathLength !== 1 && { pathLength: c.pathLength }) });
      expect(result.bands.length).toBeGreaterThan(0);
      for (const b of result.bands) {
        expect(Number.isFinite(b.positionUncertainty)).toBe(true);
        // positionUncertainty also holds the extrapolation error of a centre outside the window (0.1 FWHM).
        expect(b.positionUncertainty).toBeLessThanOrEqual(0.5 * b.fwhm);
      }
    });
  }
});
