// Preloaded (node --import) into a benchmarked process: prints its peak
// resident memory and the CPU time of all its threads as the last line on
// stderr, so a figure taken on a busy machine can be read against CPU used.
import { writeSync } from 'node:fs';

process.on('exit', () => {
  const usage = process.resourceUsage();
  writeSync(2, `\nmaxRSS-kB ${usage.maxRSS} cpu-us ${usage.userCPUTime + usage.systemCPUTime}\n`);
});
