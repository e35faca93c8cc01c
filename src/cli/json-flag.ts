/**
 * `--json` is both a flag ("print JSON") and, in batch runs, an option with a
 * file ("--json results.json"). parseArgs cannot express an optional value, so
 * this splits it off first: `--json=FILE`, or `--json` followed by a word
 * ending in .json, names a file; a bare `--json` is the flag.
 */
export function splitJsonOption(argv: string[]): { argv: string[]; jsonFlag: boolean; jsonFile: string | undefined } {
  const rest: string[] = [];
  let jsonFlag = false;
  let jsonFile: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg.startsWith('--json=')) {
      jsonFile = arg.slice('--json='.length);
    } else if (arg === '--json') {
      const next = argv[i + 1];
      if (next !== undefined && !next.startsWith('-') && next.toLowerCase().endsWith('.json')) {
        jsonFile = next;
        i++;
      } else {
        jsonFlag = true;
      }
    } else {
      rest.push(arg);
    }
  }
  return { argv: rest, jsonFlag, jsonFile };
}
