/**
 * Writes a spectrum as JCAMP-DX 4.24 text (the IUPAC open standard):
 * ##XYDATA= (X++(Y..Y)) in plain AFFN or in compressed DIFDUP form
 * (SQZ for the first ordinate of a line, DIF for differences, DUP for
 * repeats, an ordinate check at the start of each next line), or a
 * ##PEAK TABLE= (XY..XY). For demo data and fixtures.
 */
import { invalidArgument } from '../../errors.js';

export interface FormatJcampOptions {
  title: string;
  /** Equally spaced x values (XYDATA), or peak positions (PEAK TABLE). */
  x: Float64Array;
  y: Float64Array;
  /** ##XUNITS, e.g. "NANOMETERS", "1/CM". */
  xUnits: string;
  /** ##YUNITS, e.g. "ABSORBANCE", "TRANSMITTANCE". */
  yUnits: string;
  /** 'affn' plain numbers, 'difdup' compressed, 'peak-table' XY pairs. @default 'difdup' */
  form?: 'affn' | 'difdup' | 'peak-table';
  /** ##DATA TYPE. @default "UV/VIS SPECTRUM" */
  dataType?: string;
  /** ##YFACTOR: y is written as round(y / yFactor). @default 1e-5 */
  yFactor?: number;
  /** Extra records written after the title, e.g. { ORIGIN: "invented" }. @default {} */
  records?: Record<string, string>;
}

const MAX_LINE = 78;

export function formatJcamp(options: FormatJcampOptions): string {
  const { title, x, y, xUnits, yUnits, form = 'difdup', dataType = 'UV/VIS SPECTRUM', yFactor = 1e-5, records = {} } = options;
  if (x.length !== y.length || x.length === 0) throw invalidArgument('y', `y: length ${y.length} differs from x length ${x.length} (or is 0)`);
  const head = [`##TITLE= ${title}`, '##JCAMP-DX= 4.24', `##DATA TYPE= ${dataType}`];
  for (const [k, v] of Object.entries(records)) head.push(`##${k}= ${v}`);
  head.push(`##XUNITS= ${xUnits}`, `##YUNITS= ${yUnits}`);
  if (form === 'peak-table') {
    const lines = [...head, `##NPOINTS= ${x.length}`, '##PEAK TABLE= (XY..XY)'];
    for (let i = 0; i < x.length; i++) lines.push(`${fmt(x[i] as number)}, ${fmt(y[i] as number)}`);
    return [...lines, '##END='].join('\n') + '\n';
  }
  const n = x.length;
  const deltaX = n > 1 ? ((x[n - 1] as number) - (x[0] as number)) / (n - 1) : 1;
  for (let i = 1; i < n; i++) {
    if (Math.abs((x[i] as number) - (x[i - 1] as number) - deltaX) > 1e-6 * Math.abs(deltaX)) {
      throw invalidArgument('x', `x: XYDATA needs equally spaced x; x[${i}] breaks the spacing ${deltaX}`);
    }
  }
  const ints = Array.from(y, (v) => Math.round(v / yFactor));
  const lines = [
    ...head,
    '##XFACTOR= 1',
    `##YFACTOR= ${yFactor}`,
    `##FIRSTX= ${fmt(x[0] as number)}`,
    `##LASTX= ${fmt(x[n - 1] as number)}`,
    `##NPOINTS= ${n}`,
    `##FIRSTY= ${fmt((ints[0] as number) * yFactor)}`,
    '##XYDATA= (X++(Y..Y))',
    ...(form === 'affn' ? affnLines(x, ints) : difdupLines(x, ints)),
    '##END=',
  ];
  return lines.join('\n') + '\n';
}

function fmt(v: number): string {
  return String(Number(v.toPrecision(12)));
}

function affnLines(x: Float64Array, ints: number[]): string[] {
  const out: string[] = [];
  let line = '';
  for (let i = 0; i < ints.length; i++) {
    const token = String(ints[i]);
    if (line === '') line = `${fmt(x[i] as number)} ${token}`;
    else if (line.length + 1 + token.length > MAX_LINE) {
      out.push(line);
      line = `${fmt(x[i] as number)} ${token}`;
    } else line += ` ${token}`;
  }
  if (line !== '') out.push(line);
  return out;
}

/** First digit of |n| replaced by a letter from `positive` or `negative` (10 characters each, for 0..9). */
function encode(n: number, positive: string, negative: string): string {
  const digits = String(Math.abs(n));
  const first = Number(digits[0]);
  const letter = n < 0 ? (negative[first] as string) : (positive[first] as string);
  return letter + digits.slice(1);
}

const SQZ_POS = '@ABCDEFGHI';
const SQZ_NEG = '@abcdefghi';
const DIF_POS = '%JKLMNOPQR';
const DIF_NEG = '%jklmnopqr';
const DUP = ' STUVWXYZs';

function dup(count: number): string {
  return encode(count, DUP, DUP);
}

/**
 * DIFDUP lines: each line is X, the SQZ ordinate, then DIF tokens; a run
 * of equal differences is written once with a DUP count. Each line after
 * the first repeats the previous line's last ordinate as its check value,
 * and a last line repeats the final ordinate, as the standard asks.
 */
function difdupLines(x: Float64Array, ints: number[]): string[] {
  const out: string[] = [];
  let start = 0;
  while (start < ints.length - 1 || out.length === 0) {
    let line = `${fmt(x[start] as number)}${encode(ints[start] as number, SQZ_POS, SQZ_NEG)}`;
    let i = start + 1;
    while (i < ints.length) {
      const d = (ints[i] as number) - (ints[i - 1] as number);
      let run = 1;
      while (i + run < ints.length && (ints[i + run] as number) - (ints[i + run - 1] as number) === d) run++;
      const token = encode(d, DIF_POS, DIF_NEG) + (run > 1 ? dup(run) : '');
      if (line.length + token.length > MAX_LINE) break;
      line += token;
      i += run;
    }
    out.push(line);
    if (i >= ints.length) {
      start = ints.length - 1;
      break;
    }
    start = i - 1;
  }
  const last = ints.length - 1;
  if (last > 0) out.push(`${fmt(x[last] as number)}${encode(ints[last] as number, SQZ_POS, SQZ_NEG)}`);
  return out;
}
