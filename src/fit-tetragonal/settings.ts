import { freeIonRacah } from '../chemistry/free-ion-racah.js';
import { parseIon, type Ion } from '../chemistry/ions.js';
import { invalidArgument } from '../errors.js';
import { normalizeBands, type ObservedBand } from '../fit/bands.js';
import { defaultBandSigma } from '../fit/observations.js';
import type { ResolvedParameters } from '../ligand-field/field-levels.js';
import { freeIonZeta, type FreeIonZeta } from '../ligand-field/free-ion-zeta.js';
import type { Geometry } from '../ligand-field/types.js';
import type { ModelSetting } from './model.js';
import type { TetragonalFitInput, TetragonalFitResult } from './types.js';

/**
 * The fixed part of a tetragonal fit, read from the input once: the ion,
 * the bands to fit (ascending; charge-transfer and spin-forbidden ones left
 * out), the free parameters and how a parameter vector maps to the engine's
 * parameters. Parameter vectors have five slots, always in the order
 * Dq, Ds, Dt, B, ζ (cm-1); freeParams lists the slots the fit moves.
 * Every refusal names its field.
 */
export interface FitSettings {
  ion: Ion | null;
  d: number;
  geometry: Geometry;
  symmetry: 'cubic' | 'tetragonal';
  setting: ModelSetting;
  zeta: number;
  zetaMode: TetragonalFitResult['zetaMode'];
  tabulatedZeta: FreeIonZeta | undefined;
  /** Free-ion B0, cm-1, when the ion has one (the β prior). */
  b0: number | null;
  cOverB: number;
  bMatters: boolean;
  bStart: number;
  fitted: ObservedBand[];
  /** Lowest charge-transfer band given, if any (transitions above it may hide under it). */
  ctOnset: number | undefined;
  sigmas: number[];
  freeParams: number[];
  /** Central-difference steps per slot, cm-1. */
  steps: Float64Array;
  toParameters(x: Float64Array): ResolvedParameters;
  /** The five slots from the free ones and a base vector. */
  full(freeX: Float64Array, base: Float64Array): Float64Array;
}

export const PARAMETER_NAMES = ['Dq', 'Ds', 'Dt', 'B', 'ζ'] as const;

export function fitSettings(input: TetragonalFitInput): FitSettings {
  if (typeof input !== 'object' || input === null) throw invalidArgument('', 'the fit input must be an object with bands and an ion or d');
  const ion: Ion | null = input.ion === undefined ? null : parseIon(input.ion, { path: 'ion' });
  const d = input.d ?? ion?.d;
  if (d === undefined) throw invalidArgument('ion', 'give the metal as an ion (e.g. "Cu2+") or as a d-electron count');
  if (ion && input.d !== undefined && ion.d !== input.d) throw invalidArgument('d', `d = ${input.d} disagrees with ${ion.label}, which is d${ion.d}`);
  if (!Number.isInteger(d) || d < 1 || d > 9) throw invalidArgument(ion ? 'ion' : 'd', `d${d} has no d–d transitions, so there is nothing to fit`);
  const geometry = input.geometry ?? 'octahedral';
  const symmetry = input.symmetry ?? 'tetragonal';
  if (symmetry === 'tetragonal' && geometry !== 'octahedral') {
    throw invalidArgument('geometry', 'the tetragonal fit is for (distorted) octahedra and square-planar complexes: use the octahedral geometry');
  }
  const tabulatedZeta = ion ? freeIonZeta(ion.label) : undefined;
  let zeta = 0;
  let zetaMode: TetragonalFitResult['zetaMode'] = 'fixed';
  if (input.zeta === 'free-ion') {
    if (!tabulatedZeta) throw invalidArgument('zeta', `no free-ion ζ is tabulated for ${ion ? ion.label : `a bare d${d}`}: give ζ in cm-1`);
    zeta = tabulatedZeta.zeta;
    zetaMode = 'free-ion';
  } else if (input.zeta !== undefined) {
    if (typeof input.zeta !== 'number' || !Number.isFinite(input.zeta) || input.zeta < 0) throw invalidArgument('zeta', 'zeta must be ≥ 0 cm-1 or "free-ion"');
    zeta = input.zeta;
  }
  if (input.freeZeta) {
    zetaMode = 'free';
    if (zeta === 0) zeta = tabulatedZeta ? 0.8 * tabulatedZeta.zeta : 400;
  }
  const free = ion ? freeIonRacah(ion) : undefined;
  const cOverB = input.cOverB ?? (free ? free.c / free.b : 4.5);
  const bMatters = d !== 1 && d !== 9;
  const observed = normalizeBands(input.bands, 'bands');
  const fitted = observed.filter((band) => !band.flags.includes('charge-transfer') && !band.flags.includes('spin-forbidden'));
  if (fitted.length === 0) throw invalidArgument('bands', 'no d–d band left to fit (all are charge-transfer or spin-forbidden)');
  fitted.sort((x, y) => x.position - y.position);
  const ct = observed.filter((band) => band.flags.includes('charge-transfer')).map((band) => band.position);
  // Plausible ranges (common practice for d-block complexes): outside them the model only fits by accident.
  const bOf = (v: number): number => Math.min(2000, Math.max(150, v));
  const freeParams = [0, ...(symmetry === 'tetragonal' ? [1, 2] : []), ...(bMatters && input.b === undefined ? [3] : []), ...(zetaMode === 'free' ? [4] : [])];
  return {
    ion, d, geometry, symmetry, setting: { d, geometry, spinOrbit: zeta > 0 }, zeta, zetaMode, tabulatedZeta,
    b0: free ? free.b : null, cOverB, bMatters, bStart: input.b ?? (free ? 0.75 * free.b : 800),
    fitted, ctOnset: ct.length > 0 ? Math.min(...ct) : undefined,
    sigmas: fitted.map((band) => band.uncertainty ?? defaultBandSigma(band.position)),
    freeParams,
    steps: new Float64Array([2, 2, 2, 2, 1]),
    toParameters: (x) => ({
      dq: Math.max(0, x[0]!), ds: x[1]!, dt: x[2]!, b: bOf(x[3]!), c: cOverB * bOf(x[3]!), zeta: Math.min(3000, Math.max(0, x[4]!)),
    }),
    full: (freeX, base) => {
      const x = Float64Array.from(base);
      freeParams.forEach((j, i) => (x[j] = freeX[i]!));
      return x;
    },
  };
}
