/**
 * A worker thread of `dubito compute --jobs N`: computes the files the main
 * thread hands it, one at a time, and answers each with its outcome.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { computeFile, type RunOptions } from './compute-file';

const options = (workerData as { options: RunOptions }).options;
parentPort?.on('message', (job: { index: number; file: string }) => {
  parentPort?.postMessage({ index: job.index, outcome: computeFile(job.file, options) });
});
