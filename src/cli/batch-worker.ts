/**
 * The worker-thread side of the batch pool (piscina loads this file): one
 * file of an `analyze` batch in, its finished rows out. It reads the file
 * itself, so the main thread never holds a spectrum's bytes.
 */
import { analyzeBatchFile, type BatchFileTask, type BatchRow } from './batch-rows.js';

export default function runBatchFile(task: BatchFileTask): BatchRow[] {
  return analyzeBatchFile(task);
}
