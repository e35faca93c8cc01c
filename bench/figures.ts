/**
 * The figures a bench run measures, collected so run.ts can print them beside
 * the previous release's (bench/baseline.json) with the ratio, and flag the
 * ones that got worse. A figure's key is stable across releases; its label
 * says what it is and in which unit.
 */
export interface Figure {
  /** Stable name, the key in baseline.json: "startup.help.ms". */
  key: string;
  label: string;
  value: number;
  unit: string;
  /** Which way is better: "lower" (times, memory) or "higher" (rates). */
  better: 'lower' | 'higher';
}

export interface Baseline {
  release: string;
  measured: string;
  figures: Record<string, number>;
}

const figures: Figure[] = [];

/** Records a figure for the comparison table. */
export function reportFigure(figure: Figure): void {
  figures.push(figure);
}

export function reportedFigures(): readonly Figure[] {
  return figures;
}

/** Worse than the baseline by more than this factor is flagged. */
export const REGRESSION_FACTOR = 1.2;

function format(value: number): string {
  const abs = Math.abs(value);
  return abs >= 100 ? value.toFixed(0) : abs >= 10 ? value.toFixed(1) : value.toFixed(2);
}

/**
 * The comparison table: each figure, the previous release's value, this
 * run's, and new/old; "WORSE" where the change goes the wrong way by more
 * than REGRESSION_FACTOR, "better" where it goes the right way by as much.
 */
export function comparisonTable(current: readonly Figure[], baseline: Baseline): string {
  const rows = current.map((f) => {
    const old = baseline.figures[f.key];
    const ratio = old === undefined || old === 0 ? undefined : f.value / old;
    const gain = ratio === undefined ? undefined : f.better === 'lower' ? 1 / ratio : ratio;
    const mark = gain === undefined ? '' : gain < 1 / REGRESSION_FACTOR ? 'WORSE' : gain > REGRESSION_FACTOR ? 'better' : '';
    return [`${f.label} (${f.unit})`, old === undefined ? '–' : format(old), format(f.value), ratio === undefined ? '' : `${ratio.toFixed(2)}×`, mark];
  });
  const head = ['figure', 'previous', 'now', 'now/prev', ''];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 || i === 4 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ').trimEnd();
  return [`previous: ${baseline.release}, measured ${baseline.measured}`, line(head), ...rows.map(line)].join('\n');
}
