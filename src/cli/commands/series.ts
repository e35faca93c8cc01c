import { basename, extname } from 'node:path';
import { findLigand } from '../../chemistry/ligands.js';
import { invalidArgument } from '../../errors.js';
import type { Ranking } from '../../series/index.js';
import type { Command, CliIo } from '../command.js';
import { expandInputPaths, readInputFile } from '../files.js';
import { choiceOption, parseCommandArgs } from '../options.js';
import type { SeriesReport, SeriesSource } from '../../../server/storage/series.js';
import { ANALYSIS_OPTIONS, ANALYSIS_USAGE, analysisOptionsFrom, plusMinus, table, withLibrary } from './library.js';

/**
 * `fieldgap series`: a ligand series of one metal ion, ranked by 10Dq
 * (spectrochemical) and by 1 − β (nephelauxetic), with uncertainties, the
 * neighbours they do not resolve, and Jørgensen's f and h per ligand.
 *
 * The analyses come from the library (--library, the default when no FILES
 * are given) or from spectrum FILES analysed now with the same options.
 * Each file's ligand: the --ligand options in the order of the files; for a
 * file without one, the last word of its name (split at - _ . and spaces)
 * that fieldgap knows as a ligand: "cr-NH3.csv" → NH3, "Cr_en_2.csv" → en.
 */
const USAGE = `Usage: fieldgap series --ion ION [--library | FILES...] [options] [--json]

Ranks the analyses of one metal ion by 10Dq and by 1 - beta (weakest first;
"~" joins neighbours that their uncertainties do not resolve) and fits
Jørgensen's f and h per ligand.

  --ion ION           the metal ion, e.g. Cr3+ (required)
  --library           use the library's analyses of ION (the default without FILES)
  FILES...            analyse these spectra first (not saved); folders are searched
  --ligand L          the ligand of each file, once per file in the order given;
                      without it, taken from the file name ("cr-NH3.csv" → NH3)
  --criterion C       one-sigma (default: |Δ| < sqrt(σ1² + σ2²)) or two-sigma
  --data DIR          library folder (default $FIELDGAP_DATA, else ./fieldgap-data)
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
        data: { type: 'string' },
        json: { type: 'boolean' },
      },
      true,
    );
    if (values.ion === undefined) throw invalidArgument('--ion', '--ion is required: the metal ion of the series, e.g. --ion Cr3+');
    if (values.library && positionals.length > 0) throw invalidArgument('--library', 'give --library or FILES, not both');
    const criterion = choiceOption('criterion', values.criterion, ['one-sigma', 'two-sigma'], 'one-sigma');
    const { buildSeries, librarySeries } = await import('../../../server/storage/series.js');
    let report: SeriesReport;
    if (positionals.length === 0) {
      if (values.ligand) throw invalidArgument('--ligand', '--ligand names the ligand of each of FILES; with --library the records carry their own');
      report = await withLibrary(values.data, io, (library) => librarySeries(library, values.ion!, { criterion }));
    } else {
      const sources = await analyseFiles(positionals, values.ligand ?? [], analysisOptionsFrom(values), io);
      report = buildSeries(values.ion, sources, { criterion });
    }
    io.stdout(values.json ? `${JSON.stringify(report, null, 2)}\n` : reportText(report));
    return 0;
  },
};

async function analyseFiles(paths: string[], ligands: string[], options: ReturnType<typeof analysisOptionsFrom>, io: CliIo): Promise<SeriesSource[]> {
  const files = expandInputPaths(paths, io.cwd);
  if (ligands.length > files.length) {
    throw invalidArgument('--ligand', `${ligands.length} --ligand options for ${files.length} files: give at most one per file`);
  }
  const [{ analyzeSpectrum }, { summarizeResult }] = await Promise.all([import('../../analysis.js'), import('../../../server/storage/summary.js')]);
  return files.map((file, i): SeriesSource => {
    const ligand = ligands[i] ?? ligandFromFileName(file);
    const result = analyzeSpectrum(readInputFile(file, io.cwd), { ...options, fileName: basename(file) });
    const source: SeriesSource = { id: file, sample: basename(file, extname(file)), ligands: [ligand], summary: summarizeResult(result) };
    if (options.ion !== undefined) source.ion = options.ion;
    return source;
  });
}

/** The last word of the file name that fieldgap knows as a ligand, or an error naming the file. */
export function ligandFromFileName(file: string): string {
  const words = basename(file, extname(file)).split(/[-_.\s]+/).filter((w) => w !== '');
  for (const word of words.reverse()) {
    const ligand = findLigand(word);
    if (ligand) return ligand.key;
  }
  throw invalidArgument(file, 'cannot tell the ligand from the file name: give --ligand for each file (in order) or name the file after its ligand, e.g. cr-NH3.csv');
}

function reportText(report: SeriesReport): string {
  const out = [`${report.ion}: ${report.count} ${report.count === 1 ? 'analysis' : 'analyses'}`, ''];
  out.push('Spectrochemical series (by 10Dq, weakest field first)', rankingTable(report.spectrochemical, '10Dq/cm-1', (v, s) => plusMinus(v, s)), `  ${report.spectrochemical.series}`, '');
  if (report.nephelauxetic.entries.length > 0) {
    out.push('Nephelauxetic series (by 1 - β, least nephelauxetic first)', rankingTable(report.nephelauxetic, 'β', (v, s) => plusMinus(1 - v, s, 2)), `  ${report.nephelauxetic.series}`, '');
  }
  const f = report.factors;
  if (f && f.factors.length > 0) {
    out.push(`Jørgensen factors for ${f.ion} (f = 10Dq/g, g = ${f.g} cm-1${f.k === undefined ? '' : `; h = (1 - β)/k, k = ${f.k}`}; ${f.source})`);
    const rows = [['  LIGAND', 'f', 'TABLE f', 'h', 'TABLE h', 'FROM']];
    for (const x of f.factors) {
      rows.push([
        `  ${x.ligand}`, plusMinus(x.f, x.fUncertainty ?? null, 2), x.tabulatedF?.toFixed(2) ?? '-',
        x.h === undefined ? '-' : plusMinus(x.h, x.hUncertainty ?? null, 2), x.tabulatedH?.toFixed(2) ?? '-',
        `${x.fFrom.length} ${x.fFrom.length === 1 ? 'analysis' : 'analyses'}`,
      ]);
    }
    out.push(table(rows, new Set([1, 2, 3, 4])).trimEnd(), '');
  }
  for (const s of report.skipped) out.push(`skipped ${s.id} (${s.sample}): ${s.reason}`);
  for (const n of report.notes) out.push(`note: ${n}`);
  return `${out.join('\n').trimEnd()}\n`;
}

function rankingTable(ranking: Ranking, heading: string, show: (value: number, sd: number) => string): string {
  const rows = [['  #', 'LIGAND', 'SAMPLE', 'ID', heading, '']];
  for (const e of ranking.entries) {
    rows.push([`  ${e.position}`, e.ligandLabel, e.sample, e.id ?? '', show(e.value, e.uncertainty), e.overlapsNext ? '~ next' : '']);
  }
  return table(rows, new Set([0, 4])).trimEnd();
}
