/**
 * The Levels tab's diagram spec: the axis it names, a path run downwards
 * (negative Ds or Dt) drawn ascending, the lowest lines named at the chosen
 * end. Inputs are hand-made documents of the service's shape (no outside
 * values involved: this checks the drawing, not the physics).
 */
import { describe, expect, it } from 'vitest';
import { levelDiagramAxis, levelDiagramSpec, type FieldDiagramAnswer } from '../../../web/plots/level-diagram-spec.js';

function doc(partial: Partial<FieldDiagramAnswer>): FieldDiagramAnswer {
  return {
    d: 9, geometry: 'octahedral', axis: 'distortion', b: 1000, cOverB: 4, steps: 2,
    dq: [1200, 1200, 1200], ds: [0, 750, 1500], dt: [0, 150, 300], zeta: [0, 0, 0], x: [0, 0.75, 1.5], groundTerms: ['2Eg', '2B1g', '2B1g'],
    lines: [
      { label: 'A', term: '2B1g', parent: '2Eg(D)', degeneracy: 2, energies: [0, 0, 0] },
      { label: 'B', term: '2A1g', parent: '2Eg(D)', degeneracy: 2, energies: [0, 3, 6] },
      { label: 'C', term: '2Eg', parent: '2T2g(D)', degeneracy: 4, energies: [12, 12.5, 13] },
    ],
    ...partial,
  };
}

describe('level diagram spec', () => {
  it('names the axis: Ds/B with Dt/Ds, Dt/B when Ds is 0, ζ/B and Dq/B', () => {
    expect(levelDiagramAxis(doc({})).label).toBe('Ds/B (Dt/Ds = 0.20 fixed)');
    const dtOnly = levelDiagramAxis(doc({ ds: [0, 0, 0], x: [0, 0, 0] }));
    expect(dtOnly.label).toBe('Dt/B (Ds = 0)');
    expect(dtOnly.x).toEqual([0, 0.15, 0.3]);
    expect(levelDiagramAxis(doc({ axis: 'zeta' })).label).toBe('ζ/B');
    expect(levelDiagramAxis(doc({ axis: 'dq' })).label).toBe('Dq/B');
  });

  it('draws a path that runs downwards in ascending x, each line reversed with it', () => {
    const spec = levelDiagramSpec(doc({ ds: [0, -750, -1500], dt: [0, -150, -300], x: [0, -0.75, -1.5] }), 1200);
    expect(spec.x).toEqual([-1.5, -0.75, 0]);
    expect(spec.ys[1]).toEqual([6, 3, 0]);
    // The chosen parameters are now at the left edge, where the names go.
    const texts = spec.marks.filter((m) => m.kind === 'text');
    expect(texts.every((m) => m.kind === 'text' && m.x === -1.5)).toBe(true);
  });

  it('names the lines at the chosen end, lowest first, and marks the chosen Dq only on the Dq axis', () => {
    const spec = levelDiagramSpec(doc({}), 1200);
    expect(spec.marks.filter((m) => m.kind === 'text').map((m) => (m.kind === 'text' ? m.text : ''))).toEqual(['2B1g', '2A1g', '2Eg']);
    expect(spec.marks.some((m) => m.kind === 'vline')).toBe(false);
    const onDq = levelDiagramSpec(doc({ axis: 'dq', x: [0, 1, 2] }), 1200);
    expect(onDq.marks.find((m) => m.kind === 'vline')).toMatchObject({ x: 1.2 });
  });
});
