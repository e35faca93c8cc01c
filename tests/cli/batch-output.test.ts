import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvSink, jsonSink, tableLine, tableSink, tableWidths } from '../../src/cli/batch-output.js';
import { runInOrder } from '../../src/cli/batch-run.js';
import { CSV_COLUMNS, outcomeJsonEntry, type BatchRow, type CsvRow, type Outcome, type SummaryRow } from '../../src/cli/batch-rows.js';

/**
 * The batch outputs written row by row against the same outputs written
 * whole, as the CLI did before (Papa.unparse of all rows, JSON.stringify of
 * all results): the slow, obviously correct references.
 */

/** Outcomes with the awkward cells: commas, quotes, line breaks in a message, leading spaces, empty cells. */
function outcomes(): Outcome[] {
  const list: Outcome[] = [];
  for (let i = 0; i < 7; i++) {
    const item = { file: `dir/s${i}.csv`, column: i === 3 ? 2 : undefined, label: i === 3 ? 'dir/s3.csv#2 (B, "wet")' : `dir/s${i}.csv` };
    if (i % 3 === 1) list.push({ item, error: { code: 'parse-error', message: `line ${i}: "x", then\nmore`, path: `dir/s${i}.csv:${i}` } });
    else list.push({ item, result: { warnings: i === 0 ? [] : [' leading space', 'a, b'], nested: { values: [1.5, null, -0] }, text: 'é ± ✓' } as never });
  }
  return list;
}

function csvOf(outcome: Outcome): CsvRow {
  const row = {} as CsvRow;
  CSV_COLUMNS.forEach((c, i) => (row[c] = outcome.error ? (c === 'file' ? outcome.item.label : '') : i % 2 ? i * 1.25 : `${outcome.item.label} ${c}, "q"`));
  return row;
}

function rowOf(outcome: Outcome): BatchRow {
  const summary = { file: outcome.item.label, ion: 'Cr3+', tenDq: '17000 ± 170', b: '680 ± 41', beta: '0.74', spinState: 'no-choice', rms: '0', warnings: 'w' } as SummaryRow;
  return { summary, csv: csvOf(outcome), json: outcomeJsonEntry(outcome), failed: outcome.error !== undefined };
}

function collect(make: (write: (t: string) => void) => { row: (r: BatchRow) => void; end: () => void }, rows: BatchRow[]): string {
  let text = '';
  const sink = make((t) => void (text += t));
  for (const row of rows) sink.row(row);
  sink.end();
  return text;
}

describe('batch outputs written row by row', () => {
  it('the CSV summary is byte for byte Papa.unparse of all rows', () => {
    const all = outcomes();
    for (const n of [1, 2, all.length]) {
      const some = all.slice(0, n);
      const whole = `${Papa.unparse(some.map(csvOf), { columns: [...CSV_COLUMNS] })}\n`;
      expect(collect(csvSink, some.map(rowOf))).toBe(whole);
    }
  });

  it('the JSON results are byte for byte JSON.stringify of all results', () => {
    const all = outcomes();
    const json = ({ item, result, error }: Outcome) => ({ file: item.file, ...(item.column !== undefined && { column: item.column }), ...(result ?? {}), ...(error && { error }) });
    for (const n of [0, 1, 2, all.length]) {
      const some = all.slice(0, n);
      const whole = `${JSON.stringify({ results: some.map(json) }, null, 2)}\n`;
      expect(collect(jsonSink, some.map(rowOf))).toBe(whole);
    }
  });

  it('the table: the heading first, the file column as wide as the longest path listed', () => {
    const rows = outcomes().map(rowOf);
    const labels = outcomes().map((o) => o.item.file);
    const text = collect((w) => tableSink(w, labels), rows);
    const lines = text.trimEnd().split('\n');
    // The one label wider than the paths listed ('dir/s3.csv#2 (B, "wet")') stands on a line of its own.
    expect(lines).toHaveLength(rows.length + 2);
    expect(lines[0]).toMatch(/^file\s+ion\s+10Dq \/ cm-1\s+B \/ cm-1\s+beta\s+spin state\s+rms \/ cm-1\s+warnings$/);
    const widths = tableWidths(labels);
    expect(widths[0]).toBe(Math.max(...labels.map((l) => l.length)));
    // Values no wider than their usual width line up under their heading.
    const at = lines[0]!.indexOf('10Dq');
    const own = lines.indexOf('dir/s3.csv#2 (B, "wet")');
    expect(own).toBeGreaterThan(0);
    expect(lines[own + 1]!.startsWith(' '.repeat(widths[0]!))).toBe(true);
    for (const line of lines.slice(1).filter((_l, i) => i + 1 !== own)) expect(line.indexOf('17000')).toBe(at);
    expect(tableLine({ ...rows[0]!.summary, warnings: 'x'.repeat(80) }, widths)).toMatch(/x{69}…\n$/);
  });
});

describe('runInOrder', () => {
  it('hands results on in list order whatever order they finish in, with no more than the window in flight', async () => {
    const items = Array.from({ length: 25 }, (_v, i) => i);
    const pending: Array<{ item: number; resolve: (v: string) => void }> = [];
    let inFlight = 0;
    let most = 0;
    const taken: number[] = [];
    const done = runInOrder(items, (item) => new Promise<string>((resolve) => {
      inFlight++;
      most = Math.max(most, inFlight);
      pending.push({ item, resolve: (v) => { inFlight--; resolve(v); } });
    }), (result, item, index) => {
      expect(result).toBe(`r${item}`);
      expect(index).toBe(item);
      taken.push(item);
    }, 4);
    // Finish the newest task first, each time, until none is left (no clock: each step waits for the loop to react).
    while (taken.length < items.length) {
      await new Promise((r) => setImmediate(r));
      const last = pending.pop();
      last?.resolve(`r${last.item}`);
    }
    await done;
    expect(taken).toEqual(items);
    expect(most).toBe(4);
  });

  it('passes on a failure of a task in turn', async () => {
    const taken: number[] = [];
    const run = runInOrder([0, 1, 2], async (i) => {
      if (i === 1) throw new Error('worker died');
      return i;
    }, (r) => void taken.push(r), 3);
    await expect(run).rejects.toThrow('worker died');
    expect(taken).toEqual([0]);
  });
});
