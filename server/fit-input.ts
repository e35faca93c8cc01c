/**
 * The POST /fit body (validated by schemas.fitBody) as the fit's FitInput.
 * The names are the same; this only drops absent fields, so the core sees
 * exactly what the client sent.
 */
import type { BandInput, FitInput } from '../src/fit/index.js';
import type { FitBody } from './schemas.js';

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
