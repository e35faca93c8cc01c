/**
 * A ranking of the library's analyses as a PlotSpec: one point per analysis
 * in ranked order (weakest first), with its one-standard-deviation error
 * bar; 10Dq in cm-1 for the spectrochemical ranking, β = 1 − (1 − β) for
 * the nephelauxetic one.
 */
import type { Ranking } from '../types.js';
import type { Mark, PlotSpec } from './spec.js';

export function rankingSpec(ranking: Ranking): PlotSpec {
  const beta = ranking.kind === 'nephelauxetic';
  const x = ranking.entries.map((_, i) => i + 1);
  const values = ranking.entries.map((e) => (beta ? 1 - e.value : e.value));
  const color = beta ? '#0e7490' : '#1f5fa8';
  const marks: Mark[] = ranking.entries.map((e, i) => ({ kind: 'errorbar', x: i + 1, low: values[i]! - e.uncertainty, high: values[i]! + e.uncertainty, color }));
  let lo = Infinity;
  let hi = -Infinity;
  ranking.entries.forEach((e, i) => {
    lo = Math.min(lo, values[i]! - e.uncertainty);
    hi = Math.max(hi, values[i]! + e.uncertainty);
  });
  if (!(hi > lo)) {
    lo = (values[0] ?? 0) - 1;
    hi = (values[0] ?? 0) + 1;
  }
  const pad = (hi - lo) * 0.12;
  return {
    title: beta ? 'β per ligand (1 σ error bars)' : '10Dq per ligand (1 σ error bars)',
    xLabel: beta ? 'ligand, most nephelauxetic last' : 'ligand, weakest field first',
    yLabel: beta ? 'β' : '10Dq / cm⁻¹',
    x,
    ys: [values],
    series: [{ label: beta ? 'β' : '10Dq', color, width: 1, pointsOnly: true, quiet: true }],
    marks,
    yRange: [lo - pad, hi + pad],
    xRange: [0.5, ranking.entries.length + 0.5],
    xTicks: ranking.entries.map((e, i) => ({ value: i + 1, label: e.ligandLabel })),
  };
}
