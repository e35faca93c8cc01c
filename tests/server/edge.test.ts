import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { FieldgapError } from '../../src/errors.js';
import { DIAGRAM_DEFAULTS } from '../../src/ligand-field/index.js';
import { coerceFields, coerceText } from '../../server/coerce.js';
import { formatIssuePath, httpStatusFor, ServiceBusyError, toFieldgapError, INTERNAL_ERROR } from '../../server/errors.js';
import { analyzeFields, diagramQuery, fitBody, levelsQuery } from '../../server/schemas.js';
import { parseJsonBody, parseTextFields } from '../../server/validate.js';
import { errorOf as failure } from '../helpers/errors.js';


describe('coerceText', () => {
  const number = { number: true, boolean: false };
  const boolean = { number: false, boolean: true };
  it('turns number-looking text into numbers only', () => {
    expect(coerceText(' 2000 ', number)).toBe(2000);
    expect(coerceText('1.5e3', number)).toBe(1500);
    expect(coerceText('-.5', number)).toBe(-0.5);
    // Number('') is 0 and Number('0x10') is 16: neither is a number a chemist typed.
    expect(coerceText('', number)).toBe('');
    expect(coerceText('0x10', number)).toBe('0x10');
    expect(coerceText('abc', number)).toBe('abc');
    expect(coerceText('Infinity', number)).toBe('Infinity');
  });
  it('reads the usual spellings of booleans', () => {
    expect(coerceText('true', boolean)).toBe(true);
    expect(coerceText('0', boolean)).toBe(false);
    expect(coerceText('maybe', boolean)).toBe('maybe');
  });
  it('converts per field, leaving unknown and repeated fields for the schema', () => {
    const shape = levelsQuery.shape;
    expect(coerceFields(shape, { d: '3', geometry: 'octahedral', extra: '5', dq: ['1', '2'] })).toEqual({
      d: 3,
      geometry: 'octahedral',
      extra: '5',
      dq: ['1', '2'],
    });
    // column takes a number or a header: a number-looking value becomes a number, a header stays text.
    expect(coerceFields(analyzeFields.shape, { column: '2', freeC: 'yes' })).toEqual({ column: 2, freeC: true });
    expect(coerceFields(analyzeFields.shape, { column: 'A(sample)' })).toEqual({ column: 'A(sample)' });
  });
});

describe('request validation', () => {
  it('applies the documented defaults', () => {
    expect(parseTextFields(levelsQuery, { d: '3', dq: '1750', b: '700', cOverB: '4' })).toEqual({
      d: 3,
      geometry: 'octahedral',
      dq: 1750,
      b: 700,
      cOverB: 4,
    });
    expect(parseTextFields(diagramQuery, { d: '6' })).toEqual({ d: 6, geometry: 'octahedral', ...DIAGRAM_DEFAULTS });
  });
  it('names the field and the value that is wrong', () => {
    const junk = failure(() => parseTextFields(levelsQuery, { d: '3', dq: 'abc', b: '700', c: '2800' }));
    expect(junk.code).toBe('invalid-argument');
    expect(junk.path).toBe('dq');
    expect(junk.message).toBe('dq: expected number, got "abc"');
    const missing = failure(() => parseTextFields(levelsQuery, { d: '3', dq: '100', c: '2800' }));
    expect(missing.path).toBe('b');
    expect(missing.message).toMatch(/^b: is required/);
    const noC = failure(() => parseTextFields(levelsQuery, { d: '3', dq: '100', b: '700' }));
    expect(noC.path).toBe('c');
    expect(noC.message).toBe('c: give Racah C as "c" (cm-1) or as the ratio "cOverB"');
    const both = failure(() => parseTextFields(levelsQuery, { d: '3', dq: '100', b: '700', c: '2800', cOverB: '4' }));
    expect(both.path).toBe('cOverB');
    const range = failure(() => parseTextFields(levelsQuery, { d: '12', dq: '100', b: '700', c: '2800' }));
    expect(range.path).toBe('d');
    expect(range.message).toMatch(/^d: .*10.*got 12$/);
    const choice = failure(() => parseTextFields(diagramQuery, { d: '3', geometry: 'square' }));
    expect(choice.path).toBe('geometry');
    expect(choice.message).toContain('"octahedral"');
    const typo = failure(() => parseTextFields(levelsQuery, { d: '3', dq: '100', b: '700', c: '2800', Dq: '1' }));
    expect(typo.path).toBe('Dq');
    expect(typo.message).toBe('Dq: unknown field "Dq"');
  });
  it('points into the band list of a fit body', () => {
    const wrong = failure(() => parseJsonBody(fitBody, { d: 3, bands: [17400, { position: 'x' }] }));
    expect(wrong.path).toBe('bands[1].position');
    expect(wrong.message).toBe('bands[1].position: expected number, got "x"');
    const negative = failure(() => parseJsonBody(fitBody, { d: 3, bands: [-5] }));
    expect(negative.path).toBe('bands[0]');
    const empty = failure(() => parseJsonBody(fitBody, { d: 3, bands: [] }));
    expect(empty.path).toBe('bands');
    const noMetal = failure(() => parseJsonBody(fitBody, { bands: [17400] }));
    expect(noMetal.path).toBe('ion');
    expect(noMetal.message).toContain('"d"');
    const notObject = failure(() => parseJsonBody(fitBody, undefined));
    expect(notObject.path).toBe('body');
  });
  it('formats paths the way the core does', () => {
    expect(formatIssuePath(['bands', 2, 'position'])).toBe('bands[2].position');
    expect(formatIssuePath([])).toBe('');
  });
});

describe('error codes to HTTP status', () => {
  it('maps each code once, busy apart from a time limit', () => {
    const status = (code: FieldgapError['code']) => httpStatusFor(new FieldgapError(code, 'x'));
    expect(status('invalid-argument')).toBe(400);
    expect(status('parse-error')).toBe(400);
    expect(status('unsupported-format')).toBe(415);
    expect(status('unexplained')).toBe(422);
    expect(status('not-found')).toBe(404);
    expect(status('too-large')).toBe(413);
    expect(status('timeout')).toBe(504);
    expect(status('internal')).toBe(500);
    expect(httpStatusFor(new ServiceBusyError())).toBe(503);
  });
  it('never passes a bug through as it is', () => {
    expect(toFieldgapError(new TypeError('x is undefined'))).toBe(INTERNAL_ERROR);
    const known = new FieldgapError('not-found', 'no such record', 'id');
    expect(toFieldgapError(known)).toBe(known);
  });
});

describe('schemas export to JSON Schema', () => {
  it('every request schema is representable', () => {
    for (const schema of [levelsQuery, diagramQuery, fitBody, analyzeFields]) {
      expect(() => z.toJSONSchema(schema, { io: 'input' })).not.toThrow();
    }
  });
});
