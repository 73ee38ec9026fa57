/// <reference lib="webworker" />
import { problemOfFailure } from '../../../shared/budget/problems';
import { computeBudget } from '../../../shared/compute/compute-budget';
import { MonteCarloCancelled } from '../../../shared/montecarlo/run-monte-carlo';
import type { RunRequest, WorkerMessage } from './mc-protocol';

const post = (m: WorkerMessage) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(m);

self.onmessage = (e: MessageEvent<RunRequest>) => {
  const req = e.data;
  if (req.type !== 'run') return;
  const flag = req.stopFlag ? new Int32Array(req.stopFlag) : null;
  let lastPost = 0;
  const t0 = performance.now();
  try {
    const result = computeBudget(req.document, {
      monteCarlo: true,
      trials: req.trials,
      seed: req.seed,
      trialsCap: req.trialsCap,
      onProgress(done, total) {
        const now = performance.now();
        if (now - lastPost > 80 || done === total) {
          lastPost = now;
          post({ type: 'progress', done, total });
        }
      },
      shouldStop: () => (flag ? Atomics.load(flag, 0) === 1 : false),
    });
    post({ type: 'done', result, ms: performance.now() - t0 });
  } catch (err) {
    if (err instanceof MonteCarloCancelled) post({ type: 'cancelled', done: err.done });
    else post({ type: 'error', problem: problemOfFailure(err) });
  }
};
