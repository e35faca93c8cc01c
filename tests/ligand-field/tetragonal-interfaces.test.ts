import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeFieldDiagram, computeFieldLevels, fieldLevelsDocument } from '../../src/ligand-field/index.js';
import { makeTestApp, type TestApp } from '../server/helpers.js';
import { runCliCaptured } from '../helpers/cli-run.js';

function run(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(argv);
}

describe('fieldgap levels --ds --dt --zeta', () => {
  it('JSON: every level keeps energy and degeneracy and has irrep and parent', async () => {
    const { code, out } = await run(['levels', '--d', '3', '--dq', '1740', '--b', '725', '--c', '2900', '--ds', '300', '--dt', '-100', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json).toMatchObject({ d: 3, ds: 300, dt: -100, zeta: 0, symmetry: 'tetragonal', group: 'D4h', groundTerm: '4B1g' });
    for (const level of json.levels) expect(Object.keys(level).slice(0, 4)).toEqual(['energy', 'degeneracy', 'irrep', 'parent']);
    expect(json.levels.reduce((s: number, l: { degeneracy: number }) => s + l.degeneracy, 0)).toBe(120);
  });
  it('with --zeta: double-group irreps and parent weights; negative values reach the range check', async () => {
    const ok = await run(['levels', '--d', '7', '--geometry', 'tetrahedral', '--dq', '400', '--b', '780', '--c', '3500', '--zeta', '500', '--json']);
    const json = JSON.parse(ok.out);
    expect(json.group).toBe("Td'");
    expect(json.levels[0]).toMatchObject({ irrep: 'Γ8', degeneracy: 4, parent: '4A2(F)' });
    const bad = await run(['levels', '--d', '7', '--dq', '400', '--b', '780', '--c', '3500', '--zeta', '-5']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--zeta/);
    const tet = await run(['levels', '--d', '7', '--geometry', 'tetrahedral', '--dq', '400', '--b', '780', '--c', '3500', '--dt', '5']);
    expect(tet.code).toBe(2);
    expect(tet.err).toMatch(/--dt/);
  });
  it('without the new options the cubic output is unchanged', async () => {
    const { out } = await run(['levels', '--d', '3', '--dq', '1740', '--b', '725', '--c', '2900', '--json']);
    expect(JSON.parse(out)).not.toHaveProperty('ds');
  });
  it('table names the site group and the parents', async () => {
    const { code, out } = await run(['levels', '--d', '9', '--dq', '1200', '--b', '1000', '--c', '4000', '--ds', '1500', '--dt', '300']);
    expect(code).toBe(0);
    expect(out).toMatch(/site group D4h/);
    expect(out).toMatch(/2B1g\s+0\.0/);
  });
});

describe('fieldgap diagram beyond the cubic field', () => {
  it('distortion axis: lines start on the octahedral levels and the 4T2g line splits', () => {
    const diagram = computeFieldDiagram(3, 'octahedral', {
      axis: 'distortion', b: 725, cOverB: 4, dq: 1740, ds: 800, dt: 200, zeta: 0, maxDqOverB: 4, steps: 20,
    });
    const children = diagram.lines.filter((l) => l.parent === '4T2g(F)');
    expect(children.map((l) => l.term).sort()).toEqual(['4B2g', '4Eg']);
    // At t = 0 both components sit at 10Dq/B = 24 (the cubic 4T2g, 10Dq above 4A2g: common practice).
    for (const line of children) expect(line.energies[0]).toBeCloseTo(24, 9);
    expect(Math.abs(children[0]!.energies[20]! - children[1]!.energies[20]!)).toBeGreaterThan(1);
  });
  it('zeta axis: the d1 t2g line splits into Γ8 and Γ7, 3ζ/2 apart to first order', async () => {
    const { code, out } = await run(['diagram', '--d', '1', '--axis', 'zeta', '--dq', '2000', '--b', '1000', '--zeta', '40', '--steps', '4', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json.axis).toBe('zeta');
    const gamma7 = json.lines.find((l: { term: string }) => l.term === 'Γ7');
    // t2g^1 with ζ: Γ7 lies 3ζ/2 above Γ8 when ζ ≪ 10Dq (common practice; second order ~ ζ²/10Dq).
    expect(gamma7.energies[4] * 1000).toBeCloseTo(60, 0);
  });
  it('names a missing end point', async () => {
    const { code, err } = await run(['diagram', '--d', '3', '--axis', 'zeta', '--dq', '2000']);
    expect(code).toBe(2);
    expect(err).toMatch(/--zeta/);
  });
});

describe('fieldgap fit --symmetry tetragonal --zeta --free-zeta', () => {
  it('reports ds, dt, zeta with uncertainties beside dq and b', async () => {
    const { code, out } = await run(['fit', '--ion', 'Cu2+', '--symmetry', 'tetragonal', '--bands', '7500,12000,15000', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json).toMatchObject({ symmetry: 'tetragonal', status: 'exact', zeta: 0, zetaMode: 'fixed' });
    for (const key of ['dq', 'ds', 'dt', 'zeta']) expect(json.uncertainty).toHaveProperty(key);
    expect(json.uncertainty.ds).toBeGreaterThan(0);
  });
  it('--zeta free-ion takes the tabulated value; a bad --zeta names the option', async () => {
    const ok = await run(['fit', '--ion', 'Cu2+', '--symmetry', 'tetragonal', '--zeta', 'free-ion', '--bands', '7500,12000,15000', '--json']);
    expect(ok.code).toBe(0);
    expect(JSON.parse(ok.out)).toMatchObject({ zeta: 829, zetaMode: 'free-ion', freeIonZeta: 829 });
    const bad = await run(['fit', '--ion', 'Cu2+', '--zeta', 'lots', '--bands', '7500,12000,15000']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--zeta/);
  });
  it('without the new options fit is the cubic fit it was', async () => {
    const { code, out } = await run(['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--json']);
    expect(code).toBe(0);
    expect(JSON.parse(out)).not.toHaveProperty('symmetry');
  });
});

describe('GET /api/v1/levels and /diagram with ds, dt, zeta', () => {
  let t: TestApp;
  beforeAll(() => {
    t = makeTestApp();
  });
  afterAll(async () => {
    await t.dispose();
  });
  it('answers what `levels --json` prints', async () => {
    const res = await request(t.app).get('/api/v1/levels').query({ d: 9, dq: 1200, b: 1000, c: 4000, ds: 1500, dt: 300, zeta: 830 }).expect(200);
    const expected = fieldLevelsDocument(computeFieldLevels(9, 'octahedral', { dq: 1200, b: 1000, c: 4000, ds: 1500, dt: 300, zeta: 830 }));
    expect(res.body).toEqual(JSON.parse(JSON.stringify(expected)));
  });
  it('a distorted tetrahedron is refused with the field named', async () => {
    const res = await request(t.app).get('/api/v1/levels').query({ d: 7, geometry: 'tetrahedral', dq: 400, b: 780, c: 3500, ds: 10 }).expect(400);
    expect(JSON.stringify(res.body)).toMatch(/ds/);
  });
  it('diagram along ζ', async () => {
    const res = await request(t.app).get('/api/v1/diagram').query({ d: 2, axis: 'zeta', dq: 1800, b: 700, zeta: 300, steps: 10 }).expect(200);
    expect(res.body.axis).toBe('zeta');
    expect(res.body.x).toHaveLength(11);
  });
});
