import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { WarningList } from '../common/errors.js';
import { loadCampaignStudy, type BatchSetup } from './batch-job.js';
import { deadOutcome, handleTask, type BatchTask, type TaskOutcome } from './batch-tasks.js';

/**
 * The worker threads of a campaign.
 *
 * Protocol (structured-clone messages over each worker's port):
 *   main -> worker  workerData: BatchSetup (once); the worker loads the study itself
 *   worker -> main  { type: 'ready' }                        study loaded, idle
 *   main -> worker  { type: 'task', task: BatchTask }        at most one task per worker at a time
 *   worker -> main  { type: 'done', outcome }                the task's plain-data outcome, then idle
 * Tasks are 'reduce' (read and reduce one file), 'fit' (fit, compare and write one file, given its
 * reduced rows) and 'pooled' (fit and write all files' rows pooled). The pool hands the oldest
 * waiting task to whichever worker is idle, so a slow file never holds up the others, and the
 * pooled fit runs beside the files' own fits. A worker that dies (an uncaught fault, out of
 * memory) turns its task into a failure (kind 'internal') and is replaced while tasks remain.
 *
 * Without a compiled worker beside this module (the test runner loads the TypeScript sources),
 * the tasks run in this thread one after the other, through the same handleTask.
 */

export interface TaskPool {
  run<T extends BatchTask>(task: T): Promise<TaskOutcome<T>>;
  close(): Promise<void>;
}

/** The compiled worker script beside this module, or null when running from the sources. */
export function workerScript(): URL | null {
  const url = new URL('./batch-worker.js', import.meta.url);
  return existsSync(fileURLToPath(url)) ? url : null;
}

/** A pool of `size` workers (or the calling thread when there is no compiled worker). */
export function openTaskPool(setup: BatchSetup, size: number): TaskPool {
  const script = workerScript();
  return script === null ? inlinePool(setup) : new WorkerPool(script, setup, Math.max(1, size));
}

function inlinePool(setup: BatchSetup): TaskPool {
  const loaded = loadCampaignStudy(setup, new WarningList());
  let queue: Promise<unknown> = Promise.resolve();
  return {
    run: <T extends BatchTask>(task: T) => {
      const next = queue.then(async () => handleTask(setup, await loaded, task) as Promise<TaskOutcome<T>>);
      queue = next.catch(() => undefined);
      return next;
    },
    close: async () => {
      await queue;
    },
  };
}

interface Waiting {
  readonly task: BatchTask;
  readonly resolve: (outcome: unknown) => void;
  readonly reject: (e: Error) => void;
}

class WorkerPool implements TaskPool {
  private readonly waiting: Waiting[] = [];
  private readonly idle: Worker[] = [];
  private readonly busy = new Map<Worker, Waiting>();
  private readonly live = new Set<Worker>();
  private closed = false;
  /** Replacements left for workers that die, before the pool gives up. */
  private replacements: number;

  constructor(
    private readonly script: URL,
    private readonly setup: BatchSetup,
    private readonly size: number,
  ) {
    this.replacements = 4 * size + 16;
  }

  run<T extends BatchTask>(task: T): Promise<TaskOutcome<T>> {
    return new Promise((resolve, reject) => {
      this.waiting.push({ task, resolve: resolve as (o: unknown) => void, reject });
      if (this.live.size < this.size) this.start();
      this.pump();
    });
  }

  async close(): Promise<void> {
    this.closed = true;
    const all = [...this.live];
    this.live.clear();
    await Promise.all(all.map((w) => w.terminate()));
  }

  private start(): void {
    const worker = new Worker(this.script, { workerData: this.setup });
    this.live.add(worker);
    worker.on('message', (m: { type: 'ready' } | { type: 'done'; outcome: unknown }) => {
      if (m.type === 'done') {
        const w = this.busy.get(worker);
        this.busy.delete(worker);
        w?.resolve(m.outcome);
      }
      this.idle.push(worker);
      this.pump();
    });
    const died = (why: string): void => {
      if (!this.live.delete(worker)) return;
      const i = this.idle.indexOf(worker);
      if (i >= 0) this.idle.splice(i, 1);
      const w = this.busy.get(worker);
      this.busy.delete(worker);
      if (w !== undefined) w.resolve(deadOutcome(w.task, why));
      if (this.closed || this.waiting.length === 0) return;
      if (this.replacements-- <= 0) {
        for (const x of this.waiting.splice(0)) x.reject(new Error(`the batch worker threads keep stopping: ${why}`));
        return;
      }
      this.start();
    };
    worker.on('error', (e) => died(e.message));
    worker.on('exit', (code) => died(`exit code ${code}`));
  }

  private pump(): void {
    while (this.idle.length > 0 && this.waiting.length > 0) {
      const worker = this.idle.shift()!;
      const w = this.waiting.shift()!;
      this.busy.set(worker, w);
      worker.postMessage({ type: 'task', task: w.task });
    }
  }
}
