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
import { xMinMaxValues } from 'ml-spectra-processing';
import { FieldgapError } from '../../errors.js';
import type { Spectrum, XUnit, YUnit } from '../types.js';
import { xUnitFromLabel, yUnitFromLabel } from '../unit-labels.js';
import { inferXUnit } from './infer-x-unit.js';
import { jcampOrdinateBound } from './jcamp-point-bound.js';
import { jcampDamageFromLog } from './jcamp-library-message.js';

/**
 * Most points one XYDATA block may decode to: far beyond any UV-vis-NIR
 * spectrum (a 0.01 nm grid over 190–3300 nm has 311 000), small enough that
 * decoding it costs tens of MB, not gigabytes.
 */
export const MAX_JCAMP_POINTS = 1_000_000;

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
  for (const record of records) if (record.label === 'XYDATA') checkDecodedSize(text, records, record, `${fileName}:##${record.name}`);
  let result;
  try {
    // Runs of blanks are one separator in JCAMP-DX; collapsed, because the converter's
    // line split backtracks over each run (quadratic in its length).
    result = convert(text.replace(/[ \t]{2,}/g, ' '), { keepRecordsRegExp: /.*/, logger: logger as never });
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
  // Characters outside the ASDF alphabet first: they say plainly what the converter's X checks only hint at.
  for (const record of records) if (record.label === 'XYDATA') checkAsdfLines(text, record, `${fileName}:##${record.name}`);
  if (logged.length > 0) {
    const damage = jcampDamageFromLog(logged[0]!, dataRecord.line);
    throw new FieldgapError('parse-error', `damaged data: ${damage.line === undefined ? '' : `line ${damage.line}: `}${damage.message}`, recordPath);
  }

  const warnings: string[] = [];
  const spectra: Spectrum[] = [];
  for (const entry of result.flatten) {
    for (const s of entry.spectra) {
      const isPeakTable = s['isPeaktable'] === true;
      const path = `${fileName}:##${isPeakTable ? 'PEAK TABLE' : 'XYDATA'}`;
      const x = Float64Array.from(s.data['x'] ?? [], Number);
      const y = Float64Array.from(s.data['y'] ?? [], Number);
      if (x.length === 0 || x.length !== y.length) throw new FieldgapError('parse-error', 'the record holds no data points', path);
      if (x.length > MAX_JCAMP_POINTS) throw new FieldgapError('too-large', `the record has ${x.length} points; fieldgap reads at most ${MAX_JCAMP_POINTS}`, path);
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
  /** What follows "=" on that line, e.g. "(X++(Y..Y))" or "400". */
  value: string;
  /** Offset in the text of the line after the "##…=" line. */
  next: number;
}

function listRecords(text: string): RecordInfo[] {
  const out: RecordInfo[] = [];
  const lineRegExp = /([^\r\n]*)(\r\n|\n|\r|$)/g;
  let line = 0;
  for (let m = lineRegExp.exec(text); m !== null && m[0] !== ''; m = lineRegExp.exec(text), line++) {
    const r = /^\s*##([^=]*)=(.*)$/.exec(m[1] as string);
    if (r !== null) {
      const name = (r[1] as string).trim().toUpperCase();
      out.push({ name, label: name.replace(/[\s_-]/g, ''), line, value: (r[2] as string).trim(), next: lineRegExp.lastIndex });
    }
  }
  return out;
}

/**
 * Refuses, before decoding, an XYDATA block in a form other than X++(Y..Y)
 * (the converter would read it through a slow general path) or one that
 * would decode to more points than ##NPOINTS allows (with a margin for the
 * bound's overcount, see jcampValueBound) or than MAX_JCAMP_POINTS.
 */
function checkDecodedSize(text: string, records: RecordInfo[], record: RecordInfo, path: string): void {
  if (!record.value.includes('++')) {
    throw new FieldgapError(
      'unsupported-format',
      `##${record.name}=${record.value.slice(0, 40)} is not read by fieldgap; ##XYDATA must be in the X++(Y..Y) form (or use ##PEAK TABLE= (XY..XY))`,
      path,
    );
  }
  const declaredRecord = records.filter((r) => r.label === 'NPOINTS' && r.line < record.line).pop();
  const declared = declaredRecord === undefined ? Number.NaN : Number(declaredRecord.value);
  const known = Number.isInteger(declared) && declared >= 0 && declared <= MAX_JCAMP_POINTS;
  // Twice: the DIF Y check repeats one ordinate per line (see jcampOrdinateBound).
  const allowed = 2 * (known ? declared : MAX_JCAMP_POINTS) + 64;
  if (jcampOrdinateBound(text, record.next, allowed) > allowed) {
    const limit = known ? `##NPOINTS=${declared} declares` : `fieldgap reads (${MAX_JCAMP_POINTS})`;
    throw new FieldgapError('too-large', `the record would decode to more points than ${limit} (a DUP repeat count too large?); nothing was decoded`, path);
  }
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
  const { min, max } = xMinMaxValues(x);
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
