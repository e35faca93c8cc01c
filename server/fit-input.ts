/**
 * The POST /fit body (validated by schemas.fitBody) as the fit's FitInput.
 * The names are the same; this only drops absent fields, so the core sees
 * exactly what the client sent.
 */
import type { BandInput, FitInput } from '../src/fit/index.js';
import type { TetragonalFitInput } from '../src/fit-tetragonal/index.js';
import { wantsFitBeyondCubic, type FitBody } from './schemas.js';

type BodyBand = FitBody['bands'][number];

function toBandInput(band: BodyBand): number | BandInput {
  if (typeof band === 'number') return band;
  const out: BandInput = { position: band.position };
  if (band.uncertainty !== undefined) out.uncertainty = band.uncertainty;
  if (band.epsilon !== undefined) out.epsilon = band.epsilon;
  if (band.width !== undefined) out.width = band.width;
  if (band.flags !== undefined) out.flags = band.flags;
  return out;
}

export function toFitInput(body: FitBody): FitInput {
  const input: FitInput = { bands: body.bands.map(toBandInput) };
  if (body.ion !== undefined) input.ion = body.ion;
  if (body.d !== undefined) input.d = body.d;
  if (body.geometry !== undefined) input.geometry = body.geometry;
  if (body.cOverB !== undefined) input.cOverB = body.cOverB;
  if (body.c !== undefined) input.c = body.c;
  if (body.freeC !== undefined) input.freeC = body.freeC;
  if (body.trees !== undefined) input.trees = body.trees;
  if (body.formula !== undefined) input.formula = body.formula;
  if (body.ligands !== undefined) input.ligands = body.ligands;
  if (body.window !== undefined) input.window = body.window;
  return input;
}

/**
 * The body as the fit beyond the cubic field (src/fit-tetragonal), as the
 * CLI's `fit --symmetry tetragonal` / `--zeta` / `--free-zeta` builds it; null
 * when the body asks for the cubic fit. The schema has already refused the
 * fields only the cubic fit reads.
 */
export function toTetragonalFitInput(body: FitBody): TetragonalFitInput | null {
  if (!wantsFitBeyondCubic(body)) return null;
  const input: TetragonalFitInput = {
    bands: body.bands.map(toBandInput),
    geometry: body.geometry ?? 'octahedral',
    symmetry: body.symmetry ?? 'cubic',
  };
  if (body.ion !== undefined) input.ion = body.ion;
  if (body.d !== undefined) input.d = body.d;
  if (body.cOverB !== undefined) input.cOverB = body.cOverB;
  if (body.zeta !== undefined) input.zeta = body.zeta;
  if (body.freeZeta === true) input.freeZeta = true;
  return input;
}
