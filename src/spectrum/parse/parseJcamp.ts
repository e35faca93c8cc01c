/**
 * Reads JCAMP-DX (the IUPAC open standard for spectra) through
 * jcampconverter: XYDATA in the X++(Y..Y) form, plain (AFFN) or compressed
 * (SQZ, DIF, DUP), and PEAK TABLE (XY..XY).
 *
 * jcampconverter returns nothing, or wrong numbers, for some damaged input
 * without raising: its logger messages (failed X checks, malformed pairs)
 * are caught and every decoded record is checked here against ##NPOINTS
 * and for characters outside the ASDF alphabet, so that every problem
 * becomes a FieldgapError naming the record ("sample.jdx:##XYDATA").
 */
import { convert } from 'jcampconverter';
import { FieldgapError } from '../../errors.js';
import type { Spectrum, XUnit, YUnit } from '../types.js';
import { xUnitFromLabel, yUnitFromLabel } from '../unitLabels.js';
import { inferXUnit } from './inferXUnit.js';

export interface JcampOptions {
  fileName: string;
  xUnit?: XUnit;
  yUnit?: YUnit;
  /** Fewest points an XYDATA spectrum may have. @default 10 */
  minPoints?: number;
}

export interface JcampResult {
  spectra: Spectrum[];
  warnings: string[];
}

/** True when the text starts (after blank lines) with a JCAMP-DX labelled record "##…=". */
export function looksLikeJcamp(text: string): boolean {
  return /^\s*##[A-Za-z$.][^=\n]*=/.test(text);
}

/** Characters allowed on an XYDATA line: digits, signs, decimal marks, exponents, ASDF letters (A–Z, a–s), '?' and blanks. */
const ASDF_LINE = /^[0-9+\-.,eE \t@A-Za-s%?]*$/;

export function parseJcamp(text: string, options: JcampOptions): JcampResult {
  const { fileName, minPoints = 10 } = options;
  const records = listRecords(text);
  const logged: string[] = [];
  const log = (...args: unknown[]): void => {
    const message = args.filter((a) => typeof a === 'string').join(' ');
    if (/^Data line|Format error|Wrong number|Symbol undefined/.test(message)) logged.push(message);
  };
  const logger = { trace: log, debug: log, info: log, warn: log, error: log, fatal: log, child: () => logger, level: 'trace' };
  let result;
  try {
    result = convert(text, { keepRecordsRegExp: /.*/, logger: logger as never });
  } catch (error) {
    throw new FieldgapError('parse-error', `not a readable JCAMP-DX file: ${(error as Error).message}`, fileName);
  }
  const dataRecord = records.find((r) => r.label === 'XYDATA' || r.label === 'PEAKTABLE');
  for (const unsupported of ['XYPOINTS', 'NTUPLES', 'DATATABLE']) {
    if (dataRecord === undefined && records.some((r) => r.label === unsupported)) {
      throw new FieldgapError(
        'unsupported-format',
        `JCAMP-DX ##${unsupported} is not read by fieldgap; use ##XYDATA= (X++(Y..Y)) or ##PEAK TABLE= (XY..XY)`,
        `${fileName}:##${unsupported}`,
      );
    }
  }
  if (dataRecord === undefined) {
    throw new FieldgapError('parse-error', 'no ##XYDATA or ##PEAK TABLE record in this JCAMP-DX file', fileName);
  }
  const recordPath = `${fileName}:##${dataRecord.name}`;
  if (logged.length > 0) {
    throw new FieldgapError('parse-error', `damaged data (line ${dataRecord.line + 1} is the record's first line): ${logged[0]}`, recordPath);
  }
  for (const record of records) if (record.label === 'XYDATA') checkAsdfLines(text, record, `${fileName}:##${record.name}`);

  const warnings: string[] = [];
  const spectra: Spectrum[] = [];
  for (const entry of result.flatten) {
    for (const s of entry.spectra) {
      const isPeakTable = s['isPeaktable'] === true;
      const path = `${fileName}:##${isPeakTable ? 'PEAK TABLE' : 'XYDATA'}`;
      const x = Float64Array.from(s.data['x'] ?? [], Number);
      const y = Float64Array.from(s.data['y'] ?? [], Number);
      if (x.length === 0 || x.length !== y.length) throw new FieldgapError('parse-error', 'the record holds no data points', path);
      for (let i = 0; i < y.length; i++) {
        if (!Number.isFinite(x[i] as number) || !Number.isFinite(y[i] as number)) {
          throw new FieldgapError('parse-error', `value ${i + 1} of the record is not a number`, path);
        }
      }
      const declared = s.nbPoints;
      if (!isPeakTable && declared !== undefined && declared !== x.length) {
        throw new FieldgapError('parse-error', `##NPOINTS is ${declared} but the record decodes to ${x.length} points`, path);
      }
      if (!isPeakTable && x.length < minPoints) {
        throw new FieldgapError('parse-error', `the record has ${x.length} data points; at least ${minPoints} are needed`, path);
      }
      const metadata = entryMetadata(entry.info, entry.meta);
      metadata['jcampForm'] = isPeakTable ? 'PEAK TABLE' : 'XYDATA';
      const title = entry.title?.trim() || fileName;
      spectra.push({
        x,
        y,
        xUnit: resolveX(options.xUnit, String(s['xUnits'] ?? ''), x, path, warnings),
        yUnit: resolveY(options.yUnit, String(s['yUnits'] ?? ''), y, path, warnings),
        name: title,
        column: spectra.length + 1,
        metadata,
      });
    }
  }
  if (spectra.length === 0) throw new FieldgapError('parse-error', 'the record holds no data points', recordPath);
  return { spectra, warnings };
}

interface RecordInfo {
  /** As written, e.g. "PEAK TABLE". */
  name: string;
  /** Canonical: upper case without blanks, dashes, underscores ("PEAKTABLE"). */
  label: string;
  /** 0-based line of the "##…=" line. */
  line: number;
}

function listRecords(text: string): RecordInfo[] {
  const out: RecordInfo[] = [];
  const lines = text.split(/\r\n|\n|\r/);
  for (let i = 0; i < lines.length; i++) {
    const m = /^\s*##([^=]*)=/.exec(lines[i] as string);
    if (m !== null) {
      const name = (m[1] as string).trim().toUpperCase();
      out.push({ name, label: name.replace(/[\s_-]/g, ''), line: i });
    }
  }
  return out;
}

/** Refuses an XYDATA line with characters outside the ASDF alphabet, naming the file line. */
function checkAsdfLines(text: string, record: RecordInfo, path: string): void {
  const lines = text.split(/\r\n|\n|\r/);
  for (let i = record.line + 1; i < lines.length; i++) {
    const line = (lines[i] as string).replace(/\$\$.*$/, '');
    if (/^\s*##/.test(line)) return;
    if (!ASDF_LINE.test(line)) {
      const bad = [...line].findIndex((c) => !ASDF_LINE.test(c));
      throw new FieldgapError(
        'parse-error',
        `line ${i + 1}, column ${bad + 1}: character "${line[bad]}" is not valid in JCAMP-DX XYDATA`,
        path,
      );
    }
  }
}

function entryMetadata(...sources: Array<Record<string, unknown>>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const source of sources) {
    for (const [key, value] of Object.entries(source)) {
      if (value !== undefined && typeof value !== 'object') out[key] = String(value);
    }
  }
  return out;
}

function resolveX(explicit: XUnit | undefined, label: string, x: Float64Array, path: string, warnings: string[]): XUnit {
  if (explicit !== undefined) return explicit;
  const named = xUnitFromLabel(label);
  if (named !== null) return named;
  const min = Math.min(...x);
  const max = Math.max(...x);
  const guess = inferXUnit(min, max);
  if (guess === null) {
    throw new FieldgapError('parse-error', `##XUNITS "${label}" is not nm, cm-1, eV or µm and x values ${min}…${max} fit none of them: give the x unit`, path);
  }
  warnings.push(`${path}: ##XUNITS ${label === '' ? 'missing' : `"${label}" not recognised`}; ${guess} inferred from the x range ${min}…${max}`);
  return guess;
}

function resolveY(explicit: YUnit | undefined, label: string, y: Float64Array, path: string, warnings: string[]): YUnit {
  if (explicit !== undefined) return explicit;
  const named = yUnitFromLabel(label);
  if (named === 'transmittance') return y.some((v) => v > 1.5) ? 'transmittance-percent' : 'transmittance';
  if (named !== null) return named;
  warnings.push(`${path}: ##YUNITS ${label === '' ? 'missing' : `"${label}" not recognised`}; absorbance assumed`);
  return 'absorbance';
}
