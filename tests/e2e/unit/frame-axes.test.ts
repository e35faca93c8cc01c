import { describe, expect, it } from 'vitest';
import { sameAxes } from '../../../web/plots/frame.js';
import type { PlotSpec } from '../../../web/plots/spec.js';

const spec = (patch: Partial<PlotSpec> = {}): PlotSpec => ({
  title: 't', xLabel: 'wavenumber / cm⁻¹', yLabel: 'absorbance', x: [1, 2, 3], ys: [[0, 1, 0]],
  series: [{ label: 'measured', color: '#111', width: 1 }], marks: [], ...patch,
});

describe('sameAxes: when PlotFrame.update may keep the chart', () => {
  it('keeps the chart for new data, new series looks and new marks on the same axes', () => {
    expect(sameAxes(spec(), spec({ x: [5, 6], ys: [[1, 2], [3, 4]], series: [{ label: 'a', color: '#f00', width: 2 }, { label: 'b', color: '#0f0', width: 1, dash: [3, 3] }], marks: [{ kind: 'vline', x: 5, color: '#000' }] }))).toBe(true);
    expect(sameAxes(spec({ xRange: [0, 10] }), spec({ xRange: [0, 20] }))).toBe(true);
  });

  it('asks for a new chart when the x unit, y label, ticks, fixed range or legend change', () => {
    expect(sameAxes(spec(), spec({ xLabel: 'wavelength / nm' }))).toBe(false);
    expect(sameAxes(spec(), spec({ yLabel: 'ε / L mol⁻¹ cm⁻¹' }))).toBe(false);
    expect(sameAxes(spec(), spec({ xTicks: [{ value: 1, label: 'Γ' }] }))).toBe(false);
    expect(sameAxes(spec(), spec({ xRange: [0, 10] }))).toBe(false);
    expect(sameAxes(spec(), spec({ series: [{ label: 'measured', color: '#111', width: 1, quiet: true }] }))).toBe(false);
  });
});
