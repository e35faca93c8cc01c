/**
 * "Show these levels": the Levels view's form filled with a tetragonal fit's
 * parameters (Dq, Ds, Dt, ζ; B and C where the ion has them) and computed,
 * so the fitted levels and their diagram are one click from the fit. Works
 * through the form's own fields (web/views/levels.ts), as a user would.
 */
import type { TetragonalFitResult } from '../types.js';

function setField(id: string, value: number): void {
  const input = document.getElementById(id);
  if (input instanceof HTMLInputElement) input.value = String(Math.round(value * 10) / 10);
}

/** Fills the (already drawn) Levels form with the fit and submits it. */
export function showFittedLevels(fit: TetragonalFitResult): void {
  const form = document.getElementById('levels-form');
  const symmetry = document.getElementById('lv-symmetry');
  if (!(form instanceof HTMLFormElement) || !(symmetry instanceof HTMLSelectElement)) return;
  symmetry.value = fit.symmetry === 'tetragonal' ? 'tetragonal' : fit.geometry;
  symmetry.dispatchEvent(new Event('change'));
  setField('lv-d', fit.d);
  setField('lv-dq', fit.dq);
  setField('lv-ds', fit.ds);
  setField('lv-dt', fit.dt);
  setField('lv-zeta', fit.zeta);
  // d1 and d9 have no B or C: the form keeps its own, which play no part in their levels.
  if (fit.b !== null) setField('lv-b', fit.b);
  if (fit.c !== null) setField('lv-c', fit.c);
  form.requestSubmit();
}
