/**
 * What `fieldgap library` prints as text: a record, the list of records, a
 * fit summary line, the changes a refit made. Pure: strings in, strings out.
 */
import type { AnalysisRecord, AnalysisSummary, FitSummary } from '../../library/types.js';
import type { AssignmentChange } from '../../library/refit.js';
import { terminalSafe } from '../terminal-text.js';
import { formatPlusMinus } from '../../report/plus-minus.js';
import { NO_SPIN_STATE_CHOICE, spinStateWords } from '../../report/spin-state-wording.js';
import { textTableLines, type ColumnAlign } from '../../report/text-table.js';
import type { FitResult } from '../../fit/types.js';

/** The lines `library add` prints for a saved record (one file or many), stored text neutralised. */
export function savedText(saved: AnalysisRecord): string {
  return `saved #${saved.id} "${terminalSafe(saved.sample)}"${saved.ion ? ` (${terminalSafe(saved.ion)})` : ''}\n  ${fitLine(saved.summary)}\n${warningLines(saved)}`;
}

/** "17400 ± 150" with the uncertainty to 2 significant figures and the value to match. */
export function plusMinus(value: number | null, sd: number | null, minDecimals = 0): string {
  return value === null ? '-' : formatPlusMinus(value, sd, { digits: 'two-significant', minDigits: minDecimals, maxDigits: 6 });
}

export function fitLine(s: FitSummary): string {
  if (s.tenDq === null) return `no ligand-field fit${s.status ? ` (${s.status})` : ''}`;
  const parts = [`10Dq = ${plusMinus(s.tenDq, s.tenDqSd)} cm-1`];
  if (s.b !== null) parts.push(`B = ${plusMinus(s.b, s.bSd)} cm-1`);
  if (s.beta !== null) parts.push(`β = ${plusMinus(s.beta, s.betaSd, 2)}`);
  // A sentence, not a table cell: the one wording of src/report (a stored summary has no d or geometry to add).
  if (s.spinState) parts.push(s.spinState === 'no-choice' ? NO_SPIN_STATE_CHOICE : s.spinState);
  if (s.rmsResidual !== null) parts.push(`rms ${s.rmsResidual.toFixed(0)} cm-1`);
  return parts.join('   ');
}

/** Every change in the assignment, one line each; says so when there is none. */
export function changeLines(changes: readonly AssignmentChange[]): string {
  if (changes.length === 0) return '  assignment unchanged\n';
  const names = { spinState: 'spin state', groundTerm: 'ground term', cMode: 'C' } as const;
  return changes
    .map((c) => {
      const words = (v: string | null | undefined) => (v === 'no-choice' && c.what === 'spinState' ? NO_SPIN_STATE_CHOICE : v ?? 'not assigned');
      const was = words(c.before);
      const now = words(c.after);
      return c.what === 'band' ? `  band ${c.observed!.toFixed(0)} cm-1: ${was} → ${now}\n` : `  ${names[c.what]}: ${was} → ${now}\n`;
    })
    .join('');
}

export function warningLines(record: AnalysisRecord): string {
  return (record.result.warnings ?? []).map((w) => `  warning: ${terminalSafe(w)}\n`).join('');
}

/** Columns padded to their widest cell; the first row is the header. */
export function table(rows: string[][], rightAligned: ReadonlySet<number> = new Set()): string {
  const align = rows[0]!.map((_, c): ColumnAlign => (rightAligned.has(c) ? 'right' : 'left'));
  return `${textTableLines(rows, { align }).join('\n')}\n`;
}

/** The list's table; OWNER and GROUP columns where users exist (a record on the page has an owner). */
export function summaryTable(analyses: AnalysisSummary[]): string {
  const users = analyses.some((a) => a.owner !== undefined || a.group !== undefined);
  const rows = [['ID', 'SAMPLE', 'FORMULA', 'ION', '10Dq/cm-1', 'B/cm-1', 'β', 'SPIN', 'RMS/cm-1', 'SAVED', ...(users ? ['OWNER', 'GROUP'] : [])]];
  for (const a of analyses) {
    const s = a.summary;
    rows.push([
      String(a.id), clip(a.sample, 28), clip(a.formula ?? '', 22), terminalSafe(a.ion ?? ''),
      plusMinus(s.tenDq, s.tenDqSd), plusMinus(s.b, s.bSd), plusMinus(s.beta, s.betaSd, 2), s.spinState === 'no-choice' ? spinStateWords(s.spinState) : s.spinState ?? '',
      s.rmsResidual === null ? '-' : s.rmsResidual.toFixed(0), a.createdAt.slice(0, 10),
      ...(users ? [clip(a.owner ?? '-', 16), clip(a.group ?? '-', 16)] : []),
    ]);
  }
  return table(rows, new Set([0, 4, 5, 6, 8]));
}

export function clip(stored: string, width: number): string {
  const text = terminalSafe(stored);
  return [...text].length <= width ? text : `${[...text].slice(0, width - 1).join('')}…`;
}

export function recordText(r: AnalysisRecord): string {
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
  // A record saved by an older fieldgap may lack the fit or a field of an assignment.
  const assignments: Partial<FitResult['assignments'][number]>[] = r.result.fit?.assignments ?? [];
  if (assignments.length > 0) {
    const rows = [['  OBSERVED/cm-1', 'CALCULATED/cm-1', 'TERM']];
    // The label keeps the parent term ("3T1g(P)"): by the bare term both Ni(II) bands read "3T1g". Older records may lack it.
    for (const a of assignments) rows.push([`  ${a.observed?.toFixed(0) ?? '-'}`, a.calculated?.toFixed(0) ?? '-', terminalSafe(a.label ?? a.term ?? '')]);
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
