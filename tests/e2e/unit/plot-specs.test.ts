import { describe, expect, it } from 'vitest';
import type { EditableBand } from '../../../web/state.js';
import type { Assignment, Curves, Diagram } from '../../../web/types.js';
import { assignmentForBand, axisValues, bandCaption, overlaySpec, residualSpec, spectrumSpec } from '../../../web/plots/spectrum-spec.js';
import { diagramRangeFor, diagramSpec, multiplicityOf, nearestIndex } from '../../../web/plots/diagram-spec.js';

const band = (position: number, patch: Partial<EditableBand> = {}): EditableBand => ({
  position, uncertainty: null, epsilon: null, width: null, kind: 'd-d', shoulder: false, included: true, origin: 'found', sourceIndex: null, ...patch,
});

const curves: Curves = {
  grid: [10_000, 12_500, 15_000, 17_500, 20_000],
  signal: [0.1, 0.4, 0.2, 0.5, 0.15],
  baseline: [0.05, 0.05, 0.05, 0.05, 0.05],
  model: [0.09, 0.39, 0.21, 0.51, 0.15],
  components: [
    [0.04, 0.34, 0.1, 0.01, 0],
    [0, 0, 0.06, 0.45, 0.1],
  ],
};

const assignments: Assignment[] = [
  { observed: 12_500, calculated: 12_480, term: '3T2g', parent: '3F' },
  { observed: 17_500, calculated: 17_530, term: '3T1g', parent: '3F' },
];

describe('spectrum plot data', () => {
  it('keeps x ascending in both units and carries each y with its own x', () => {
    const { x, order } = axisValues(curves.grid, 'nm');
    expect(x[0]).toBeCloseTo(500, 9); // common practice: 10^7 / 20000 cm-1
    for (let i = 1; i < x.length; i++) expect(x[i]!).toBeGreaterThan(x[i - 1]!);
    const spec = spectrumSpec({ title: 't', curves, signalUnit: 'absorbance', bands: [], assignments, masked: [], unit: 'nm' });
    order.forEach((source, k) => expect(spec.ys[0]![k]).toBe(curves.signal[source]));
    expect(spec.xLabel).toMatch(/nm/);
  });

  it('draws each fitted band on top of the baseline, and the model as the sum', () => {
    const spec = spectrumSpec({ title: 't', curves, signalUnit: undefined, bands: [], assignments, masked: [], unit: 'cm-1' });
    const labels = spec.series.map((s) => s.label);
    expect(labels).toEqual(['measured', 'baseline', 'band 1', 'band 2', 'sum of bands']);
    const sum = spec.ys[4]!;
    sum.forEach((v, k) => expect(v).toBe(curves.model![k]));
    expect(spec.ys[2]![1]).toBeCloseTo(0.34 + 0.05, 12);
  });

  it('labels bands with their assignment and greys out removed or charge-transfer bands', () => {
    const bands = [band(12_500, { sourceIndex: 0 }), band(17_500, { sourceIndex: 1, kind: 'charge-transfer' })];
    const spec = spectrumSpec({ title: 't', curves, signalUnit: undefined, bands, assignments, masked: [{ from: 19_000, to: 20_000, reason: 'detector change' }], unit: 'cm-1' });
    const texts = spec.marks.flatMap((m) => (m.kind === 'text' ? [m.text] : []));
    expect(texts).toEqual(['3T2g(F)', 'charge transfer']);
    expect(spec.series[3]!.dash).toBeDefined();
    expect(spec.marks.some((m) => m.kind === 'shade' && m.text === 'detector change')).toBe(true);
  });

  it('matches a band to an assignment only within 1 cm-1', () => {
    expect(assignmentForBand(12_500.8, assignments)?.term).toBe('3T2g');
    expect(assignmentForBand(12_502, assignments)).toBeUndefined();
    expect(bandCaption(band(12_502), assignments)).toBe('unassigned');
    expect(bandCaption(band(12_500, { included: false }), assignments)).toBe('removed');
    expect(bandCaption(band(17_500, { kind: 'spin-forbidden' }), assignments)).toBe('3T1g(F) (spin-forbidden)');
  });

  it('names an assigned band by its transition when the fit is given: a weak quartet of high-spin Co(II) is two-electron, not spin-forbidden', () => {
    // d7 octahedral from 4T1g(F): 4A2g(F) is a quartet, spin-allowed, reached by moving two electrons (t2g^5 eg^2 → t2g^3 eg^4;
    // common practice); 4T1g(P) is the one-electron band; a doublet is spin-forbidden. The band's own kind (here the
    // spectrum's "spin-forbidden" by intensity) no longer names it once the fit has assigned it.
    const fit = { d: 7, geometry: 'octahedral' as const, groundTerm: '4T1g', cOverB: 4.5 };
    const rows: Assignment[] = [
      { observed: 15_579, calculated: 15_579, term: '4A2g', label: '4A2g(F)', spinAllowed: true, multiplicity: 4 },
      { observed: 19_912, calculated: 19_912, term: '4T1g', label: '4T1g(P)', spinAllowed: true, multiplicity: 4 },
      { observed: 21_500, calculated: 21_500, term: '2T1g', label: '2T1g', spinAllowed: false, multiplicity: 2 },
    ];
    expect(bandCaption(band(15_579, { kind: 'spin-forbidden' }), rows, fit)).toBe('4A2g(F) (two-electron, weak)');
    expect(bandCaption(band(19_912), rows, fit)).toBe('4T1g(P)');
    expect(bandCaption(band(21_500), rows, fit)).toBe('2T1g (spin-forbidden)');
    // Without the fit (or from an older service without the spin fields): the band's own kind, as before.
    expect(bandCaption(band(15_579, { kind: 'spin-forbidden' }), rows)).toBe('4A2g(F) (spin-forbidden)');
  });

  it('names both components of a split pair by the assignment of the pair, and nothing beyond half the split limit', () => {
    // One 3T1g(F) read from two maxima 1 622 cm-1 apart, observed at their mean (the fit's split-band reading).
    const pair = [{ observed: 14_333, calculated: 14_333, term: '3T1g', parent: '3F', label: '3T1g(F)', bands: [0, 1] }];
    expect(bandCaption(band(13_522), pair)).toBe('3T1g(F)');
    expect(bandCaption(band(15_144), pair)).toBe('3T1g(F)');
    // 1 200 cm-1 from the mean is beyond half of the 2 000 cm-1 limit: not a component of that pair.
    expect(bandCaption(band(13_133), pair)).toBe('unassigned');
    // A single-band assignment is matched within 1 cm-1 only, as before.
    expect(bandCaption(band(13_522), [{ ...pair[0]!, bands: [0] }])).toBe('unassigned');
  });

  it('residuals are measured minus the model, with gaps where the data are masked', () => {
    const spec = residualSpec('r', curves, 'cm-1', 'absorbance');
    expect(spec).not.toBeNull();
    spec!.ys[0]!.forEach((v, k) => expect(v).toBeCloseTo(curves.signal[k]! - curves.model![k]!, 12));
    const masked = residualSpec('r', { ...curves, signal: [null, ...curves.signal.slice(1)] }, 'cm-1', 'epsilon');
    expect(masked!.ys[0]![0]).toBeNull();
    expect(masked!.yLabel).toMatch(/ε/);
    expect(residualSpec('r', { grid: [1, 2], signal: [1, 2] }, 'cm-1', '')).toBeNull();
  });

  it('overlays spectra each scaled to its own maximum, blank outside its range', () => {
    const other: Curves = { grid: [15_000, 20_000], signal: [2, 4] };
    const spec = overlaySpec([{ name: 'a', curves }, { name: 'b', curves: other }], 'cm-1');
    expect(Math.max(...(spec.ys[0]!.filter((v) => v !== null) as number[]))).toBeCloseTo(1, 12);
    expect(spec.ys[1]![0]).toBeNull();
    expect(spec.ys[1]![spec.x.indexOf(20_000)]).toBeCloseTo(1, 12);
    expect(spec.ys[1]![spec.x.indexOf(17_500)]).toBeCloseTo(0.75, 12);
  });
});

describe('energy-level diagram data', () => {
  const diagram: Diagram = {
    d: 8,
    geometry: 'octahedral',
    cOverB: 4.5,
    dqOverB: [0, 0.5, 1, 1.5, 2],
    groundTerms: ['3A2g', '3A2g', '3A2g', '3A2g', '3A2g'],
    lines: [
      { label: '3A2g(F)', term: '3A2g', parent: '3F', multiplicity: 3, irrep: 'A2g', rank: 0, energies: [0, 0, 0, 0, 0] },
      { label: '3T2g(F)', term: '3T2g', parent: '3F', multiplicity: 3, irrep: 'T2g', rank: 0, energies: [0, 5, 10, 15, 20] },
      { label: '1Eg(D)', term: '1Eg', parent: '1D', multiplicity: 1, irrep: 'Eg', rank: 0, energies: [12, 13, 14, 15, 16] },
    ],
  };

  it('puts each observed band at the fitted Dq/B and E/B = observed / B', () => {
    const spec = diagramSpec({ diagram, dqOverB: 1.1, b: 800, assignments: [{ observed: 8800, calculated: 8790, term: '3T2g', parent: '3F' }] });
    const point = spec.marks.find((m) => m.kind === 'point');
    expect(point).toMatchObject({ x: 1.1, y: 11, text: '3T2g(F)' });
    expect(spec.marks.some((m) => m.kind === 'vline' && m.x === 1.1)).toBe(true);
    // Ground-spin levels strong and labelled; the singlet faint and unlabelled.
    expect(spec.series[2]!.width).toBeLessThan(spec.series[1]!.width);
    expect(spec.marks.filter((m) => m.kind === 'text').map((m) => (m.kind === 'text' ? m.text : ''))).toEqual(['3A2g(F)', '3T2g(F)']);
  });

  it('helpers', () => {
    expect(multiplicityOf('4T1g')).toBe(4);
    expect(multiplicityOf('')).toBe(0);
    expect(nearestIndex([0, 1, 2, 3], 1.6)).toBe(2);
    expect(diagramRangeFor(1.1)).toBe(2);
    expect(diagramRangeFor(2.9)).toBe(5);
    expect(diagramRangeFor(Number.NaN)).toBe(4);
  });
});
