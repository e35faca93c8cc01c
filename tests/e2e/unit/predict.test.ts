import { describe, expect, it } from 'vitest';
import { predictComplex } from '../../../src/series/predict.js';
import { orbitalSetName, predictBody, spinHeadline } from '../../../web/views/predict.js';

describe('Predict view helpers', () => {
  it('sends only what the user chose', () => {
    expect(predictBody({ formula: ' [Fe(CN)6]4- ', geometry: '', library: false })).toEqual({ formula: '[Fe(CN)6]4-' });
    expect(predictBody({ formula: '[NiCl4]2-', geometry: 'square-planar', library: true })).toEqual({ formula: '[NiCl4]2-', geometry: 'square-planar', library: true });
  });

  it('headlines the spin state with the rule, the probability or borderline', () => {
    expect(spinHeadline(predictComplex('[Fe(CN)6]4-'))).toBe('low-spin (by a rule of the trade)');
    expect(spinHeadline(predictComplex('[Ni(NH3)6]2+'))).toBe('no high/low-spin choice');
    expect(spinHeadline(predictComplex('[Co(NH3)6]3+'))).toBe('low-spin, P > 0.99');
    expect(spinHeadline(predictComplex('[Fe(edta)]-'))).toMatch(/^borderline: high-spin, P = 0\.\d\d$/);
  });

  it('prints orbital names with superscripts', () => {
    expect(['x2-y2', 'xy', 'z2', 'xz,yz', 't2g'].map(orbitalSetName)).toEqual(['x²−y²', 'xy', 'z²', 'xz,yz', 't2g']);
  });
});
