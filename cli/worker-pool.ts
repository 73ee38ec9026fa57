import { Worker } from 'node:worker_threads';
import type { FileOutcome, RunOptions } from './compute-file';

/**
 * Computes `files` on `jobs` worker threads running `script` (the built
 * `batch-worker.js`), handing each worker the next file as soon as it is
 * free. `onOutcome` receives every file's outcome with its index, in the
 * order they finish. A worker that dies (out of memory, a crash) costs only
 * the file it was computing, which is reported as an internal error; a new
 * worker takes over the rest.
 */
export function computeOnWorkers(script: URL, files: readonly string[], jobs: number, options: RunOptions, onOutcome: (index: number, outcome: FileOutcome) => void): Promise<void> {
  let next = 0;
  let running = 0;
  return new Promise((resolve) => {
    const start = () => {
      if (next >= files.length) {
        if (running === 0) resolve();
        return;
      }
      running++;
      const worker = new Worker(script, { workerData: { options } });
      let current = -1;
      let finished = false;
      const feed = () => {
        if (next >= files.length) {
          finished = true;
          void worker.terminate();
          return;
        }
        current = next++;
        worker.postMessage({ index: current, file: files[current] });
      };
      worker.on('message', (m: { index: number; outcome: FileOutcome }) => {
        onOutcome(m.index, m.outcome);
        current = -1;
        feed();
      });
      const lost = (why: string) => {
        if (finished) return;
        finished = true;
        if (current >= 0) onOutcome(current, { file: files[current], error: { code: 'internal', message: `internal error: the worker computing it stopped (${why})`, field: null } });
        void worker.terminate();
      };
      worker.on('error', (e) => lost(e.message));
      worker.on('exit', (code) => {
        lost(`exit code ${code}`);
        running--;
        start();
      });
      feed();
    };
    for (let i = 0; i < Math.min(jobs, files.length); i++) start();
  });
}
