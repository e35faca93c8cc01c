/**
 * A one-line progress bar for long batch runs, drawn on stderr only when the
 * output is a terminal; when output is piped it draws nothing, so logs and
 * redirected files stay clean.
 */
export interface Progress {
  tick(label: string): void;
  done(): void;
}

export function createProgress(total: number, enabled: boolean, write: (text: string) => void): Progress {
  if (!enabled || total < 2) return { tick() {}, done() {} };
  let count = 0;
  const width = 24;
  return {
    tick(label) {
      count += 1;
      const filled = Math.round((count / total) * width);
      const bar = '#'.repeat(filled) + '-'.repeat(width - filled);
      const name = label.length > 40 ? `…${label.slice(-39)}` : label;
      write(`\r[${bar}] ${count}/${total} ${name}`.padEnd(90));
    },
    done() {
      write(`\r${' '.repeat(90)}\r`);
    },
  };
}
