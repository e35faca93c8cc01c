import { describe, expect, it } from 'vitest';
import { computeDiagram, computeLevels } from '../../src/ligand-field/index.js';
import { isFieldgapError } from '../../src/errors.js';

describe('computeDiagram', () => {
  it('has steps + 1 points, one line per level, the ground line at 0 at every step', () => {
    const diagram = computeDiagram(6, 'octahedral', { cOverB: 4.8, maxDqOverB: 4, steps: 80 });
    expect(diagram.dqOverB).toHaveLength(81);
    expect(diagram.dqOverB[0]).toBe(0);
    expect(diagram.dqOverB.at(-1)).toBeCloseTo(4, 12);
    expect(diagram.lines).toHaveLength(computeLevels(6, 'octahedral', { dq: 1, b: 1, c: 4.8 }).levels.length);
    for (const line of diagram.lines) expect(line.energies).toHaveLength(81);
    for (let i = 0; i <= 80; i++) expect(Math.min(...diagram.lines.map((l) => l.energies[i]!))).toBe(0);
  });

  it('kinks at the spin crossover: the ground term changes from 5T2g to 1A1g', () => {
    const diagram = computeDiagram(6, 'octahedral', { cOverB: 4.8, maxDqOverB: 4, steps: 80 });
    expect(diagram.groundTerms[0]).toBe('5T2g');
    expect(diagram.groundTerms.at(-1)).toBe('1A1g');
    const a1 = diagram.lines.find((l) => l.label === '1A1g(I)')!;
    const i = diagram.dqOverB.findIndex((x) => x >= 2.5);
    expect(a1.energies[i]).toBe(0);
  });

  it('is E/B: the same as computeLevels at any B (energies homogeneous of degree 1)', () => {
    const diagram = computeDiagram(3, 'tetrahedral', { cOverB: 4, maxDqOverB: 3, steps: 30 });
    const b = 730;
    const step = 17;
    const levels = computeLevels(3, 'tetrahedral', { dq: diagram.dqOverB[step]! * b, b, c: 4 * b }).levels;
    for (const level of levels) {
      const line = diagram.lines.find((l) => l.multiplicity === level.multiplicity && l.irrep === level.irrep && l.rank === level.rank)!;
      expect(line.label).toBe(level.label);
      expect(line.energies[step]! * b).toBeCloseTo(level.energy, 6);
    }
  });

  it('defaults: C/B 4.5, Dq/B up to 4, 200 steps', () => {
    const diagram = computeDiagram(2, 'octahedral');
    expect(diagram.cOverB).toBe(4.5);
    expect(diagram.dqOverB).toHaveLength(201);
    expect(diagram.dqOverB.at(-1)).toBeCloseTo(4, 12);
  });

  it('d10: one flat line', () => {
    const diagram = computeDiagram(10, 'octahedral', { steps: 4 });
    expect(diagram.lines).toHaveLength(1);
    expect(diagram.lines[0]!.energies).toEqual([0, 0, 0, 0, 0]);
  });

  it.each([
    [{ steps: 0 }, 'steps'],
    [{ steps: 2.5 }, 'steps'],
    [{ cOverB: -1 }, 'cOverB'],
    [{ maxDqOverB: 0 }, 'maxDqOverB'],
    [{ maxDqOverB: Number.NaN }, 'maxDqOverB'],
  ])('rejects %o naming %s', (options, path) => {
    try {
      computeDiagram(4, 'octahedral', options);
      expect.unreachable();
    } catch (error) {
      expect(isFieldgapError(error) && error.code === 'invalid-argument' && error.path === path).toBe(true);
    }
  });
});
