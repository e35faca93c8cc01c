import { writeFileSync } from 'node:fs';
import { basename, extname, resolve } from 'node:path';
import type { AnalyzeOptions } from '../../analysis.js';
import { detailsFromFormula } from '../../library/formula-details.js';
import { FieldgapError, invalidArgument } from '../../errors.js';
import { changeLines, fitLine, plusMinus, recordText, savedText, summaryTable, table, warningLines } from './library-text.js';
import { runSubcommand, type CliIo, type Command } from '../command.js';
import { ANALYSIS_OPTIONS, ANALYSIS_USAGE, analysisOptionsFrom } from '../analysis-options.js';
import { readInputFile } from '../files.js';
import { choiceOption, numberOption, parseCommandArgs } from '../options.js';
import type { NewAnalysis } from '../../library/types.js';
import type { Library } from '../../library/library.js';
import { checkCorrections, type AnalysisCorrections } from '../../analysis-corrections.js';
import { terminalSafe } from '../terminal-text.js';
import { addMany } from './library-add-many.js';

/**
 * `fieldgap library`: the results library from the command line. Storage is
 * src/library (SQLite, or PostgreSQL with --database); it is loaded only
 * when this command runs.
 *
 * Choices made here:
 * - refit keeps history: every refit is a new revision of the record, the
 *   original file is never changed (`library show` lists the revisions);
 * - `library add` without --sample names the sample after the file;
 *   with --formula it takes the ion, the ligands and a geometry guess from
 *   the formula when --ion/--d, --ligands or --geometry are not given;
 * - exports never overwrite a file unless --force is given;
 * - a file with several spectra (y columns) is one record per spectrum, as
 *   analyze reads it and watch stores it (src/library/spectra-to-store.ts).
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

const DATA = { data: { type: 'string' }, database: { type: 'string' } } as const;

const USAGE = `Usage: fieldgap library SUBCOMMAND [options] [--data DIR | --database URL]

The results library: analyses saved with their original file (kept byte for
byte, with its SHA-256), options, results and the fieldgap version.

  library add FILE... [analysis options] [details] [--json]
                             analyse each FILE and save it (many files: one
                             record each, named after its file; a file that
                             fails is reported and the others are saved); a
                             file with several y columns is one record per
                             column ("sample: column name"), unless --column
                             chooses one
  library list [--query Q] [--ion I] [--limit N] [--offset N] [--json]
                             newest first; Q words must all match sample,
                             formula, ion, ligands, solvent or note
  library show ID [--json]   one record, its fit and its revisions
  library original ID --out FILE
                             write the stored original file back out
  library export [--csv FILE | --json FILE] [--columns library|results] [--query Q] [--ion I] [--force]
                             CSV (default, to stdout without FILE) or JSON;
                             --columns results: the columns of analyze --csv
  library refit ID [analysis options] [--reset NAME]... [--corrections C] [--json]
                             rerun on the stored original with changed options;
                             kept as a new revision, earlier ones stay; every
                             change in the assignment is listed. A new C choice
                             (--c-over-b, --c, --free-c) replaces the old one;
                             --reset c-over-b|c|free-c|corrections|column|...
                             takes a stored option back to its default
  library remove ID          delete the record, its original and history

Corrections (library add and refit):
  --corrections C   JSON, or a file holding it: {"bands":[{"position":17400},
                    {"position":14450,"flags":["spin-forbidden"]}],"alternative":0}
                    bands: the band list fitted instead of the found bands;
                    alternative: the chosen alternative assignment (from 0)

Details (library add):
  --sample S        sample name (default: the file name without extension)
  --formula F       complex formula, e.g. "[Cr(H2O)6]Cl3"; gives the ion, the
                    ligands and a geometry guess when those are not given
  --ligands L       ligands, comma-separated, e.g. "H2O,Cl"
  --solvent S       --temperature T (kelvin)   --measured YYYY-MM-DD   --note N

${ANALYSIS_USAGE}

  --data DIR        library folder (default $FIELDGAP_DATA, else ./fieldgap-data)
  --database URL    a PostgreSQL library, postgres://user@host:5432/db
                    (default $FIELDGAP_DATABASE_URL, when --data is not given)

Energies are in cm-1.`;

export { fitLine, plusMinus, table };

export const libraryCommand: Command = {
  name: 'library',
  summary: 'save, list, search, refit and export analyses in the results library',
  usage: USAGE,
  async run(argv, io) {
    return runSubcommand('library', SUBCOMMANDS, argv, io);
  },
};

type Handler = (argv: string[], io: CliIo) => Promise<number>;

const SUBCOMMANDS: Record<string, Handler> = {
  add: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...ANALYSIS_OPTIONS, ...DETAIL_OPTIONS, ...DATA, corrections: { type: 'string' }, json: { type: 'boolean' } }, true);
    if (positionals.length > 1) return addMany(positionals, values, io, { withLibrary, detailsFrom, fillFromFormula });
    const file = onePositional(positionals, 'FILE');
    const options = analysisOptionsFrom(values);
    if (values.corrections !== undefined) options.corrections = correctionsFrom(values.corrections, io);
    const details = detailsFrom(values, file);
    fillFromFormula(values.formula, options, details, io);
    const content = readInputFile(file, io.cwd);
    options.fileName = basename(file);
    const [{ analyzeSpectrum, listSpectra }, { storeFileSpectra, notSavedLines, fileRecordsFields }] = await Promise.all([import('../../analysis.js'), import('../../library/store-file.js')]);
    // Every spectrum of the file is its own record (as analyze reads them, and watch stores them).
    const stored = await withLibrary(values, io, (library) => storeFileSpectra({
      content, fileName: basename(file), options, details, library, analyze: analyzeSpectrum, list: listSpectra,
      names: { corrections: '--corrections', column: '--column' },
    }));
    const first = stored.records[0]!;
    if (values.json) io.stdout(`${JSON.stringify({ ...first, ...fileRecordsFields(stored) }, null, 2)}\n`);
    else for (const record of stored.records) io.stdout(savedText(record));
    for (const line of notSavedLines(basename(file), stored.notSaved)) io.stderr(`fieldgap library: ${terminalSafe(line)}\n`);
    if (stored.spectra > 1 && !values.json) {
      const { recordCountText } = await import('../../library/spectra-to-store.js');
      io.stdout(`${terminalSafe(basename(file))}: ${recordCountText(stored.records.length, stored.spectra)}${stored.notSaved.length > 0 ? `, ${stored.notSaved.length} not saved` : ''}\n`);
    }
    return stored.notSaved.length > 0 ? 1 : 0;
  },

  list: async (argv, io) => {
    const { values } = parseCommandArgs(argv, { query: { type: 'string' }, ion: { type: 'string' }, limit: { type: 'string' }, offset: { type: 'string' }, json: { type: 'boolean' }, ...DATA });
    const limit = numberOption('limit', values.limit, { min: 1, max: 1000, integer: true }) ?? 50;
    const offset = numberOption('offset', values.offset, { min: 0, integer: true }) ?? 0;
    const page = await withLibrary(values, io, (library) =>
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
    const record = await withLibrary(values, io, (library) => library.get(id));
    io.stdout(values.json ? `${JSON.stringify(record, null, 2)}\n` : recordText(record));
    return 0;
  },

  original: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { out: { type: 'string' }, force: { type: 'boolean' }, ...DATA }, true);
    const id = idFrom(positionals);
    if (values.out === undefined) throw invalidArgument('--out', '--out FILE is required: where to write the original file');
    const original = await withLibrary(values, io, (library) => library.getOriginal(id));
    writeNew(values.out, original.bytes, values.force === true, io);
    io.stdout(`wrote ${values.out} (${original.size} bytes, sha256 ${original.sha256}, stored as ${original.fileName})\n`);
    return 0;
  },

  export: async (argv, io) => {
    const { values } = parseCommandArgs(argv, { csv: { type: 'string' }, json: { type: 'string' }, columns: { type: 'string' }, query: { type: 'string' }, ion: { type: 'string' }, force: { type: 'boolean' }, ...DATA });
    if (values.csv !== undefined && values.json !== undefined) throw invalidArgument('--json', 'give --csv FILE or --json FILE, not both');
    const columns = choiceOption('--columns', values.columns, ['library', 'results'] as const, 'library');
    if (values.json !== undefined && values.columns !== undefined) throw invalidArgument('--columns', '--columns chooses the CSV columns: give it with --csv FILE, not --json');
    const filter = { ...(values.query !== undefined && { query: values.query }), ...(values.ion !== undefined && { ion: values.ion }) };
    const { exportLibrary } = await import('./library-export.js');
    const target = values.csv ?? values.json;
    await withLibrary(values, io, (library) => exportLibrary(library, filter, values.json !== undefined ? 'json' : columns === 'results' ? 'results-csv' : 'csv', target, values.force === true, io));
    if (target !== undefined && target !== '-') io.stdout(`wrote ${target}\n`);
    return 0;
  },

  refit: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(
      argv,
      { ...ANALYSIS_OPTIONS, corrections: { type: 'string' }, reset: { type: 'string', multiple: true }, json: { type: 'boolean' }, ...DATA },
      true,
    );
    const id = idFrom(positionals);
    const changes: Record<string, unknown> = { ...analysisOptionsFrom(values) };
    if (values.corrections !== undefined) changes['corrections'] = correctionsFrom(values.corrections, io);
    for (const name of values.reset ?? []) {
      const key = RESETTABLE[name.trim().replace(/^--/, '')];
      if (key === undefined) throw invalidArgument('--reset', `--reset: "${name}" is not a stored option (one of ${Object.keys(RESETTABLE).join(', ')})`);
      if (changes[key] !== undefined) throw invalidArgument('--reset', `--reset ${name}: the same refit also sets it`);
      changes[key] = null;
    }
    const [{ analyzeSpectrum }, { refitAnalysis }] = await Promise.all([import('../../analysis.js'), import('../../library/refit.js')]);
    const record = await withLibrary(values, io, (library) =>
      refitAnalysis(library, id, changes, async (content, options) => analyzeSpectrum(content, options as AnalyzeOptions)));
    if (values.json) {
      io.stdout(`${JSON.stringify(record, null, 2)}\n`);
      return 0;
    }
    const before = record.revisions.at(-2)!;
    io.stdout(`refitted #${record.id} "${terminalSafe(record.sample)}": revision ${record.revision}\n  was  ${fitLine(before.summary)}\n  now  ${fitLine(record.summary)}\n${changeLines(record.changes)}${warningLines(record)}`);
    return 0;
  },

  remove: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...DATA }, true);
    const id = idFrom(positionals);
    const sample = await withLibrary(values, io, async (library) => {
      const { sample: name } = await library.get(id);
      await library.remove(id);
      return name;
    });
    io.stdout(`removed #${id} "${terminalSafe(sample)}"\n`);
    return 0;
  },
};

/** The options that name a library: --data DIR or --database URL. */
export interface LibraryFlags {
  data?: string | undefined;
  database?: string | undefined;
}

async function openFor(flags: LibraryFlags, io: CliIo): Promise<Library> {
  const [{ resolveLibraryLocation }, { openLibraryAt }] = await Promise.all([
    import('../../library/location.js'),
    import('../../library/library.js'),
  ]);
  return openLibraryAt(resolveLibraryLocation({ dataFlag: flags.data, databaseFlag: flags.database, env: io.env, cwd: io.cwd }));
}

/**
 * Opens the library named by --database / --data (else FIELDGAP_DATABASE_URL,
 * FIELDGAP_DATA, ./fieldgap-data), runs `fn`, always closes. A string is --data.
 */
export async function withLibrary<T>(flags: LibraryFlags | string | undefined, io: CliIo, fn: (library: Library) => T | Promise<T>): Promise<T> {
  const library = await openFor(typeof flags === 'object' ? flags : { data: flags }, io);
  try {
    return await fn(library);
  } finally {
    await library.close();
  }
}

/** What `library add FILE FILE...` is given. */
export type AddValues = Parameters<typeof analysisOptionsFrom>[0] & DetailValues & LibraryFlags & { corrections?: string; json?: boolean };

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

export type DetailValues = { [K in keyof typeof DETAIL_OPTIONS]?: string };

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

/** What --formula tells when --ion/--d, --ligands or --geometry were not given (the rule: src/library/formula-details.ts). */
export function fillFromFormula(formula: string | undefined, options: AnalyzeOptions, details: { ion?: string; ligands?: string[] }, io: CliIo): void {
  if (formula === undefined) return;
  const found = detailsFromFormula(formula, { ...options, ligands: details.ligands }, '--formula', '--ion');
  if (found.ion !== undefined) options.ion = found.ion;
  if (found.ligands !== undefined) details.ligands = found.ligands;
  if (found.geometry !== undefined) options.geometry = found.geometry;
  for (const note of found.notes) io.stderr(`note: ${note}${note.startsWith('geometry') ? '; --geometry to choose' : ''}\n`);
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

/** The stored options `--reset` takes back to their default, by their CLI names. */
const RESETTABLE: Record<string, string> = {
  'c-over-b': 'cOverB', c: 'c', 'free-c': 'freeC', corrections: 'corrections', column: 'column', 'x-unit': 'xUnit',
  conc: 'concentration', path: 'pathLength', geometry: 'geometry',
};

/** --corrections: JSON text, or the name of a file holding it. */
function correctionsFrom(value: string, io: CliIo): AnalysisCorrections {
  const text = value.trim().startsWith('{') ? value : new TextDecoder().decode(readInputFile(value, io.cwd));
  return checkCorrections(text, '--corrections');
}
