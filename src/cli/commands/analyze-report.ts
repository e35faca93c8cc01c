import type { AnalyzeResult } from '../../analysis.js';
import type { AnalysisWithoutFit } from '../../analysis-no-fit.js';
import { bandAssignedKinds, bandKindText, kindsDisagree } from '../../report/band-assigned-kind.js';
import { formatPlusMinus } from '../../report/plus-minus.js';
import { percentText } from '../../report/probability.js';
import { priorStrainOf, priorStrainText } from '../../report/prior-strain.js';
import { textTableLines } from '../../report/text-table.js';
import { spinStateSentence } from '../../report/spin-state-wording.js';

/** The readable report of one analysed spectrum: what was measured, the bands, the fit. */
export function formatAnalysisReport(label: string, result: AnalyzeResult): string {
  const { fit } = result;
  const lines = bandLines(label, result, fit);
  lines.push('', 'Ligand field');
  const pm = (v: number | null, u: number | null | undefined, unit: string, digits = 0) =>
    v === null ? 'not determined' : `${formatPlusMinus(v, u, { digits })} ${unit}`.trimEnd();
  lines.push(`  10Dq        ${pm(fit.tenDq, fit.uncertainty.tenDq, 'cm-1')}`);
  lines.push(`  B           ${pm(fit.b, fit.uncertainty.b, 'cm-1')}`);
  lines.push(`  C           ${pm(fit.c, fit.uncertainty.c, 'cm-1')}${cModeNote(fit)}`);
  lines.push(`  beta        ${fit.beta === null ? 'not determined' : `${formatPlusMinus(fit.beta, fit.betaSd, { digits: 3 })} (B0 = ${fit.freeIonB} cm-1)`}`);
  lines.push(`  ground      ${fit.groundLabel}, ${spinStateSentence(fit.spinState, fit.d, fit.geometry)}, ${fit.unpairedElectrons} unpaired, spin-only ${fit.spinOnlyMoment.toFixed(2)} μB`);
  lines.push(`  rms         ${fit.rmsResidual.toFixed(0)} cm-1 (${fit.message})`);
  lines.push(...splitBandLines(result));
  // The group (src/fit/assignment-groups.ts): a stored result from an older fieldgap may lack it.
  const group = fit.assignmentGroup as typeof fit.assignmentGroup | undefined;
  const grouped = group && group.members > 1 ? `; spin-allowed assignment and parameters ${percentText(group.probability)} (${group.members} labellings of the weak bands)` : '';
  const spread = fit.assignmentSpread as typeof fit.assignmentSpread | undefined;
  if (spread?.widened) {
    lines.push(`  labellings  10Dq ${spread.tenDqRange.map((v) => v.toFixed(0)).join('–')}${spread.bRange && fit.b !== null ? `, B ${spread.bRange.map((v) => v.toFixed(0)).join('–')}` : ''} cm-1 over the weak-band labellings (inside the ± above; fit alone ± ${spread.fitUncertainty.tenDq?.toFixed(0) ?? '—'})`);
  }
  lines.push(`  assignment  probability ${percentText(fit.probability)}${grouped}${spinStates(fit.spinStateProbabilities)}`);
  // Probability is relative; a reading far outside its own priors says so here (src/report/prior-strain.ts, AUDIT3 finding 2).
  const strain = priorStrainOf(fit.penalties as typeof fit.penalties | undefined);
  if (strain) lines.push(`  priors      ${priorStrainText(strain)}`);
  const goodness = fit.goodnessOfFit as typeof fit.goodnessOfFit | undefined;
  if (goodness?.verdict === 'poor') lines.push(`  fit         POOR: χ² = ${goodness.chiSquare.toFixed(1)} for ${goodness.degreesOfFreedom} degrees of freedom (p = ${goodness.pValue.toPrecision(2)})${goodness.reason ? `: ${goodness.reason}` : ''}`);
  const warnings = result.warnings;
  if (warnings.length > 0) lines.push('', 'Warnings', ...warnings.map((w) => `  - ${w}`));
  lines.push('', 'Results are model estimates: check the assignment against the spectrum.');
  return `${lines.join('\n')}\n`;
}

/** The heading line, masked stretches and the band table; `fit` null when there was none. */
function bandLines(label: string, result: Pick<AnalyzeResult, 'spectrum' | 'bands' | 'corrections'>, fit: AnalyzeResult['fit'] | null): string[] {
  const { spectrum, bands } = result;
  const eps = spectrum.signalUnit === 'epsilon' || bands.some((b) => b.epsilon !== null);
  const lines: string[] = [];
  lines.push(`${label}: ${spectrum.name} (${spectrum.format}, ${spectrum.points} points, ${Math.round(spectrum.range[0])}–${Math.round(spectrum.range[1])} cm-1, ${(1e7 / spectrum.range[1]).toFixed(0)}–${(1e7 / spectrum.range[0]).toFixed(0)} nm)`);
  for (const m of spectrum.masked) lines.push(`  masked ${Math.round(m.from)}–${Math.round(m.to)} cm-1: ${m.reason}`);
  lines.push('', 'Bands');
  const head = ['position / cm-1', 'nm', eps ? 'epsilon / L mol-1 cm-1' : 'height / A', 'FWHM / cm-1', eps ? 'f' : '', 'kind', 'assigned to'];
  // The kind an assignment gives (band-assigned-kind.ts); a stored record from an older fieldgap lacks it and gets it here.
  const computed = bandAssignedKinds(bands, result.corrections?.bands === undefined ? fit : null);
  const assignedKinds = bands.map((b, i) => (b.assignedKind !== undefined ? b.assignedKind : computed[i] ?? null));
  const rows = bands.map((b, i) => {
    const assigned = fit?.assignments.find((a) => a.bands.includes(i));
    return [
      `${Math.round(b.position)} ± ${Math.max(1, Math.round(b.positionUncertainty))}`,
      b.wavelength.toFixed(1),
      eps && b.epsilon !== null ? b.epsilon.toPrecision(3) : b.height.toPrecision(3),
      Math.round(b.fwhm).toString(),
      eps && b.oscillatorStrength !== null ? b.oscillatorStrength.toExponential(2) : '',
      `${bandKindText(b, assignedKinds[i] ?? null)}${b.shoulder ? ' (shoulder)' : ''}${b.window === undefined || b.window === 'inside' ? '' : ` (maximum ${b.window.replace(/-/g, ' ')})`}`,
      assigned ? `${fit!.groundLabel} → ${assigned.label}` : b.kind === 'charge-transfer' ? '(not fitted)' : '(unexplained)',
    ];
  });
  lines.push(...table([head, ...rows]));
  // Without ε a spectrum of only spin-forbidden bands (high-spin d5) has its strongest called d-d by relative size: no contradiction to note.
  const allForbidden = assignedKinds.every((k) => k === null || k === 'spin-forbidden');
  const differ = bands.filter((b, i) => kindsDisagree(b, assignedKinds[i] ?? null) && !(allForbidden && b.epsilon === null));
  if (differ.length > 0) {
    lines.push(`  (kind: from the assignment; by intensity and width alone the spectrum suggested ${differ.map((b) => `${b.kind} for ${Math.round(b.position)} cm-1`).join(', ')})`);
  }
  return lines;
}

/**
 * The report of an analysis that found bands but made no fit (a d0 or d10
 * ion, only charge-transfer bands, no bands): the band table, why there is
 * no fit, and the warnings.
 */
export function formatAnalysisWithoutFit(label: string, found: AnalysisWithoutFit<AnalyzeResult['spectrum']>, reason: string): string {
  const lines = bandLines(label, found, null);
  if (found.bands.length === 0) lines.push('  (none)');
  lines.push('', 'Ligand field', `  none: ${reason}`);
  if (found.warnings.length > 0) lines.push('', 'Warnings', ...found.warnings.map((w) => `  - ${w}`));
  return `${lines.join('\n')}\n`;
}

/** " (C/B fixed at 4.64)", " (fixed)", or nothing when C is fitted or not determined at all (d1, d9: no C/B to show). */
function cModeNote(fit: NonNullable<AnalyzeResult['fit']>): string {
  if (fit.cMode === 'free' || fit.c === null) return '';
  if (fit.cMode === 'fixed') return ' (fixed)';
  return fit.cOverB === null ? '' : ` (C/B fixed at ${fit.cOverB.toFixed(2)})`;
}

function table(rows: string[][]): string[] {
  return textTableLines(rows, { indent: '  ' });
}

/** "; high-spin 99%, low-spin 1%" where the ion has a choice. */
function spinStates(p: Partial<Record<string, number>>): string {
  const entries = Object.entries(p).filter(([key]) => key !== 'no-choice');
  return entries.length ? `; ${entries.map(([key, v]) => `${key} ${percentText(v ?? 0)}`).join(', ')}` : '';
}

/**
 * One line per transition fitted to several bands at once (a Jahn–Teller or
 * spin–orbit split band of a one-transition ion, read at the components'
 * centroid by src/fit). The fit's note says so in the JSON; the text report
 * prints no notes, so a chemist saw two bands labelled with one transition
 * and a 10Dq that is neither maximum (AUDIT3 finding 5). The ± of 10Dq is
 * the centroid's: the maximum is named so the reader sees the other convention.
 */
export function splitBandLines(result: Pick<AnalyzeResult, 'bands' | 'fit'>): string[] {
  const out: string[] = [];
  for (const a of result.fit.assignments) {
    const parts = a.bands.map((i) => result.bands[i]).filter((b): b is AnalyzeResult['bands'][number] => b !== undefined);
    if (parts.length < 2) continue;
    const strongest = parts.reduce((x, y) => (y.height > x.height ? y : x));
    const positions = parts.map((b) => Math.round(b.position)).sort((x, y) => x - y).join(' + ');
    out.push(`  one band    ${positions} cm-1 read as one transition (${a.label}) at their centroid ${Math.round(a.observed)} cm-1: `
      + `split components (Jahn–Teller or spin–orbit); the strongest maximum is at ${Math.round(strongest.position)} cm-1, and the ± above does not cover that choice`);
  }
  return out;
}
