import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../src/analysis.js';
import { peakTableFitCommand, peakTablePositions } from '../src/analysis-peak-table.js';
import { runCliCaptured } from './helpers/cli-run.js';

/** A JCAMP-DX PEAK TABLE: the error prints the fit command with the positions (AUDIT2 finding 24). */
const peakTable = readFileSync(fileURLToPath(new URL('../fixtures/spectra/peak-table.jdx', import.meta.url)));

describe('peak table', () => {
  it('analyze refuses it with the ready fit command, positions in cm-1', () => {
    expect(() => analyzeSpectrum(peakTable, { fileName: 'p.jdx', ion: 'Cr3+' })).toThrow(
      expect.objectContaining({ code: 'unsupported-format', path: 'p.jdx:##PEAK TABLE', message: expect.stringMatching(/fit the positions directly: fieldgap fit --ion Cr3\+ --bands 17400,24600$/) }),
    );
  });

  it('the command is one the CLI runs', async () => {
    const { code, out } = await runCliCaptured(peakTableFitCommand([17400, 24600], { ion: 'Cr3+' }).split(' ').slice(1));
    expect(code).toBe(0);
    expect(out).toContain('10Dq');
  });

  it('nm positions become cm-1, ascending; a formula is quoted for the shell; the geometry is kept', () => {
    expect(peakTablePositions({ x: Float64Array.of(575, 408), xUnit: 'nm' })).toEqual([17391, 24510]);
    expect(peakTableFitCommand([4000, 15000], { formula: '[CoCl4]2-', geometry: 'tetrahedral' })).toBe("fieldgap fit --formula '[CoCl4]2-' --geometry tetrahedral --bands 4000,15000");
  });
});
