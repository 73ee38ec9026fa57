/**
 * The command line's V8 start-up snapshot (built by cli/build.mjs into
 * cli/dist/dubito-<node version>-<machine>.blob, run by cli/bin/dubito as
 * `node --snapshot-blob BLOB -- ARGS`). Building it loads the engine, the
 * budget schema and the table renderer and computes the example budgets
 * given on the build's command line with few trials, so that mathjs's
 * instances, the unit system and the compiled schema are made once, at
 * build time, instead of at every start. Nothing of a warm-up reaches a
 * result: the engine keeps no state between budgets but caches (compiled
 * models by their text, scratch buffers that every run overwrites).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { startupSnapshot } from 'node:v8';
import * as budgetTable from './budget-table';
import { runCommandLine } from './command-line';
import * as computeFile from './compute-file';

function warmUp(folder: string): void {
  const files = readdirSync(folder).filter((f) => f.endsWith('.json'));
  if (files.length === 0) throw new Error(`no budget in ${folder} to build the snapshot with`);
  for (const name of files) {
    const file = join(folder, name);
    const outcome = computeFile.computeText(file, readFileSync(file, 'utf8'), { monteCarlo: true, trials: 2000 });
    if ('error' in outcome) throw new Error(`${file}: ${outcome.error.message}`);
    budgetTable.formatBudgetTable(outcome.document, outcome.result);
  }
}

if (!startupSnapshot.isBuildingSnapshot()) throw new Error('cli/dist/snapshot.cjs is run by `node --build-snapshot` only');
warmUp(process.argv[2]);

startupSnapshot.setDeserializeMainFunction(() => {
  // node --snapshot-blob BLOB -- ARGS: the blob lies in cli/dist/, beside the batch worker.
  const at = process.execArgv.findIndex((a) => a.startsWith('--snapshot-blob'));
  const blob = process.execArgv[at].includes('=') ? process.execArgv[at].split('=').slice(1).join('=') : process.execArgv[at + 1];
  void runCommandLine(process.argv.slice(1), {
    computeFile: async () => computeFile,
    budgetTable: async () => budgetTable,
    workerPool: () => import('./worker-pool'),
    batchWorker: pathToFileURL(join(dirname(blob), 'batch-worker.js')),
  });
});
