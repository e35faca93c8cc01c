import { describe, expect, it } from 'vitest';
import { csvRow, summaryRow, type Outcome } from '../../src/cli/batch-rows.js';

/**
 * AUDIT2 finding 7: the `analyze` summary table is for people and said
 * "no-choice"; it now says the page's "one possible". The --csv summary keeps
 * the value itself for scripts.
 */
function outcome(spinState: string): Outcome {
  const fit = {
    ion: 'Cr3+', d: 3, tenDq: 17446, b: 725.4, c: 3042, beta: 0.79, spinState, rmsResidual: 1,
    uncertainty: { tenDq: 139, b: 7.5, c: 31, beta: 0.008 },
  };
  return { item: { file: 'a.csv', column: undefined, label: 'a.csv' }, result: { fit, warnings: [] } as never };
}

describe('analyze summary table: spin state cell', () => {
  it('says "one possible" where d^n has one spin state', () => {
    expect(summaryRow(outcome('no-choice')).spinState).toBe('one possible');
  });

  it('keeps high-spin and low-spin as they are', () => {
    expect(summaryRow(outcome('high-spin')).spinState).toBe('high-spin');
    expect(summaryRow(outcome('low-spin')).spinState).toBe('low-spin');
  });

  it('the CSV row keeps the value itself', () => {
    const row = csvRow(outcome('no-choice'));
    expect(row.spinState).toBe('no-choice');
  });
});

describe('analyze summary table: the spin state column', () => {
  it('is wide enough for "one possible", so the rms column stays under its heading', async () => {
    const { tableLine, tableWidths } = await import('../../src/cli/batch-output.js');
    const widths = tableWidths(['a.csv']);
    const head = tableLine({ file: 'file', ion: 'ion', tenDq: '10Dq / cm-1', b: 'B / cm-1', beta: 'beta', spinState: 'spin state', rms: 'rms / cm-1', warnings: 'warnings' }, widths);
    const row = tableLine(summaryRow(outcome('no-choice')), widths);
    const at = head.indexOf('rms / cm-1');
    expect(row.slice(at - 2, at + 1)).toBe('  1'); // the rms value (1) starts under its heading, after the column gap
  });
});
