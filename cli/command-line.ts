/**
 * The Dubito command line: `dubito compute FILE|PATTERN... [options]`.
 * The engine, the table renderer and the worker pool come through
 * `CommandModules`: the plain build (`dubito.ts`) imports each only when it
 * is needed, the start-up snapshot (`snapshot.ts`) holds them loaded; each
 * `--jobs` worker loads its own engine.
 * Exit status: 0 when every budget was computed, 2 when one or more were
 * refused (the others are still computed), 1 for an internal error.
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { parseArgs } from 'node:util';
import { LIMITS } from '../shared/budget/limits';
import type * as BudgetTable from './budget-table';
import type * as ComputeFile from './compute-file';
import type { FileOutcome, RunOptions } from './compute-file';
import { RESULT_SUFFIX, expandFiles } from './expand-files';
import type * as WorkerPool from './worker-pool';

/** What the command needs beyond itself, each loaded when it is first asked for. */
export interface CommandModules {
  computeFile(): Promise<typeof ComputeFile>;
  budgetTable(): Promise<typeof BudgetTable>;
  workerPool(): Promise<typeof WorkerPool>;
  /** The built batch worker (`batch-worker.js` in cli/dist/) the `--jobs` threads run. */
  batchWorker: URL;
}

// A function, not a constant: the start-up snapshot is built on one machine and may run where the cores differ.
const usage = () => `usage: dubito compute FILE|PATTERN... [options]

Computes budget files (dubito-budget/1): the GUM law of propagation and the
JCGM 101 Monte Carlo method. Patterns (examples/*.json, lab/**/*.json) are
expanded by dubito itself; result files (NAME${RESULT_SUFFIX}) never match.

  --trials N          Monte Carlo trials (overrides each budget's own)
  --adaptive          the adaptive procedure of JCGM 101:2008 7.9
  --seed S            seed of the Monte Carlo method (overrides each budget's own)
  --no-monte-carlo    law of propagation only
  --format F          json: the result (one file only; the default for one file)
                      jsonl: one line per budget, {"file", "result"} or
                             {"file", "error": {code, message, field}} (the default for several)
                      table: a readable budget table
  --out-dir DIR       write each result to DIR/NAME${RESULT_SUFFIX}
  --beside            write each result beside its budget, NAME${RESULT_SUFFIX}
  --jobs N            compute on N worker threads (1 to ${availableParallelism()}, default 1)
  -h, --help          this text

Exit status: 0 every budget computed; 2 one or more refused (the others are
still computed; a refused budget's old result file is removed); 1 internal error or a
result file that could not be written.`;

class UsageError extends Error {}

type Sink = 'json' | 'jsonl' | 'table' | 'files';

interface Plan {
  files: string[];
  options: RunOptions;
  sink: Sink;
  /** For `files`: where each budget's result goes. */
  outputs?: string[];
  jobs: number;
}

function wholeNumber(name: string, text: string): number {
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) throw new UsageError(`--${name} must be a whole number of at least 1, not "${text}"`);
  return n;
}

function plan(argv: string[]): Plan | 'help' {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      trials: { type: 'string' },
      seed: { type: 'string' },
      adaptive: { type: 'boolean', default: false },
      'no-monte-carlo': { type: 'boolean', default: false },
      format: { type: 'string' },
      'out-dir': { type: 'string' },
      beside: { type: 'boolean', default: false },
      jobs: { type: 'string' },
      help: { type: 'boolean', short: 'h', default: false },
    },
  });
  if (values.help) return 'help';
  const [command, ...patterns] = positionals;
  if (command !== 'compute') throw new UsageError(command ? `unknown command "${command}"` : 'no command given');
  if (patterns.length === 0) throw new UsageError('no budget file given');

  let trials: number | 'adaptive' | undefined;
  if (values.adaptive) trials = 'adaptive';
  if (values.trials !== undefined) {
    if (values.adaptive) throw new UsageError('give either --trials or --adaptive, not both');
    trials = wholeNumber('trials', values.trials);
    if (trials > LIMITS.trials) throw new UsageError(`--trials: must not exceed ${LIMITS.trials.toExponential(0)} trials`);
  }
  const cores = availableParallelism();
  const jobs = values.jobs === undefined ? 1 : wholeNumber('jobs', values.jobs);
  if (jobs > cores) throw new UsageError(`--jobs must not exceed the ${cores} cores of this machine, not ${jobs}`);

  let files: string[];
  try {
    files = expandFiles(patterns);
  } catch (e) {
    throw new UsageError((e as Error).message);
  }

  const format = values.format;
  if (format !== undefined && format !== 'json' && format !== 'jsonl' && format !== 'table') throw new UsageError(`--format must be json, jsonl or table, not "${format}"`);
  const outDir = values['out-dir'];
  let sink: Sink;
  let outputs: string[] | undefined;
  if (outDir !== undefined || values.beside) {
    if (outDir !== undefined && values.beside) throw new UsageError('give either --out-dir or --beside, not both');
    if (format !== undefined) throw new UsageError('--format is for results on stdout; --out-dir and --beside write JSON result files');
    const name = (file: string) => basename(file).replace(/\.json$/i, '') + RESULT_SUFFIX;
    outputs = files.map((f) => (outDir !== undefined ? join(outDir, name(f)) : join(dirname(f), name(f))));
    const taken = new Map<string, string>();
    outputs.forEach((out, i) => {
      const other = taken.get(out);
      if (other !== undefined) throw new UsageError(`${other} and ${files[i]} would both write ${out}`);
      taken.set(out, files[i]);
    });
    sink = 'files';
  } else {
    sink = format ?? (files.length === 1 ? 'json' : 'jsonl');
    if (sink === 'json' && files.length > 1) throw new UsageError(`--format json takes one budget, not ${files.length}: use --format jsonl, --out-dir or --beside`);
  }
  return { files, options: { trials, seed: values.seed, monteCarlo: !values['no-monte-carlo'] }, sink, outputs, jobs };
}

/** One line on stderr; a single budget's refusal is named without its file, as it always was. */
function complain(message: string): void {
  process.stderr.write(`dubito: ${message.split('\n')[0]}\n`);
}

async function run({ files, options, sink, outputs, jobs }: Plan, modules: CommandModules): Promise<number> {
  const table = sink === 'table' ? (await modules.budgetTable()).formatBudgetTable : undefined;
  if (outputs) for (const dir of new Set(outputs.map((o) => dirname(o)))) mkdirSync(dir, { recursive: true });
  const progress = process.stderr.isTTY && files.length > 1;
  let status = 0;
  // The reader has gone (`dubito compute … | head`): stop there, quietly, with the status so far.
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code !== 'EPIPE') throw e;
    process.exit(status);
  });
  let done = 0;
  // outcomes are written in the order the files were given, whatever order the workers finish in
  const waiting = new Map<number, FileOutcome>();
  let written = 0;
  const write = (i: number, outcome: FileOutcome) => {
    const { file } = outcome;
    if ('error' in outcome) status = outcome.error.code === 'internal' || status === 1 ? 1 : 2;
    if (sink === 'jsonl') {
      process.stdout.write(`${JSON.stringify('error' in outcome ? { file, error: outcome.error } : { file, result: outcome.result })}\n`);
      return;
    }
    if ('error' in outcome) {
      if (progress) process.stderr.write('\r\x1b[K');
      complain(files.length === 1 ? outcome.error.message : `${file}: ${outcome.error.message}`);
      if (outputs) rmSync(outputs[i], { force: true }); // an old result must not outlive the budget that now is refused
      return;
    }
    if (outputs) {
      try {
        writeFileSync(outputs[i], `${JSON.stringify(outcome.result, null, 2)}\n`);
      } catch (e) {
        // the budget was computed, but its result is not where it is expected: a failure of the run, not of the budget
        complain(`${file}: cannot write ${outputs[i]}: ${(e as Error).message}`);
        status = 1;
      }
    } else if (table) process.stdout.write(`${files.length > 1 ? `# ${file}\n` : ''}${table(outcome.document, outcome.result)}${files.length > 1 ? '\n' : ''}`);
    else process.stdout.write(`${JSON.stringify(outcome.result, null, 2)}\n`);
  };
  const onOutcome = (index: number, outcome: FileOutcome) => {
    waiting.set(index, outcome);
    while (waiting.has(written)) {
      write(written, waiting.get(written) as FileOutcome);
      waiting.delete(written);
      written++;
    }
    done++;
    if (progress) process.stderr.write(`\r\x1b[K${done}/${files.length} ${outcome.file}`);
  };
  if (jobs > 1 && files.length > 1) {
    const { computeOnWorkers } = await modules.workerPool();
    await computeOnWorkers(modules.batchWorker, files, jobs, options, onOutcome);
  } else {
    const { computeFile } = await modules.computeFile();
    files.forEach((file, i) => onOutcome(i, computeFile(file, options)));
  }
  if (progress) process.stderr.write('\r\x1b[K');
  return status;
}

async function main(args: string[], modules: CommandModules): Promise<void> {
  let p: Plan | 'help';
  try {
    p = plan(args);
  } catch (e) {
    if (e instanceof UsageError) complain(`${e.message}\n${usage()}`);
    else if (e instanceof Error && 'code' in e && String((e as { code: unknown }).code).startsWith('ERR_PARSE_ARGS')) complain(e.message);
    else throw e;
    process.exitCode = 2;
    return;
  }
  if (p === 'help') {
    process.stdout.write(`${usage()}\n`);
    return;
  }
  process.exitCode = await run(p, modules);
}

/** Runs `dubito` with its arguments (those after the program's name); the exit status is left in `process.exitCode`. */
export function runCommandLine(args: string[], modules: CommandModules): Promise<void> {
  return main(args, modules).catch((e: unknown) => {
    complain(`internal error: ${(e as Error)?.message ?? String(e)}`);
    process.exitCode = 1;
  });
}
