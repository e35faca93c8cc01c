/**
 * Invented demo spectra for the page tests (not measurements, never check
 * values): a d3 ion in an octahedral field with its two lower spin-allowed
 * bands, a UV edge and noise. Files from spectra-demo/ are used when the
 * coordinator's set is there.
 */
import { existsSync, readdirSync } from 'node:fs';
import { writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { formatDelimited, synthesizeSpectrum } from '../../../src/spectrum/index.js';

export interface DemoFile {
  path: string;
  name: string;
  /** Analysis fields the file needs. */
  ion: string;
  geometry: 'octahedral' | 'tetrahedral';
  concentration: number;
}

/** Writes an invented d3 spectrum (bands at `positions`, cm-1) as CSV into `folder`. */
export async function writeInventedD3(folder: string, name: string, positions: [number, number], seed = 7): Promise<DemoFile> {
  const concentration = 0.02;
  const spectrum = synthesizeSpectrum({
    bands: [
      { position: positions[0], fwhm: 2600, epsilon: 15 },
      { position: positions[1], fwhm: 3200, epsilon: 18 },
    ],
    fromNm: 300,
    toNm: 900,
    stepNm: 1,
    concentration,
    baselineOffset: 0.01,
    edge: { position: 40_000, fwhm: 6000, height: 1.2 },
    noise: 0.001,
    seed,
  });
  const text = formatDelimited({
    x: spectrum.wavelength,
    ys: [spectrum.absorbance],
    header: ['wavelength (nm)', 'absorbance'],
    preamble: ['# invented demo spectrum for the fieldgap page tests, not a measurement'],
  });
  const path = join(folder, name);
  await writeFile(path, text);
  return { path, name, ion: 'Cr3+', geometry: 'octahedral', concentration };
}

const DEMO_DIR = resolve(import.meta.dirname, '..', '..', '..', 'spectra-demo');

/**
 * Three single-spectrum files of the invented Cr(III) scenario in
 * spectra-demo/ (0.05 mol/L, see its README), or, where that folder is
 * missing, three invented d3 spectra written into `folder`.
 */
export async function demoFiles(folder: string): Promise<DemoFile[]> {
  const names = ['cr-aqua.csv', 'cr-oxalato.txt', 'cr-ammine.jdx'];
  if (existsSync(DEMO_DIR) && names.every((n) => readdirSync(DEMO_DIR).includes(n))) {
    return names.map((name) => ({ path: join(DEMO_DIR, name), name, ion: 'Cr3+', geometry: 'octahedral', concentration: 0.05 }));
  }
  return Promise.all([
    writeInventedD3(folder, 'invented-d3-a.csv', [17_400, 24_500], 7),
    writeInventedD3(folder, 'invented-d3-b.csv', [16_200, 23_000], 11),
    writeInventedD3(folder, 'invented-d3-c.csv', [21_600, 28_300], 12),
  ]);
}
