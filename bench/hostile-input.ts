/**
 * Hostile inputs benchmark: time and memory to refuse inputs that cost far
 * more than their size. Targets (issue 16): the 52-byte JCAMP-DX DUP bomb
 * refused in under 100 ms and 50 MB; a megabyte run of blanks in a PEAK
 * TABLE read in linear time. Memory is the growth of RSS and heap over the
 * refusal (the process's own baseline excluded). Speed targets live here,
 * never in unit tests.
 */
import { parseSpectrumText } from '../src/spectrum/index.js';

const BOMB = '##TITLE=b\n##JCAMP-DX=4.24\n##XYDATA=(X++(Y..Y))\n1 1s99999999\n##END=\n';

function measure(label: string, fn: () => void, target?: { ms: number; mb: number }): void {
  const rss0 = process.memoryUsage().rss;
  const heap0 = process.memoryUsage().heapUsed;
  const t0 = performance.now();
  let outcome = 'accepted';
  try {
    fn();
  } catch (error) {
    outcome = `refused (${(error as { code?: string }).code ?? 'error'})`;
  }
  const ms = performance.now() - t0;
  const rssMb = (process.memoryUsage().rss - rss0) / 1e6;
  const heapMb = (process.memoryUsage().heapUsed - heap0) / 1e6;
  const verdict = target === undefined ? '' : ms < target.ms && Math.max(rssMb, heapMb) < target.mb ? '  ok' : '  OVER TARGET';
  process.stdout.write(`${label}: ${outcome} in ${ms.toFixed(2)} ms, RSS +${rssMb.toFixed(1)} MB, heap +${heapMb.toFixed(1)} MB${verdict}\n`);
}

export async function run(): Promise<void> {
  const bytes = new TextEncoder().encode(BOMB);
  measure(`JCAMP-DX DUP bomb (${bytes.length} bytes)`, () => parseSpectrumText(bytes, { fileName: 'bomb.jdx' }), { ms: 100, mb: 50 });
  const blanks = new TextEncoder().encode(`##TITLE=p\n##JCAMP-DX=4.24\n##XUNITS=1/CM\n##YUNITS=ABSORBANCE\n##PEAK TABLE=(XY..XY)\n17400 0.31${' '.repeat(1_000_000)}24600 0.27\n##END=\n`);
  measure('PEAK TABLE with 1 MB of blanks', () => parseSpectrumText(blanks, { fileName: 'blanks.jdx' }), { ms: 1000, mb: 50 });
  const wide = new TextEncoder().encode(`##TITLE=x\n##JCAMP-DX=4.24\n##XYDATA=(XY..XY)\n400 1${' '.repeat(1_000_000)}2\n##END=\n`);
  measure('XYDATA in an unread form, 1 MB line', () => parseSpectrumText(wide, { fileName: 'wide.jdx' }), { ms: 100, mb: 50 });
}
