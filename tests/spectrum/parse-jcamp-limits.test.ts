/**
 * JCAMP-DX input that costs far more than its size: a DUP repeat count that
 * would decode to gigabytes, an XYDATA form the converter reads by a slow
 * path, long runs of blanks, and a spectrum too long to spread into
 * Math.min. The bomb must be refused before the converter runs at all: the
 * converter is wrapped here to record its calls (no clock involved).
 */
import { describe, expect, it, vi } from 'vitest';

const converted: string[] = [];
vi.mock('jcampconverter', async (importOriginal) => {
  const real = await importOriginal<typeof import('jcampconverter')>();
  return {
    ...real,
    convert: (text: string, options: never) => {
      converted.push(text);
      return real.convert(text, options);
    },
  };
});

const { parseSpectrumText } = await import('../../src/spectrum/index.js');
const { MAX_JCAMP_POINTS } = await import('../../src/spectrum/parse/parse-jcamp.js');
const { jcampOrdinateBound } = await import('../../src/spectrum/parse/jcamp-point-bound.js');
const { fixtureBytes } = await import('./load.js');

const encode = (text: string) => new TextEncoder().encode(text);

function refusal(text: string): { code: string; path: string; message: string } {
  try {
    parseSpectrumText(encode(text), { fileName: 'b.jdx' });
  } catch (error) {
    return error as { code: string; path: string; message: string };
  }
  throw new Error('the file was accepted');
}

/** A few dozen bytes that would decode to a billion ordinates (DUP: "s" = 9, then 8 more digits). */
const BOMB = '##TITLE=b\n##JCAMP-DX=4.24\n##XYDATA=(X++(Y..Y))\n1 1s99999999\n##END=\n';

describe('JCAMP-DX decoded size', () => {
  it('refuses a DUP bomb with a clear error, before the converter runs', () => {
    expect(BOMB.length).toBeLessThan(80);
    converted.length = 0;
    const error = refusal(BOMB);
    expect(error).toMatchObject({ code: 'too-large', path: 'b.jdx:##XYDATA' });
    expect(error.message).toMatch(/DUP/);
    expect(error.message).toContain(String(MAX_JCAMP_POINTS));
    expect(converted).toEqual([]);
  });

  it('holds a block to its ##NPOINTS: a repeat far beyond it is refused unread, one within it is read', () => {
    const header = '##TITLE=d\n##JCAMP-DX=4.24\n##XUNITS=NANOMETERS\n##YUNITS=ABSORBANCE\n##FIRSTX=400\n##LASTX=419\n##XFACTOR=1\n##YFACTOR=1\n##NPOINTS=20\n##XYDATA=(X++(Y..Y))\n';
    converted.length = 0;
    expect(refusal(`${header}400 5U999\n##END=\n`)).toMatchObject({ code: 'too-large', message: expect.stringContaining('##NPOINTS=20') });
    expect(converted).toEqual([]);
    // 20 ordinates: 5 written once, DUP "T0" (T = 2, then 0: 20 in all).
    const spectrum = parseSpectrumText(encode(`${header}400 5T0\n##END=\n`)).spectra[0]!;
    expect(spectrum.y.length).toBe(20);
    expect(Array.from(spectrum.y).every((v) => v === 5)).toBe(true);
  });

  it('bounds the ordinates of real compressed data from above, within twice the count', () => {
    for (const name of ['xydata-difdup.jdx', 'xydata-affn.jdx']) {
      const text = new TextDecoder().decode(fixtureBytes(name));
      const start = text.indexOf('\n', text.indexOf('##XYDATA')) + 1;
      const points = parseSpectrumText(fixtureBytes(name)).spectra[0]!.y.length;
      const bound = jcampOrdinateBound(text, start, Number.POSITIVE_INFINITY);
      expect(bound).toBeGreaterThanOrEqual(points);
      expect(bound).toBeLessThanOrEqual(2 * points);
    }
    // An AFFN exponent is one value, not three.
    expect(jcampOrdinateBound('1.5E+03 2.0E-01 3.1e+00\n', 0, 100)).toBe(2);
  });

  it('stops counting once the bound is passed, whatever the repeat count', () => {
    expect(jcampOrdinateBound('1 1s999999999999999999999999999999\n', 0, 10)).toBeGreaterThan(10);
  });
});

describe('JCAMP-DX slow paths', () => {
  it('refuses an XYDATA form other than X++(Y..Y) unread, naming the forms it reads', () => {
    converted.length = 0;
    const error = refusal(`##TITLE=x\n##JCAMP-DX=4.24\n##XYDATA=(XY..XY)\n400 1${' '.repeat(100_000)}2\n##END=\n`);
    expect(error).toMatchObject({ code: 'unsupported-format', path: 'b.jdx:##XYDATA' });
    expect(error.message).toMatch(/X\+\+\(Y\.\.Y\)/);
    expect(converted).toEqual([]);
  });

  it('reads a PEAK TABLE with a megabyte run of blanks (the converter sees one blank)', () => {
    converted.length = 0;
    const text = `##TITLE=p\n##JCAMP-DX=4.24\n##XUNITS=1/CM\n##YUNITS=ABSORBANCE\n##PEAK TABLE=(XY..XY)\n17400 0.31${' '.repeat(1_000_000)}24600 0.27\n##END=\n`;
    const spectrum = parseSpectrumText(encode(text)).spectra[0]!;
    expect(Array.from(spectrum.x)).toEqual([17400, 24600]);
    expect(converted[0]!.length).toBeLessThan(200);
  });

  it('reads 200 000 points without ##XUNITS (the x range found without spreading the array)', () => {
    const n = 200_000;
    const lines = ['##TITLE=long', '##JCAMP-DX=4.24', `##NPOINTS=${n}`, '##FIRSTX=400', `##LASTX=${400 + (n - 1) * 0.002}`, '##XFACTOR=0.001', '##YFACTOR=0.01', '##XYDATA=(X++(Y..Y))'];
    for (let i = 0; i < n; i += 10) {
      const ys = Array.from({ length: 10 }, (_, k) => String(50 + ((i + k) % 7)));
      lines.push(`${400_000 + i * 2} ${ys.join(' ')}`);
    }
    lines.push('##END=');
    const parsed = parseSpectrumText(encode(lines.join('\n')), { fileName: 'long.jdx' });
    const s = parsed.spectra[0]!;
    expect(s.x.length).toBe(n);
    expect(s.xUnit).toBe('nm');
    expect(parsed.warnings.join(' ')).toMatch(/inferred from the x range 400/);
  });
});
