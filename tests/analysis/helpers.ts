import { computeLevels } from '../../src/ligand-field/index.js';
import type { Geometry } from '../../src/ligand-field/types.js';
import { formatDelimited, synthesizeSpectrum } from '../../src/spectrum/index.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/** Runs the CLI in process and collects what it prints. */
export async function cli(argv: string[], cwd = process.cwd()) {
  const { code, out, err } = await runCliCaptured(argv, { cwd });
  return { code, stdout: out, stderr: err };
}

export interface KnownComplex {
  d: number;
  geometry: Geometry;
  dq: number;
  b: number;
  c: number;
  /** Level labels whose transitions appear as bands, with peak ε and FWHM. */
  bands: Array<{ label: string; epsilon: number; fwhm: number }>;
}

/**
 * A synthetic spectrum (CSV text, nm) of a complex with known parameters: the
 * engine's transition energies as Gaussian bands in energy on a wavelength
 * grid, with a sloping baseline, a UV edge and seeded noise. Test input with
 * a known answer, not a check value from outside.
 */
export function syntheticCsv(complex: KnownComplex, { concentration = 0.05, noise = 0.002, seed = 7, fromNm = 300, toNm = 1100 } = {}): string {
  const { levels } = computeLevels(complex.d, complex.geometry, { dq: complex.dq, b: complex.b, c: complex.c });
  const bands = complex.bands.map((band) => {
    const level = levels.find((l) => l.label === band.label);
    if (!level) throw new Error(`no level ${band.label}`);
    return { position: level.energy, fwhm: band.fwhm, epsilon: band.epsilon };
  });
  const s = synthesizeSpectrum({
    bands, concentration, fromNm, toNm, stepNm: 1, baselineOffset: 0.02, baselineSlope: 0.015,
    edge: { position: 44000, fwhm: 9000, height: 2.5 }, noise, seed,
  });
  return formatDelimited({ x: s.wavelength, ys: [s.absorbance], header: ['Wavelength (nm)', 'Absorbance'] });
}
