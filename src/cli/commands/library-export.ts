import { closeSync, openSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { resolve } from 'node:path';
import { FieldgapError, invalidArgument } from '../../errors.js';
import type { Library } from '../../library/library.js';
import type { AnalysisSummary, ListOptions } from '../../library/types.js';
import type { CliIo } from '../command.js';

/** Records a page while exporting: a few megabytes of CSV, or of full records for JSON. */
const PAGE = 500;

/**
 * `library export`: the records matching the filter as CSV (summary columns)
 * or JSON (full records), streamed a page at a time to stdout or to a new
 * file, so 100 000 records never sit in memory at once. A new file is
 * created before any record is read (an existing one is refused unless
 * `force`, and then replaced only once the export is whole), and removed
 * again if the export fails part way: no half export is left behind looking
 * like a whole one.
 */
export async function exportLibrary(
  library: Library,
  filter: Pick<ListOptions, 'query' | 'ion'>,
  format: 'csv' | 'results-csv' | 'json',
  target: string | undefined,
  force: boolean,
  io: CliIo,
): Promise<void> {
  const chunks = format === 'csv' ? await csvChunks(library, filter) : format === 'results-csv' ? await resultsCsvChunks(library, filter) : jsonChunks(library, filter);
  if (target === undefined || target === '-') {
    for await (const chunk of chunks) io.stdout(chunk);
    return;
  }
  const path = resolve(io.cwd, target);
  // With --force the old file stays whole until the new one is: written beside it, then renamed over it.
  const writing = force ? `${path}.partial-${process.pid}` : path;
  const fd = openNew(writing, target);
  let open = true;
  try {
    for await (const chunk of chunks) writeSync(fd, chunk);
    closeSync(fd);
    open = false;
    if (writing !== path) renameSync(writing, path);
  } catch (error) {
    if (open) closeSync(fd);
    unlinkSync(writing);
    throw error;
  }
}

async function csvChunks(library: Library, filter: Pick<ListOptions, 'query' | 'ion'>): Promise<AsyncIterable<string>> {
  const { libraryCsvChunks } = await import('../../library/export.js');
  return libraryCsvChunks(library.listPages(filter, PAGE));
}

/** The results table of `analyze --csv` (src/report/results-csv.ts), one page of records at a time: the bytes of libraryResultsCsv. */
async function resultsCsvChunks(library: Library, filter: Pick<ListOptions, 'query' | 'ion'>): Promise<AsyncIterable<string>> {
  const { resultsCsvInputOf } = await import('../../library/export.js');
  const { csvLine } = await import('../../report/csv.js');
  const { RESULTS_CSV_COLUMNS, RESULTS_CSV_END, RESULTS_CSV_NEWLINE, resultsCsvLine, resultsCsvRow } = await import('../../report/results-csv.js');
  return (async function* chunks() {
    yield csvLine(RESULTS_CSV_COLUMNS);
    for await (const page of library.listPages(filter, PAGE)) {
      const records = await library.getMany(page.map((s: AnalysisSummary) => s.id));
      yield records.map((r) => `${RESULTS_CSV_NEWLINE}${resultsCsvLine(resultsCsvRow(resultsCsvInputOf(r)))}`).join('');
    }
    yield RESULTS_CSV_END;
  })();
}

/** `JSON.stringify({ analyses }, null, 2)` and a newline, written one record at a time. */
async function* jsonChunks(library: Library, filter: Pick<ListOptions, 'query' | 'ion'>): AsyncGenerator<string> {
  let first = true;
  for await (const page of library.listPages(filter, PAGE)) {
    const records = await library.getMany(page.map((s: AnalysisSummary) => s.id));
    let text = '';
    for (const record of records) {
      text += `${first ? '{\n  "analyses": [' : ','}\n    ${JSON.stringify(record, null, 2).replaceAll('\n', '\n    ')}`;
      first = false;
    }
    yield text;
  }
  yield first ? '{\n  "analyses": []\n}\n' : '\n  ]\n}\n';
}

function openNew(path: string, target: string): number {
  try {
    return openSync(path, 'wx');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') throw invalidArgument(target, 'the file exists; choose another name or add --force to replace it');
    throw new FieldgapError('invalid-argument', `cannot write the file (${code ?? 'error'})`, target);
  }
}
