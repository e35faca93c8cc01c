import { describe, expect, it } from 'vitest';
import { runCliCaptured } from '../helpers/cli-run.js';

function run(...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(['predict', ...argv]);
}

describe('fieldgap predict', () => {
  it('--json carries the contract fields, each estimate marked', async () => {
    const { code, out, err } = await run('[Co(NH3)6]3+', '--json');
    expect(code).toBe(0);
    expect(err).toBe('');
    const doc = JSON.parse(out);
    expect(Object.keys(doc).slice(0, 9)).toEqual(['ion', 'd', 'oxidationState', 'ligands', 'tenDq', 'b', 'spinState', 'unpairedElectrons', 'spinOnlyMoment']);
    expect(doc.ion).toBe('Co3+');
    expect(doc.d).toBe(6);
    expect(doc.oxidationState).toBe(3);
    expect(doc.ligands[0]).toMatchObject({ key: 'NH3', count: 6 });
    for (const key of ['tenDq', 'b', 'spinState', 'unpairedElectrons', 'spinOnlyMoment']) {
      expect(doc[key].estimate, key).toBe(true);
      expect(typeof doc[key].method, key).toBe('string');
    }
    expect(doc.tenDq).toMatchObject({ value: 22750, unit: 'cm-1' }); // 1.25 × 18200: Jørgensen (1971), pp. 347–348
    expect(doc.b.value).toBe(561); // (1 − 1.4 × 0.35) × 1100, float noise trimmed
    expect(doc.spinDecision).toMatchObject({ state: 'low-spin', decidedBy: 'numbers', borderline: false });
    expect(doc.occupation.configuration).toBe('t2g^6 eg^0');
    expect(doc.lfse.deltaUnits).toBeCloseTo(-2.4, 12); // common practice: low-spin d6
    expect(doc.spinState.value).toBe('low-spin');
  });

  it('prints a readable report with units', async () => {
    const { code, out } = await run('[Ni(NH3)6]Cl2');
    expect(code).toBe(0);
    expect(out).toMatch(/^\[Ni\(NH3\)6\]2\+: nickel\(II\), Ni2\+, d8/);
    expect(out).toMatch(/10Dq\s+10875 cm-1 \(920 nm\)/);
    expect(out).toMatch(/spin-only moment\s+2\.83 μB/);
    expect(out).toMatch(/not measurements/);
  });

  it('reads an unquoted "CoCl4 2-" and user factors', async () => {
    expect((await run('CoCl4', '2-')).out).toMatch(/^\[CoCl4\]2-: cobalt\(II\)/);
    const own = JSON.parse((await run('[Co(H2O)6]2+', '--k', '0.2', '--h', 'aqua=1', '--f', 'H2O=1.1', '--json')).out);
    expect(own.tenDq.value).toBeCloseTo(9900, 9);
    expect(own.spinState.value).toBe('high-spin');
  });

  it('errors: exit 2, one line', async () => {
    for (const argv of [['[Co(xyz)6]3+'], [], ['[Ag(NH3)2]+'], ['[CoCl4]2-', '--geometry', 'square'], ['[CoCl4]2-', '--data', 'x'], ['[CoCl4]2-', '--f', 'Cl'], ['[CoCl4]2-', '--k', '2']]) {
      const { code, out, err } = await run(...argv);
      expect(code, argv.join(' ')).toBe(2);
      expect(out).toBe('');
      expect(err.trim().split('\n'), argv.join(' ')).toHaveLength(1);
      expect(err).toMatch(/^fieldgap predict: /);
    }
    expect((await run('[Co(xyz)6]3+')).err).toBe('fieldgap predict: formula: unknown ligand "xyz" (character 5 of "[Co(xyz)6]3+")\n');
  });

  it('the table fits an 80-column terminal for every textbook complex', async () => {
    for (const formula of ['[Co(NH3)6]3+', 'K3[CoF6]', '[Fe(phen)3]2+', '[Ni(CN)4]2-', '[Cu(en)2(H2O)2]2+', '[Fe(edta)]-', '[Co(en)2Cl2]+', 'Cr(CO)6']) {
      const { code, out } = await run(formula);
      expect(code, formula).toBe(0);
      for (const line of out.split('\n')) expect([...line].length, `${formula}: ${line}`).toBeLessThanOrEqual(80);
    }
  });

  it('shows why: the orbital boxes with arrows, 10Dq beside the crossover and Π, the rule that decided', async () => {
    const co = (await run('[Co(NH3)6]3+')).out;
    expect(co).toMatch(/t2g\s+\[↑↓\]\[↑↓\]\[↑↓\]/);
    expect(co).toMatch(/eg\s+\[  \]\[  \]/);
    expect(co).toMatch(/crossover\s+█+\s+\d+/);
    expect(co).toMatch(/Π 2\.5B \+ 4C/);
    const ni = (await run('[Ni(CN)4]2-')).out;
    expect(ni).toMatch(/Geometry: square-planar \(rule: four-coordinate d8 with strong-field ligands/);
    expect(ni).toMatch(/x2-y2\s+\[  \]/);
    const fe = (await run('[Fe(H2O)6]2+', '--geometry', 'octahedral')).out;
    expect(fe).toMatch(/spin state\s+high-spin \(by rule/);
    expect(fe).toMatch(/orbital contribution expected/);
  });

  it('--vs: two complexes side by side in 80 columns, and as JSON', async () => {
    const { code, out } = await run('[Fe(H2O)6]2+', '--vs', '[Fe(CN)6]4-');
    expect(code).toBe(0);
    for (const line of out.split('\n')) expect([...line].length, line).toBeLessThanOrEqual(80);
    expect(out).toMatch(/unpaired electrons\s+4\s+0\n/); // common practice: high-spin vs low-spin Fe(II)
    expect(out).toMatch(/spin state\s+high-spin\s+low-spin\n/); // common practice
    expect(out).toMatch(/t2g\s+\[↑↓\]\[↑ \]\[↑ \]\s+t2g\s+\[↑↓\]\[↑↓\]\[↑↓\]/);
    expect(out).toMatch(/Rule B: cyanide and CO are strong-field ligands/);
    const doc = JSON.parse((await run('[NiCl4]2-', '--vs', '[Ni(CN)4]2-', '--json')).out);
    expect(doc.complexes.map((c: { geometry: { value: string } }) => c.geometry.value)).toEqual(['tetrahedral', 'square-planar']); // common practice
    expect((await run('[NiCl4]2-', '--vs', ' ')).err).toMatch(/^fieldgap predict: --vs: give the formula of the second complex/);
  });
});
