import { basename, extname } from 'node:path';
import { findLigand } from '../../chemistry/ligands.js';
import { invalidArgument, isFieldgapError } from '../../errors.js';
import type { Ranking } from '../../series/index.js';
import type { Command, CliIo } from '../command.js';
import { expandInputPaths, readInputFile } from '../files.js';
import { numberOption, parseCommandArgs } from '../options.js';
import { checkCliOption, criterionField } from '../../analysis-option-schema.js';
import type { SeriesReport, SeriesSource } from '../../library/series.js';
import { pageLine, SERIES_PAGE_SIZE } from '../../library/series-page.js';
import { ANALYSIS_OPTIONS, ANALYSIS_USAGE, analysisOptionsFrom } from '../analysis-options.js';
import { plusMinus, table, withLibrary } from './library.js';

/**
 * `fieldgap series`: a ligand series of one metal ion, ranked by 10Dq
 * (spectrochemical) and by 1 − β (nephelauxetic), with uncertainties, the
 * neighbours they do not resolve, and Jørgensen's f and h per ligand.
 *
 * The analyses come from the library (--library, the default when no FILES
 * are given) or from spectrum FILES analysed now with the same options.
 * A file with several y columns gives one spectrum per column (unless
 * --column picks one). Each spectrum's ligand: the --ligand options in
 * order; for a spectrum without one, the last word of its file name, or of
 * its column header for a many-column file (split at - _ . : and spaces),
 * that fieldgap knows as a ligand: "cr-NH3.csv" → NH3, "Cr-en" → en.
 */
const USAGE = `Usage: fieldgap series --ion ION [--library | FILES...] [options] [--json]

Ranks the analyses of one metal ion by 10Dq and by 1 - beta (weakest first;
"~" joins neighbours that their uncertainties do not resolve) and fits
Jørgensen's f and h per ligand.

  --ion ION           the metal ion, e.g. Cr3+ (required)
  --library           use the library's analyses of ION (the default without FILES)
  FILES...            analyse these spectra first (not saved); folders are searched;
                      a file with several y columns gives one spectrum per column
  --ligand L          the ligand of each spectrum, once per spectrum in order;
                      without it, taken from the file name ("cr-NH3.csv" → NH3)
                      or the column header ("Cr-en" → en)
  --criterion C       one-sigma (default: |Δ| < sqrt(σ1² + σ2²)) or two-sigma
  --limit N           analyses shown per list (rankings, skipped, notes; default 50);
                      the ligand table and the factors always cover every analysis
  --offset N          skip the first N analyses of each list (default 0)
  --all               every analysis in every list (the whole report)
  --data DIR          library folder (default $FIELDGAP_DATA, else ./fieldgap-data)
  --database URL      a PostgreSQL library (default $FIELDGAP_DATABASE_URL)
  --json              print the whole report as JSON

${ANALYSIS_USAGE}

Energies are in cm-1; ± is one standard deviation.`;

export const seriesCommand: Command = {
  name: 'series',
  summary: 'rank a ligand series of one ion by 10Dq and beta, and fit Jørgensen f and h',
  usage: USAGE,
  async run(argv, io) {
    const { values, positionals } = parseCommandArgs(
      argv,
      {
        ...ANALYSIS_OPTIONS,
        library: { type: 'boolean' },
        ligand: { type: 'string', multiple: true },
        criterion: { type: 'string' },
        limit: { type: 'string' },
        offset: { type: 'string' },
        all: { type: 'boolean' },
        data: { type: 'string' },
        database: { type: 'string' },
        json: { type: 'boolean' },
      },
      true,
    );
    if (values.ion === undefined) throw invalidArgument('--ion', '--ion is required: the metal ion of the series, e.g. --ion Cr3+');
    if (values.library && positionals.length > 0) throw invalidArgument('--library', 'give --library or FILES, not both');
    // The REST field's check (src/analysis-option-schema.ts); typed in any case, as the other choices are.
    const criterion = values.criterion === undefined ? 'one-sigma' : checkCliOption(criterionField, values.criterion.trim().toLowerCase(), 'criterion');
    const all = values.all === true;
    if (all && (values.limit !== undefined || values.offset !== undefined)) throw invalidArgument('--all', 'give --all or --limit/--offset, not both');
    const limit = numberOption('limit', values.limit, { min: 1, max: 100_000, integer: true }) ?? SERIES_PAGE_SIZE;
    const offset = numberOption('offset', values.offset, { min: 0, integer: true }) ?? 0;
    const [{ buildSeries, librarySeries }, { pageOfSeries }] = await Promise.all([import('../../library/series.js'), import('../../library/series-page.js')]);
    let report: SeriesReport;
    if (positionals.length === 0) {
      if (values.ligand) throw invalidArgument('--ligand', '--ligand names the ligand of each of FILES; with --library the records carry their own');
      report = await withLibrary({ data: values.data, database: values.database }, io, (library) => librarySeries(library, values.ion!, all ? { criterion, all } : { criterion, limit, offset }));
    } else {
      const { sources, failed } = await analyseFiles(positionals, values.ligand ?? [], analysisOptionsFrom(values), io);
      const whole = buildSeries(values.ion, sources, { criterion });
      whole.skipped.push(...failed);
      whole.page.skippedTotal = whole.skipped.length;
      report = all ? whole : pageOfSeries(whole, offset, limit);
    }
    io.stdout(values.json ? `${JSON.stringify(report, null, 2)}\n` : reportText(report));
    return 0;
  },
};

interface SpectrumToAnalyse {
  file: string;
  content: Uint8Array;
  fileName: string;
  sample: string;
  /** The y column of a many-column file; undefined for a file's only spectrum. */
  column: number | undefined;
  /** Where its ligand is read from when --ligand does not say: the file or the column header. */
  name: string;
}

/** Analyses that failed: left out of the series with the reason, unless every one failed. */
interface AnalysedFiles {
  sources: SeriesSource[];
  failed: { id: string; sample: string; reason: string }[];
}

async function analyseFiles(paths: string[], ligands: string[], options: ReturnType<typeof analysisOptionsFrom>, io: CliIo): Promise<AnalysedFiles> {
  const files = expandInputPaths(paths, io.cwd);
  const [{ analyzeSpectrum, listSpectra }, { summarizeResult }] = await Promise.all([import('../../analysis.js'), import('../../library/summary.js')]);
  // One spectrum per file, or per y column of a file that has several (unless --column picks one).
  const spectra = files.flatMap((file): SpectrumToAnalyse[] => {
    const content = readInputFile(file, io.cwd);
    const fileName = basename(file);
    const columns = options.column === undefined ? listSpectra(content, { fileName, ...(options.xUnit !== undefined && { xUnit: options.xUnit }) }) : [];
    if (columns.length <= 1) return [{ file, content, fileName, sample: basename(file, extname(file)), column: undefined, name: file }];
    return columns.map((c) => ({ file, content, fileName, sample: `${basename(file, extname(file))}: ${c.name}`, column: c.column, name: c.name }));
  });
  if (ligands.length > spectra.length) {
    throw invalidArgument('--ligand', `${ligands.length} --ligand options for ${spectra.length} spectra: give at most one per spectrum`);
  }
  const out: AnalysedFiles = { sources: [], failed: [] };
  let firstError: unknown;
  spectra.forEach((sp, i) => {
    const ligand = ligands[i] ?? ligandFromFileName(sp.name);
    const id = sp.column === undefined ? sp.file : `${sp.file}:${sp.column}`;
    let result;
    try {
      result = analyzeSpectrum(sp.content, { ...options, fileName: sp.fileName, ...(sp.column !== undefined && { column: sp.column }) });
    } catch (error) {
      if (!isFieldgapError(error)) throw error;
      firstError ??= error;
      out.failed.push({ id, sample: sp.sample, reason: `analysis failed: ${error.message}` });
      return;
    }
    const source: SeriesSource = { id, sample: sp.sample, ligands: [ligand], summary: summarizeResult(result) };
    if (options.ion !== undefined) source.ion = options.ion;
    out.sources.push(source);
  });
  if (out.sources.length === 0) throw firstError;
  return out;
}

/** The last word of a file name or column header that fieldgap knows as a ligand, or an error naming it. */
export function ligandFromFileName(file: string): string {
  const words = basename(file, extname(file)).split(/[-_.:\s]+/).filter((w) => w !== '');
  for (const word of words.reverse()) {
    const ligand = findLigand(word);
    if (ligand) return ligand.key;
  }
  throw invalidArgument(file, 'cannot tell the ligand from the name: give --ligand for each spectrum (in order) or name the file (or column) after its ligand, e.g. cr-NH3.csv');
}

function reportText(report: SeriesReport): string {
  const { page } = report;
  const out = [`${report.ion}: ${report.count} ${report.count === 1 ? 'analysis' : 'analyses'}`, ''];
  const shownOf = (shown: number, total: number, what: string) => {
    const line = pageLine(page, shown, total, what);
    return line === undefined ? [] : [`  (${line})`];
  };
  out.push(
    'Spectrochemical series (by 10Dq, weakest field first)', rankingTable(report.spectrochemical, '10Dq/cm-1', (v, s) => plusMinus(v, s)), `  ${report.spectrochemical.series}`,
    ...shownOf(report.spectrochemical.entries.length, page.total, 'in the ranking'), '',
  );
  if (page.nephelauxeticTotal > 0) {
    out.push(
      'Nephelauxetic series (by 1 - β, least nephelauxetic first)', rankingTable(report.nephelauxetic, 'β', (v, s) => plusMinus(1 - v, s, 2)), `  ${report.nephelauxetic.series}`,
      ...shownOf(report.nephelauxetic.entries.length, page.nephelauxeticTotal, 'in the ranking'), '',
    );
  }
  out.push(ligandText(report), '');
  const f = report.factors;
  if (f && f.factors.length > 0) {
    out.push(`Jørgensen factors for ${f.ion} (f = 10Dq/g, g = ${f.g} cm-1${f.k === undefined ? '' : `; h = (1 - β)/k, k = ${f.k}`}; ${f.source})`);
    const rows = [['  LIGAND', 'f', 'TABLE f', 'h', 'TABLE h', 'FROM']];
    for (const x of f.factors) {
      rows.push([
        `  ${x.ligand}`, plusMinus(x.f, x.fUncertainty ?? null, 2), x.tabulatedF?.toFixed(2) ?? '-',
        x.h === undefined ? '-' : plusMinus(x.h, x.hUncertainty ?? null, 2), x.tabulatedH?.toFixed(2) ?? '-',
        `${x.fCount} ${x.fCount === 1 ? 'analysis' : 'analyses'}`,
      ]);
    }
    out.push(table(rows, new Set([1, 2, 3, 4])).trimEnd(), '');
  }
  for (const s of report.skipped) out.push(`skipped ${s.id} (${s.sample}): ${s.reason}`);
  out.push(...shownOf(report.skipped.length, page.skippedTotal, 'left out'));
  for (const n of report.notes) out.push(`note: ${n}`);
  return `${out.join('\n').trimEnd()}\n`;
}

/** The ligands with their means, places and factors: what the series says at any size. */
function ligandText(report: SeriesReport): string {
  const rows = [['  #', 'LIGAND', 'N', '10Dq/cm-1', 'β', 'f', 'h']];
  for (const l of report.ligands) {
    rows.push([
      `  ${l.spectrochemicalPosition}`, l.ligand, String(l.count), plusMinus(l.tenDq, l.tenDqUncertainty),
      l.beta === null ? '-' : plusMinus(l.beta, l.betaUncertainty, 2), l.f === null ? '-' : plusMinus(l.f, l.fUncertainty, 2), l.h === null ? '-' : plusMinus(l.h, l.hUncertainty, 2),
    ]);
  }
  const lines = [`Ligands (mean of their analyses, weakest field first; ${report.count} ${report.count === 1 ? 'analysis' : 'analyses'})`, table(rows, new Set([0, 2, 3, 4, 5, 6])).trimEnd(), `  ${report.ligandSeries.spectrochemical}`];
  if (report.ligandSeries.nephelauxetic !== '') lines.push(`  by 1 - β: ${report.ligandSeries.nephelauxetic}`);
  return lines.join('\n');
}

function rankingTable(ranking: Ranking, heading: string, show: (value: number, sd: number) => string): string {
  const rows = [['  #', 'LIGAND', 'SAMPLE', 'ID', heading, '']];
  for (const e of ranking.entries) {
    rows.push([`  ${e.position}`, e.ligandLabel, e.sample, e.id ?? '', show(e.value, e.uncertainty), e.overlapsNext ? '~ next' : '']);
  }
  return table(rows, new Set([0, 4])).trimEnd();
}
