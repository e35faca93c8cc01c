import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { rankingSpec } from '../../../web/plots/series-spec.js';
import { seriesCsv } from '../../../web/views/series.js';
import type { Ranking, SeriesReport } from '../../../web/types.js';

const ranking = (kind: Ranking['kind'], values: number[]): Ranking => ({
  kind,
  quantity: kind === 'spectrochemical' ? '10Dq / cm-1' : '1 - beta',
  criterion: 'one-sigma',
  entries: values.map((value, i) => ({ position: i + 1, index: i, sample: `s${i}`, ligandLabel: `L${i}`, value, uncertainty: 0.01 * value, overlapsNext: false })),
  overlaps: [],
  series: 'L0 < L1',
  skipped: [],
});

describe('series plots and CSV', () => {
  it('plots one point per ranked analysis with its error bar, ligands as the x labels', () => {
    const spec = rankingSpec(ranking('spectrochemical', [17_000, 21_000]));
    expect(spec.x).toEqual([1, 2]);
    expect(spec.ys[0]).toEqual([17_000, 21_000]);
    expect(spec.xTicks?.map((t) => t.label)).toEqual(['L0', 'L1']);
    expect(spec.marks).toEqual([
      { kind: 'errorbar', x: 1, low: 16_830, high: 17_170, color: expect.any(String) },
      { kind: 'errorbar', x: 2, low: 20_790, high: 21_210, color: expect.any(String) },
    ]);
    expect(spec.yRange![0]).toBeLessThan(16_830);
    expect(spec.yRange![1]).toBeGreaterThan(21_210);
  });

  it('shows β itself for the nephelauxetic ranking, which holds 1 − β', () => {
    const spec = rankingSpec(ranking('nephelauxetic', [0.2, 0.3]));
    expect(spec.ys[0]![0]).toBeCloseTo(0.8, 12);
    expect(spec.ys[0]![1]).toBeCloseTo(0.7, 12);
    expect(spec.yLabel).toBe('β');
  });

  it('CSV lists both rankings', () => {
    const report: SeriesReport = { ion: 'Cr3+', count: 2, spectrochemical: ranking('spectrochemical', [1, 2]), nephelauxetic: ranking('nephelauxetic', [0.1, 0.2]), factors: null, skipped: [], notes: [] };
    const rows = Papa.parse<string[]>(seriesCsv(report).trim()).data;
    expect(rows).toHaveLength(5);
    expect(rows[1]!.slice(0, 4)).toEqual(['spectrochemical', '1', 's0', 'L0']);
    expect(rows[3]![0]).toBe('nephelauxetic');
  });
});
