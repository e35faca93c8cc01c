import { describe, expect, it } from 'vitest';
import { diagramCommand } from '../../src/cli/commands/diagram.js';
import { levelsCommand } from '../../src/cli/commands/levels.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/** Runs one command line in process; main.ts's runCli finds the command by name. */
function run(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(argv);
}

describe('fieldgap levels', () => {
  it('prints the JSON contract', async () => {
    const { code, out } = await run(['levels', '--d', '6', '--geometry', 'octahedral', '--dq', '2000', '--b', '650', '--c', '3100', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(Object.keys(json).slice(0, 9)).toEqual(['d', 'geometry', 'dq', 'b', 'c', 'groundTerm', 'spinState', 'unpairedElectrons', 'levels']);
    expect(json).toMatchObject({ d: 6, geometry: 'octahedral', dq: 2000, b: 650, c: 3100, groundTerm: '1A1g', spinState: 'low-spin', unpairedElectrons: 0 });
    expect(Object.keys(json.levels[0]).slice(0, 6)).toEqual(['energy', 'term', 'multiplicity', 'irrep', 'degeneracy', 'parent']);
    expect(json.levels[0]).toMatchObject({ energy: 0, term: '1A1g', multiplicity: 1, irrep: 'A1g', degeneracy: 1, parent: '1I' });
    const energies: number[] = json.levels.map((l: { energy: number }) => l.energy);
    expect([...energies].sort((a, b) => a - b)).toEqual(energies);
  });

  it('accepts --c-over-b and defaults to octahedral', async () => {
    const a = await run(['levels', '--d', '3', '--dq', '1740', '--b', '725', '--c-over-b', '4', '--json']);
    const b = await run(['levels', '--d', '3', '--dq', '1740', '--b', '725', '--c', '2900', '--json']);
    expect(JSON.parse(a.out).levels).toEqual(JSON.parse(b.out).levels);
    expect(JSON.parse(a.out).geometry).toBe('octahedral');
  });

  it('prints a readable table with units', async () => {
    const { code, out } = await run(['levels', '--d', '3', '--dq', '1740', '--b', '725', '--c', '2900']);
    expect(code).toBe(0);
    expect(out).toMatch(/energy \/ cm-1/);
    expect(out).toMatch(/wavelength \/ nm/);
    expect(out).toMatch(/4T2g\(F\)\s+17400\s+575/);
  });

  it.each([
    [['--d', '6', '--dq', 'abc', '--b', '650', '--c', '3100'], '--dq'],
    [['--d', '6', '--dq', '-3', '--b', '650', '--c', '3100'], '--dq'],
    [['--d', '6', '--dq', '2000', '--c', '3100'], '--b'],
    [['--d', '6', '--dq', '2000', '--b', '0', '--c', '3100'], '--b'],
    [['--d', '6', '--dq', '2000', '--b', '650'], '--c'],
    [['--d', '6', '--dq', '2000', '--b', '650', '--c', '1', '--c-over-b', '4'], '--c-over-b'],
    [['--d', '11', '--dq', '2000', '--b', '650', '--c', '3100'], '--d'],
    [['--d', '6', '--dq', '2000', '--b', '650', '--c', '3100', '--geometry', 'planar'], '--geometry'],
    [['--d', '6', '--dq', '2000', '--b', '650', '--c', '3100', '--nope'], '--nope'],
  ])('bad input %j: exit 2, one line naming %s', async (args, option) => {
    const { code, out, err } = await run(['levels', ...args]);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(err).toContain(option);
    expect(err).not.toMatch(/at .*\.ts:\d+/);
  });

  it('--help lists the options', async () => {
    const { code, out } = await run(['levels', '--help']);
    expect(code).toBe(0);
    expect(out).toBe(levelsCommand.usage);
    expect(out).toMatch(/--c-over-b/);
  });
});

describe('fieldgap diagram', () => {
  it('--json: per step Dq/B, ground term, and E/B with term for each line', async () => {
    const { code, out } = await run(['diagram', '--d', '6', '--geometry', 'octahedral', '--c-over-b', '4.8', '--max-dq-over-b', '4', '--steps', '200', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json.dqOverB).toHaveLength(201);
    expect(json.groundTerms).toHaveLength(201);
    expect(json.crossoverDqOverB).toBeCloseTo(2.0, 1); // Tanabe & Sugano (1954) d6 diagram, from memory
    for (const line of json.lines) {
      expect(line.energies).toHaveLength(201);
      expect(typeof line.term).toBe('string');
      expect(typeof line.label).toBe('string');
    }
  });

  it('--csv: a header and steps + 1 rows with one column per line', async () => {
    const { code, out } = await run(['diagram', '--d', '2', '--steps', '10', '--csv']);
    expect(code).toBe(0);
    const rows = out.trimEnd().split('\n');
    expect(rows).toHaveLength(12);
    const header = rows[0]!.split(',');
    expect(header.slice(0, 2)).toEqual(['dq_over_b', 'ground_term']);
    expect(new Set(header).size).toBe(header.length);
    for (const row of rows.slice(1)) expect(row.split(',')).toHaveLength(header.length);
  });

  it('table by default; --help states the defaults', async () => {
    const { code, out } = await run(['diagram', '--d', '5']);
    expect(code).toBe(0);
    expect(out).toMatch(/6A1g\(S\)/);
    expect(diagramCommand.usage).toMatch(/default 4\.5/);
    expect(diagramCommand.usage).toMatch(/default 200/);
    expect(diagramCommand.usage).toMatch(/default 4\)/);
  });

  it.each([
    [['--d', '5', '--steps', '0'], '--steps'],
    [['--d', '5', '--max-dq-over-b', '-2'], '--max-dq-over-b'],
    [['--d', '5', '--json', '--csv'], '--csv'],
    [['--steps', '10'], '--d'],
  ])('bad input %j: exit 2, one line naming %s', async (args, option) => {
    const { code, err } = await run(['diagram', ...args]);
    expect(code).toBe(2);
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(err).toContain(option);
  });
});
