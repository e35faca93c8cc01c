/**
 * A parsed spectrum on an ascending wavenumber axis, with y as the signal
 * the bands are fitted to: absorbance (transmittance converted), or ε when
 * the file holds ε. Also returns the absorbance used for saturation checks
 * (ε · c · l for ε input with a concentration, else null for ε input).
 */
import { yToAbsorbance } from './y-to-absorbance.js';
import { xToWavenumber } from './x-to-wavenumber.js';
import type { Spectrum } from './types.js';

export interface EnergySpectrum {
  /** cm-1, ascending. */
  x: Float64Array;
  signal: Float64Array;
  /** Absorbance for masking, or null when it cannot be known (ε without concentration). */
  absorbance: Float64Array | null;
  signalUnit: 'absorbance' | 'epsilon';
}

export function spectrumToEnergy(spectrum: Spectrum, concentration: number | undefined, pathLength: number): EnergySpectrum {
  const nu = xToWavenumber(spectrum.x, spectrum.xUnit, spectrum.name);
  const y = yToAbsorbance(spectrum.y, spectrum.yUnit);
  const ascending = nu.length < 2 || (nu[1] as number) > (nu[0] as number);
  const x = ascending ? nu : nu.slice().reverse();
  const signal = ascending ? y : y.slice().reverse();
  if (spectrum.yUnit !== 'epsilon') return { x, signal, absorbance: signal, signalUnit: 'absorbance' };
  const absorbance = concentration === undefined ? null : Float64Array.from(signal, (e) => e * concentration * pathLength);
  return { x, signal, absorbance, signalUnit: 'epsilon' };
}
