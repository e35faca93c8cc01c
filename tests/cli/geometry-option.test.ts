/** AUDIT3 finding 14: --geometry takes the point-group symbols and the solids' names as well as the two words. */
import { describe, expect, it } from 'vitest';
import { geometryOption } from '../../src/cli/geometry-option.js';
import { parseFitArgs } from '../../src/cli/commands/fit.js';
import { errorOf } from '../helpers/errors.js';

describe('geometryOption', () => {
  it.each([
    ['octahedral', 'octahedral'], ['Oh', 'octahedral'], ['OH', 'octahedral'], [' octahedron ', 'octahedral'],
    ['tetrahedral', 'tetrahedral'], ['Td', 'tetrahedral'], ['tetrahedron', 'tetrahedral'],
  ] as const)('%s → %s', (raw, geometry) => {
    expect(geometryOption(raw)).toBe(geometry);
  });

  it('absent → octahedral; an unknown word → the error naming the option and the choices', () => {
    expect(geometryOption(undefined)).toBe('octahedral');
    const e = errorOf(() => geometryOption('square'));
    expect(e.path).toBe('--geometry');
    expect(e.message).toBe('--geometry: expected one of octahedral, tetrahedral, got "square"');
  });

  it('fit --geometry Td fits a tetrahedral ion', () => {
    expect(parseFitArgs(['--ion', 'Co2+', '--geometry', 'Td', '--bands', '5500,14700']).input.geometry).toBe('tetrahedral');
  });
});
