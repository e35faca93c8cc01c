import { formatPlusMinus } from '../report/plus-minus.js';
import type { TetragonalFitResult } from './types.js';

const fmt = (v: number, digits = 0): string => v.toFixed(digits);
/** A value and its uncertainty (shown even when zero) at `digits`. */
const pm = (value: number, sd: number | null, digits = 0): string => formatPlusMinus(value, sd, { digits, showZero: true });

/** The readable report of `fit --symmetry tetragonal` (or `fit --zeta …`). */
export function tetragonalFitReport(r: TetragonalFitResult): string {
  const who = r.ion ? `${r.ion} (d${r.d})` : `d${r.d}`;
  const lines = [`${who} ${r.geometry}, ${r.symmetry} fit: ${r.assignments.length} band${r.assignments.length === 1 ? '' : 's'}, status ${r.status}`, ''];
  lines.push(`  10Dq = ${pm(r.tenDq, r.uncertainty.tenDq)} cm-1   (Dq = ${pm(r.dq, r.uncertainty.dq, 1)} cm-1)`);
  if (r.symmetry === 'tetragonal') {
    lines.push(`  Ds   = ${pm(r.ds, r.uncertainty.ds, 1)} cm-1`, `  Dt   = ${pm(r.dt, r.uncertainty.dt, 1)} cm-1`);
  }
  if (r.b !== null) lines.push(`  B    = ${pm(r.b, r.uncertainty.b)} cm-1   C = ${fmt(r.c!)} cm-1 (C/B = ${fmt(r.cOverB, 2)} fixed)`);
  lines.push(`  ζ    = ${pm(r.zeta, r.uncertainty.zeta)} cm-1 (${r.zetaMode}${r.freeIonZeta === null ? '' : `; free ion ${r.freeIonZeta} cm-1`})`);
  lines.push(
    `  The data fix: ${r.determined.join(', ')}`, '',
    `Ground level ${r.groundLabel}; rms residual ${fmt(r.rmsResidual, 1)} cm-1; score ${fmt(r.score, 1)} (probability ${fmt(100 * r.probability)} % among the assignments fitted)`,
    '', 'Assignment (cm-1):',
  );
  for (const a of r.assignments) lines.push(`  ${fmt(a.observed).padStart(7)}  ${fmt(a.calculated).padStart(7)}  ${fmt(a.residual).padStart(6)}  ${r.groundLabel} → ${a.label}`);
  for (const c of r.components) lines.push(`  one ${c.parent} band, split: ${c.bands.map((b) => fmt(b)).join(' + ')} (${fmt(c.splitting)} cm-1 apart in the model)`);
  for (const p of r.penalties) lines.push(`  score +${fmt(p.amount, 1)}: ${p.detail}`);
  if (r.alternatives.length) {
    lines.push('', 'Runners-up:');
    for (const alt of r.alternatives) lines.push(`  ${alt.labels.join(', ')}: rms ${fmt(alt.rmsResidual, 1)} cm-1, probability ${fmt(100 * alt.probability, 1)} %`);
  }
  if (r.warnings.length) lines.push('', ...r.warnings.map((w) => `Warning: ${w}`));
  if (r.notes.length) lines.push('', ...r.notes.map((n) => `Note: ${n}`));
  return `${lines.join('\n')}\n`;
}
