import { parentPort, workerData } from 'node:worker_threads';
import { WarningList } from '../common/errors.js';
import { loadCampaignStudy, type BatchSetup } from './batch-job.js';
import { deadOutcome, handleTask, type BatchTask } from './batch-tasks.js';

/**
 * The worker thread of `similis batch` (protocol in batch-pool.ts). It loads the study once, then
 * does one task per 'task' message and answers with a 'done' message; it never prints.
 */

const port = parentPort;
if (port === null) throw new Error('batch-worker.js runs only as a worker thread');
const setup = workerData as BatchSetup;
const loaded = await loadCampaignStudy(setup, new WarningList());

port.on('message', (message: { type: 'task'; task: BatchTask }) => {
  void (async () => {
    const outcome = await handleTask(setup, loaded, message.task);
    try {
      port.postMessage({ type: 'done', outcome });
    } catch (e) {
      // An outcome that cannot be cloned is a fault of ours: report it as the task's failure.
      port.postMessage({ type: 'done', outcome: deadOutcome(message.task, `its result could not be sent: ${(e as Error).message}`) });
    }
  })();
});
port.postMessage({ type: 'ready' });
