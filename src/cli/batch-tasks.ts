import { fitFileJob, reduceFileJob, type BatchSetup, type FileJob, type FileResult, type LoadedStudy, type ReducedResult } from './batch-job.js';
import { pooledJob, type PooledJob, type PooledSummary } from './batch-pooled.js';

/**
 * The three kinds of work of a campaign, as messages a worker thread can take (plain data), and
 * the one function that does them, in a worker or in the calling thread.
 */

export type BatchTask =
  | { readonly type: 'reduce'; readonly job: FileJob }
  | { readonly type: 'fit'; readonly job: FileJob; readonly reduced: ReducedResult }
  | { readonly type: 'pooled'; readonly job: PooledJob };

export type TaskOutcome<T extends BatchTask> = T extends { type: 'reduce' } ? ReducedResult : T extends { type: 'fit' } ? FileResult : PooledSummary;

/** Does one task. Never throws for the data's faults (they are in the outcome). */
export function handleTask(setup: BatchSetup, loaded: LoadedStudy, task: BatchTask): Promise<ReducedResult | FileResult | PooledSummary> {
  switch (task.type) {
    case 'reduce':
      return reduceFileJob(setup, loaded, task.job);
    case 'fit':
      return fitFileJob(setup, loaded, task.job, task.reduced);
    case 'pooled':
      return pooledJob(setup, loaded, task.job);
  }
}

/** The outcome of a task whose worker thread stopped (an internal fault, reported as data). */
export function deadOutcome(task: BatchTask, why: string): ReducedResult | FileResult | PooledSummary {
  const message = `internal fault: the worker thread doing this stopped (${why})`;
  if (task.type === 'pooled') return { failure: message, pooledLabels: [], written: [], warnings: [], fit: null, rssByFile: {}, seconds: 0 };
  const job = task.job;
  const base: ReducedResult = {
    index: job.index,
    label: job.file.label,
    outName: job.outName,
    failure: { stage: task.type === 'reduce' ? 'read' : 'fit', kind: 'internal', message, where: { file: job.file.label } },
    rowsRead: 0,
    rowsKept: 0,
    excluded: [],
    reduced: null,
    outputs: [],
    recipe: null,
    warnings: [],
    seconds: 0,
  };
  return task.type === 'reduce' ? base : { ...task.reduced, reduced: null, failure: base.failure, fit: null, written: [] };
}
