import { describe, expect, it } from 'vitest';
import { niceStep, niceTicks } from '../../../web/plots/ticks.js';
import { svgFromSpec } from '../../../web/plots/svg.js';
import type { PlotSpec } from '../../../web/plots/spec.js';
import { dataRange } from '../../../web/plots/spec.js';

describe('axis ticks for the SVG download', () => {
  it('are round multiples of one step inside the range', () => {
    const ticks = niceTicks(8123, 31_877, 8);
    const step = niceStep(31_877 - 8123, 8);
    expect([1, 2, 2.5, 5].map((m) => m * 10 ** Math.floor(Math.log10(step)))).toContain(step);
    expect(ticks[0]).toBeGreaterThanOrEqual(8123);
    expect(ticks[ticks.length - 1]).toBeLessThanOrEqual(31_877);
    for (let i = 1; i < ticks.length; i++) expect(ticks[i]! - ticks[i - 1]!).toBeCloseTo(step, 9);
    for (const t of ticks) expect(Math.abs(t / step - Math.round(t / step))).toBeLessThan(1e-9);
  });

  it('are empty for an empty or reversed range', () => {
    expect(niceTicks(5, 5)).toEqual([]);
    expect(niceTicks(6, 5)).toEqual([]);
  });
});

describe('svgFromSpec', () => {
  const spec: PlotSpec = {
    title: 'A & B <test>',
    xLabel: 'wavenumber / cm⁻¹',
    yLabel: 'absorbance',
    x: [10_000, 15_000, 20_000, 25_000],
    ys: [
      [0.1, 0.5, null, 0.2],
      [0.3, 0.3, 0.3, 0.3],
    ],
    series: [
      { label: 'measured', color: '#111', width: 1.5 },
      { label: 'points', color: '#a00', width: 1, pointsOnly: true },
    ],
    marks: [
      { kind: 'text', x: 15_000, y: 0.5, text: '3T1g(F)', color: '#000' },
      { kind: 'vline', x: 12_000, color: '#b00', text: 'Dq/B = 1.2' },
    ],
  };

  it('draws each line segment between gaps, the markers and the marks, with text escaped', () => {
    const svg = svgFromSpec(spec, { xRange: [10_000, 25_000], yRange: [0, 1] });
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg.trim().endsWith('</svg>')).toBe(true);
    // The null splits the measured line into one 2-point polyline (the lone last point draws nothing).
    expect(svg.match(/<polyline/g)?.length).toBe(1);
    expect(svg.match(/<circle cx=/g)?.length).toBe(4);
    expect(svg).toContain('A &amp; B &lt;test&gt;');
    expect(svg).toContain('>3T1g(F)</text>');
    expect(svg).toContain('Dq/B = 1.2');
  });

  it('maps the x range onto the plot width', () => {
    const svg = svgFromSpec(spec, { xRange: [10_000, 25_000], yRange: [0, 1], width: 900 });
    const first = /<polyline[^>]*points="([\d.]+),/.exec(svg);
    expect(Number(first?.[1])).toBeCloseTo(72, 1); // the left margin
  });

  it('dataRange ignores gaps and widens a flat range', () => {
    expect(dataRange([[1, null, 3], [Number.NaN, 2]])).toEqual([1, 3]);
    expect(dataRange([[2, 2]])).toEqual([1, 3]);
    expect(dataRange([[]])).toEqual([0, 1]);
  });
});
