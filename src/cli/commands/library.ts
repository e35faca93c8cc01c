import { writeFileSync } from 'node:fs';
import { basename, extname, resolve } from 'node:path';
import type { AnalyzeOptions } from '../../analysis.js';
import { parseFormula } from '../../chemistry/formula.js';
import { FieldgapError, invalidArgument } from '../../errors.js';
import type { CliIo, Command } from '../command.js';
import { ANALYSIS_OPTIONS, ANALYSIS_USAGE, analysisOptionsFrom } from '../analysis-options.js';
import { readInputFile } from '../files.js';
import { numberOption, parseCommandArgs } from '../options.js';
import type { AnalysisRecord, AnalysisSummary, FitSummary, NewAnalysis } from '../../../server/storage/types.js';
import type { Library } from '../../../server/storage/library.js';
import { terminalSafe } from '../terminal-text.js';

/**
 * `fieldgap library`: the results library from the command line. Storage is
 * server/storage (SQLite); it is loaded only when this command runs.
 *
 * Choices made here:
 * - refit keeps history: every refit is a new revision of the record, the
 *   original file is never changed (`library show` lists the revisions);
 * - `library add` without --sample names the sample after the file;
 *   with --formula it takes the ion, the ligands and a geometry guess from
 *   the formula when --ion/--d, --ligands or --geometry are not given;
 * - exports never overwrite a file unless --force is given.
 */

const DETAIL_OPTIONS = {
  sample: { type: 'string' },
  formula: { type: 'string' },
  ligands: { type: 'string' },
  solvent: { type: 'string' },
  temperature: { type: 'string' },
  measured: { type: 'string' },
  note: { type: 'string' },
} as const;

const DATA = { data: { type: 'string' } } as const;

const USAGE = `Usage: fieldgap library SUBCOMMAND [options] [--data DIR]

The results library: analyses saved with their original file (kept byte for
byte, with its SHA-256), options, results and the fieldgap version.

  library add FILE [analysis options] [details] [--json]
                             analyse FILE and save it
  library list [--query Q] [--ion I] [--limit N] [--offset N] [--json]
                             newest first; Q words must all match sample,
                             formula, ion, ligands, solvent or note
  library show ID [--json]   one record, its fit and its revisions
  library original ID --out FILE
                             write the stored original file back out
  library export [--csv FILE | --json FILE] [--query Q] [--ion I] [--force]
                             CSV (default, to stdout without FILE) or JSON
  library refit ID [analysis options] [--json]
                             rerun on the stored original with changed options;
                             kept as a new revision, earlier ones stay
  library remove ID          delete the record, its original and history

Details (library add):
  --sample S        sample name (default: the file name without extension)
  --formula F       complex formula, e.g. "[Cr(H2O)6]Cl3"; gives the ion, the
                    ligands and a geometry guess when those are not given
  --ligands L       ligands, comma-separated, e.g. "H2O,Cl"
  --solvent S       --temperature T (kelvin)   --measured YYYY-MM-DD   --note N

${ANALYSIS_USAGE}

  --data DIR        library folder (default $FIELDGAP_DATA, else ./fieldgap-data)

Energies are in cm-1.`;

export const libraryCommand: Command = {
  name: 'library',
  summary: 'save, list, search, refit and export analyses in the results library',
  usage: USAGE,
  async run(argv, io) {
    const [sub, ...rest] = argv;
    const handler = sub === undefined ? undefined : SUBCOMMANDS[sub];
    if (!handler) {
      const what = sub === undefined ? 'a subcommand is needed' : `unknown subcommand "${sub}"`;
      throw invalidArgument('library', `${what}: one of ${Object.keys(SUBCOMMANDS).join(', ')} (see fieldgap library --help)`);
    }
    return handler(rest, io);
  },
};

type Handler = (argv: string[], io: CliIo) => Promise<number>;

const SUBCOMMANDS: Record<string, Handler> = {
  add: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...ANALYSIS_OPTIONS, ...DETAIL_OPTIONS, ...DATA, json: { type: 'boolean' } }, true);
    const file = onePositional(positionals, 'FILE');
    const options = analysisOptionsFrom(values);
    const details = detailsFrom(values, file);
    fillFromFormula(values.formula, options, details, io);
    const content = readInputFile(file, io.cwd);
    options.fileName = basename(file);
    const { analyzeSpectrum } = await import('../../analysis.js');
    const result = analyzeSpectrum(content, options);
    const saved = await withLibrary(values.data, io, (library) => library.add({ ...details, fileName: basename(file), content, options, result }));
    if (values.json) io.stdout(`${JSON.stringify(saved, null, 2)}\n`);
    else io.stdout(`saved #${saved.id} "${terminalSafe(saved.sample)}"${saved.ion ? ` (${terminalSafe(saved.ion)})` : ''}\n  ${fitLine(saved.summary)}\n${warningLines(saved)}`);
    return 0;
  },

  list: async (argv, io) => {
    const { values } = parseCommandArgs(argv, { query: { type: 'string' }, ion: { type: 'string' }, limit: { type: 'string' }, offset: { type: 'string' }, json: { type: 'boolean' }, ...DATA });
    const limit = numberOption('limit', values.limit, { min: 1, max: 1000, integer: true }) ?? 50;
    const offset = numberOption('offset', values.offset, { min: 0, integer: true }) ?? 0;
    const page = await withLibrary(values.data, io, (library) =>
      library.list({ limit, offset, ...(values.query !== undefined && { query: values.query }), ...(values.ion !== undefined && { ion: values.ion }) }));
    if (values.json) {
      io.stdout(`${JSON.stringify(page, null, 2)}\n`);
      return 0;
    }
    if (page.total === 0) {
      io.stdout(values.query !== undefined || values.ion !== undefined ? 'no analyses match\n' : 'the library is empty (fieldgap library add FILE --ion ION)\n');
      return 0;
    }
    io.stdout(summaryTable(page.analyses));
    const shown = page.analyses.length;
    const count = shown === page.total ? `${shown} ${shown === 1 ? 'analysis' : 'analyses'}` : `analyses ${offset + 1}-${offset + shown} of ${page.total}`;
    io.stdout(`${count}, newest first\n`);
    return 0;
  },

  show: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { json: { type: 'boolean' }, ...DATA }, true);
    const id = idFrom(positionals);
    const record = await withLibrary(values.data, io, (library) => library.get(id));
    io.stdout(values.json ? `${JSON.stringify(record, null, 2)}\n` : recordText(record));
    return 0;
  },

  original: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { out: { type: 'string' }, force: { type: 'boolean' }, ...DATA }, true);
    const id = idFrom(positionals);
    if (values.out === undefined) throw invalidArgument('--out', '--out FILE is required: where to write the original file');
    const original = await withLibrary(values.data, io, (library) => library.getOriginal(id));
    writeNew(values.out, original.bytes, values.force === true, io);
    io.stdout(`wrote ${values.out} (${original.size} bytes, sha256 ${original.sha256}, stored as ${original.fileName})\n`);
    return 0;
  },

  export: async (argv, io) => {
    const { values } = parseCommandArgs(argv, { csv: { type: 'string' }, json: { type: 'string' }, query: { type: 'string' }, ion: { type: 'string' }, force: { type: 'boolean' }, ...DATA });
    if (values.csv !== undefined && values.json !== undefined) throw invalidArgument('--json', 'give --csv FILE or --json FILE, not both');
    const filter = { ...(values.query !== undefined && { query: values.query }), ...(values.ion !== undefined && { ion: values.ion }) };
    const { libraryCsv } = await import('../../../server/storage/export.js');
    const text = await withLibrary(values.data, io, (library) => {
      const summaries = library.listAll(filter);
      if (values.json === undefined) return libraryCsv(summaries);
      return `${JSON.stringify({ analyses: summaries.map((s) => library.get(s.id)) }, null, 2)}\n`;
    });
    const target = values.csv ?? values.json;
    if (target === undefined || target === '-') {
      io.stdout(text);
      return 0;
    }
    writeNew(target, text, values.force === true, io);
    io.stdout(`wrote ${target}\n`);
    return 0;
  },

  refit: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...ANALYSIS_OPTIONS, json: { type: 'boolean' }, ...DATA }, true);
    const id = idFrom(positionals);
    const changes = analysisOptionsFrom(values);
    const [{ analyzeSpectrum }, { refitAnalysis }] = await Promise.all([import('../../analysis.js'), import('../../../server/storage/refit.js')]);
    const record = await withLibraryAsync(values.data, io, (library) =>
      refitAnalysis(library, id, { ...changes }, async (content, options) => analyzeSpectrum(content, options as AnalyzeOptions)));
    if (values.json) {
      io.stdout(`${JSON.stringify(record, null, 2)}\n`);
      return 0;
    }
    const before = record.revisions.at(-2)!;
    io.stdout(`refitted #${record.id} "${terminalSafe(record.sample)}": revision ${record.revision}\n  was  ${fitLine(before.summary)}\n  now  ${fitLine(record.summary)}\n${warningLines(record)}`);
    return 0;
  },

  remove: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...DATA }, true);
    const id = idFrom(positionals);
    const sample = await withLibrary(values.data, io, (library) => {
      const { sample: name } = library.get(id);
      library.remove(id);
      return name;
    });
    io.stdout(`removed #${id} "${terminalSafe(sample)}"\n`);
    return 0;
  },
};

async function openFor(flag: string | undefined, io: CliIo): Promise<Library> {
  const [{ resolveDataDir }, { openLibrary }] = await Promise.all([
    import('../../../server/storage/data-dir.js'),
    import('../../../server/storage/library.js'),
  ]);
  return openLibrary(resolveDataDir({ flag, env: io.env, cwd: io.cwd }));
}

/** Opens the library named by --data / FIELDGAP_DATA, runs `fn`, always closes. */
export async function withLibrary<T>(flag: string | undefined, io: CliIo, fn: (library: Library) => T): Promise<T> {
  return withLibraryAsync(flag, io, async (library) => fn(library));
}

async function withLibraryAsync<T>(flag: string | undefined, io: CliIo, fn: (library: Library) => Promise<T>): Promise<T> {
  const library = await openFor(flag, io);
  try {
    return await fn(library);
  } finally {
    library.close();
  }
}

function onePositional(positionals: string[], name: string): string {
  if (positionals.length !== 1) {
    throw invalidArgument(name, positionals.length === 0 ? `${name} is required` : `one ${name} expected, got ${positionals.length}: ${positionals.join(' ')}`);
  }
  return positionals[0]!;
}

function idFrom(positionals: string[]): number {
  const text = onePositional(positionals, 'ID').replace(/^#/, '');
  return numberOption('id', text, { min: 1, integer: true })!;
}

type DetailValues = { [K in keyof typeof DETAIL_OPTIONS]?: string };

function detailsFrom(values: DetailValues, file: string): Omit<NewAnalysis, 'fileName' | 'content' | 'options' | 'result'> {
  const details: Omit<NewAnalysis, 'fileName' | 'content' | 'options' | 'result'> = {
    sample: values.sample ?? basename(file, extname(file)),
  };
  if (values.formula !== undefined) details.formula = values.formula;
  if (values.ligands !== undefined) details.ligands = values.ligands.split(',').map((l) => l.trim()).filter((l) => l !== '');
  if (values.solvent !== undefined) details.solvent = values.solvent;
  const temperature = numberOption('temperature', values.temperature?.replace(/\s*K$/i, ''), { min: Number.MIN_VALUE, max: 5000 });
  if (temperature !== undefined) details.temperature = temperature;
  if (values.measured !== undefined) details.measuredOn = values.measured;
  if (values.note !== undefined) details.note = values.note;
  return details;
}

/** What --formula tells when --ion/--d, --ligands or --geometry were not given. */
function fillFromFormula(formula: string | undefined, options: AnalyzeOptions, details: { ion?: string; ligands?: string[] }, io: CliIo): void {
  if (formula === undefined) return;
  const needsIon = options.ion === undefined && options.d === undefined;
  let parsed;
  try {
    parsed = parseFormula(formula);
  } catch (error) {
    if (needsIon && error instanceof FieldgapError) throw new FieldgapError(error.code, `${error.message} (or give --ion)`, '--formula');
    io.stderr(`note: --formula "${formula}" is kept as written; fieldgap could not read it (${(error as Error).message})\n`);
    return;
  }
  if (needsIon) options.ion = parsed.metal.label;
  if (details.ligands === undefined) details.ligands = parsed.ligands.map((l) => l.key);
  if (options.geometry === undefined && parsed.geometry !== undefined) {
    options.geometry = parsed.geometry;
    io.stderr(`note: geometry ${parsed.geometry} guessed from the formula (coordination number ${parsed.coordinationNumber}); --geometry to choose\n`);
  }
}

function writeNew(target: string, data: string | Buffer, force: boolean, io: CliIo): void {
  try {
    writeFileSync(resolve(io.cwd, target), data, { flag: force ? 'w' : 'wx' });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') throw invalidArgument(target, 'the file exists; choose another name or add --force to replace it');
    throw new FieldgapError('invalid-argument', `cannot write the file (${code ?? 'error'})`, target);
  }
}

/** "17400 ± 150" with the uncertainty to 2 significant figures and the value to match. */
export function plusMinus(value: number | null, sd: number | null, minDecimals = 0): string {
  if (value === null) return '-';
  if (sd === null || !(sd > 0)) return value.toFixed(minDecimals);
  const decimals = Math.max(minDecimals, Math.min(6, 1 - Math.floor(Math.log10(sd))));
  return `${value.toFixed(decimals)} ± ${sd.toFixed(decimals)}`;
}

function fitLine(s: FitSummary): string {
  if (s.tenDq === null) return `no ligand-field fit${s.status ? ` (${s.status})` : ''}`;
  const parts = [`10Dq = ${plusMinus(s.tenDq, s.tenDqSd)} cm-1`];
  if (s.b !== null) parts.push(`B = ${plusMinus(s.b, s.bSd)} cm-1`);
  if (s.beta !== null) parts.push(`β = ${plusMinus(s.beta, s.betaSd, 2)}`);
  if (s.spinState) parts.push(s.spinState);
  if (s.rmsResidual !== null) parts.push(`rms ${s.rmsResidual.toFixed(0)} cm-1`);
  return parts.join('   ');
}

function warningLines(record: AnalysisRecord): string {
  const warnings = (record.result as { warnings?: unknown }).warnings;
  return Array.isArray(warnings) ? warnings.map((w) => `  warning: ${terminalSafe(String(w))}\n`).join('') : '';
}

/** Columns padded to their widest cell; the first row is the header. */
export function table(rows: string[][], rightAligned: ReadonlySet<number> = new Set()): string {
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => [...(r[c] ?? '')].length)));
  return rows
    .map((r) => r.map((cell, c) => (rightAligned.has(c) ? cell.padStart(widths[c]!) : cell.padEnd(widths[c]!))).join('  ').trimEnd())
    .join('\n') + '\n';
}

function summaryTable(analyses: AnalysisSummary[]): string {
  const rows = [['ID', 'SAMPLE', 'FORMULA', 'ION', '10Dq/cm-1', 'B/cm-1', 'β', 'SPIN', 'RMS/cm-1', 'SAVED']];
  for (const a of analyses) {
    const s = a.summary;
    rows.push([
      String(a.id), clip(a.sample, 28), clip(a.formula ?? '', 22), terminalSafe(a.ion ?? ''),
      plusMinus(s.tenDq, s.tenDqSd), plusMinus(s.b, s.bSd), plusMinus(s.beta, s.betaSd, 2), s.spinState ?? '',
      s.rmsResidual === null ? '-' : s.rmsResidual.toFixed(0), a.createdAt.slice(0, 10),
    ]);
  }
  return table(rows, new Set([0, 4, 5, 6, 8]));
}

function clip(stored: string, width: number): string {
  const text = terminalSafe(stored);
  return [...text].length <= width ? text : `${[...text].slice(0, width - 1).join('')}…`;
}

function recordText(r: AnalysisRecord): string {
  const lines = [`#${r.id}  ${terminalSafe(r.sample)}`];
  const add = (label: string, value: string | undefined) => {
    if (value !== undefined && value !== '') lines.push(`  ${label.padEnd(12)} ${terminalSafe(value)}`);
  };
  add('formula', r.formula);
  add('ion', r.ion);
  add('ligands', r.ligands?.join(', '));
  add('solvent', r.solvent);
  add('temperature', r.temperature === undefined ? undefined : `${r.temperature} K`);
  add('measured', r.measuredOn);
  add('note', r.note);
  add('original', `${r.original.fileName}, ${r.original.size} bytes, sha256 ${r.original.sha256}`);
  add('saved', `${r.createdAt}${r.updatedAt !== r.createdAt ? `, changed ${r.updatedAt}` : ''}`);
  lines.push(`fit (revision ${r.revision} of ${r.revisions.length}, fieldgap ${r.toolVersion})`, `  ${fitLine(r.summary)}`);
  const s = r.summary;
  if (s.c !== null) lines.push(`  C = ${s.c.toFixed(0)} cm-1${s.status ? `   status ${s.status}` : ''}`);
  const fit = (r.result as { fit?: { assignments?: { observed?: number; calculated?: number; term?: string }[] } | null }).fit;
  const assignments = Array.isArray(fit?.assignments) ? fit.assignments : [];
  if (assignments.length > 0) {
    const rows = [['  OBSERVED/cm-1', 'CALCULATED/cm-1', 'TERM']];
    for (const a of assignments) rows.push([`  ${a.observed?.toFixed(0) ?? '-'}`, a.calculated?.toFixed(0) ?? '-', a.term ?? '']);
    lines.push(table(rows, new Set([0, 1])).trimEnd());
  }
  if (r.revisions.length > 1) {
    lines.push('revisions');
    for (const rev of r.revisions) lines.push(`  ${rev.revision}  ${rev.createdAt}  ${fitLine(rev.summary)}  options ${JSON.stringify(rev.options)}`);
  } else {
    lines.push(`options ${JSON.stringify(r.options)}`);
  }
  return `${lines.join('\n')}\n${warningLines(r)}`;
}
