import { describe, expect, it } from 'vitest';
import { computeLevels, crossoverDqOverB, freeIonTerms } from '../../src/ligand-field/index.js';
import type { FieldParameters, Geometry } from '../../src/ligand-field/types.js';
import { errorOf as caught } from '../helpers/errors.js';


const ok: FieldParameters = { dq: 1000, b: 800, c: 3200 };

describe('input checks name the parameter', () => {
  it.each([
    [() => computeLevels(11, 'octahedral', ok), 'd'],
    [() => computeLevels(2.5, 'octahedral', ok), 'd'],
    [() => computeLevels(3, 'square-planar' as Geometry, ok), 'geometry'],
    [() => computeLevels(3, 'octahedral', { ...ok, dq: -1 }), 'dq'],
    [() => computeLevels(3, 'octahedral', { ...ok, dq: Number.NaN }), 'dq'],
    [() => computeLevels(3, 'octahedral', { ...ok, b: 0 }), 'b'],
    [() => computeLevels(3, 'octahedral', { ...ok, b: Infinity }), 'b'],
    [() => computeLevels(3, 'octahedral', { ...ok, c: -5 }), 'c'],
    [() => freeIonTerms(3, -1, 3000), 'b'],
    [() => crossoverDqOverB(5, 'octahedral', Number.NaN), 'cOverB'],
  ])('case %#', (run, path) => {
    const error = caught(run);
    expect(error.code).toBe('invalid-argument');
    expect(error.path).toBe(path);
  });

  it('pins one message', () => {
    expect(caught(() => computeLevels(3, 'octahedral', { ...ok, b: 0 })).message).toBe('b must be greater than 0 cm-1, got 0');
  });

  it('d0 gives one level and a note, not an error', () => {
    const result = computeLevels(0, 'tetrahedral', ok);
    expect(result.levels.map((l) => l.label)).toEqual(['1A1(S)']);
    expect(result.notes[0]).toMatch(/no ligand-field transitions/);
    expect(result.groundTerm).toBe('1A1');
  });
});
