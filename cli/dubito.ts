#!/usr/bin/env node
/**
 * The plain build of the command line (cli/dist/dubito.js): starts without the
 * engine, which is imported only once there is something to compute, the
 * table renderer only for `--format table`. `cli/bin/dubito` runs it when no
 * start-up snapshot was built for the node at hand.
 */
import { runCommandLine } from './command-line';

void runCommandLine(process.argv.slice(2), {
  computeFile: () => import('./compute-file'),
  budgetTable: () => import('./budget-table'),
  workerPool: () => import('./worker-pool'),
  batchWorker: new URL('./batch-worker.js', import.meta.url),
});
