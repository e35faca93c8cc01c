/**
 * The worker-thread side of the batch pool (piscina loads this file). Two
 * kinds of task: one file of an `analyze` batch in, its finished rows out
 * (the worker reads the file itself, so the main thread never holds a
 * spectrum's bytes); or a file's bytes in, its analysis out (`library add`
 * of many files, which stores the bytes and the result on the main thread).
 */
import { analyzeContent, type AnalyzeContentTask, type ContentOutcome } from './batch-analyze.js';
import { analyzeBatchFile, type BatchFileTask, type BatchRow } from './batch-rows.js';
import { collectEvery } from './worker-gc.js';

export type WorkerTask = { rows: BatchFileTask } | { analyze: AnalyzeContentTask };

/** Files between two full collections (see worker-gc.ts). */
const TASKS_PER_COLLECTION = 200;
const afterTask = collectEvery(TASKS_PER_COLLECTION);

export default function runBatchTask(task: WorkerTask): BatchRow[] | ContentOutcome {
  try {
    return 'rows' in task ? analyzeBatchFile(task.rows) : analyzeContent(task.analyze);
  } finally {
    afterTask();
  }
}
