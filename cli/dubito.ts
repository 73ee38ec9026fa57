#!/usr/bin/env node
/**
 * The Dubito command line: `dubito compute FILE [--trials N] [--seed S]
 * [--adaptive] [--no-monte-carlo] [--format json|table]`.
 * A refused budget exits with status 2 and one line on stderr naming the culprit.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { BudgetError } from '../shared/budget/budget-error';
import { parseBudgetFile } from '../shared/budget/budget-file';
import { LIMITS } from '../shared/budget/limits';
import { computeBudget } from '../shared/compute/compute-budget';
import { formatBudgetTable } from './budget-table';

const USAGE = 'usage: dubito compute FILE [--trials N] [--seed S] [--adaptive] [--no-monte-carlo] [--format json|table]';

class UsageError extends Error {}

function refuse(message: string, status = 2): never {
  process.stderr.write(`dubito: ${message.split('\n')[0]}\n`);
  process.exit(status);
}

function main(argv: string[]): void {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      trials: { type: 'string' },
      seed: { type: 'string' },
      adaptive: { type: 'boolean', default: false },
      'no-monte-carlo': { type: 'boolean', default: false },
      format: { type: 'string', default: 'json' },
      help: { type: 'boolean', short: 'h', default: false },
    },
  });
  if (values.help) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  const [command, file, ...rest] = positionals;
  if (command !== 'compute') throw new UsageError(command ? `unknown command "${command}"` : 'no command given');
  if (!file) throw new UsageError('no budget file given');
  if (rest.length) throw new UsageError(`unexpected argument "${rest[0]}"`);
  if (values.format !== 'json' && values.format !== 'table') throw new UsageError(`--format must be json or table, not "${values.format}"`);

  let trials: number | 'adaptive' | undefined;
  if (values.adaptive) trials = 'adaptive';
  if (values.trials !== undefined) {
    if (values.adaptive) throw new UsageError('give either --trials or --adaptive, not both');
    const n = Number(values.trials);
    if (!Number.isInteger(n) || n < 1) throw new UsageError(`--trials must be a whole number of at least 1, not "${values.trials}"`);
    if (n > LIMITS.trials) refuse(`--trials: must not exceed ${LIMITS.trials.toExponential(0)} trials`);
    trials = n;
  }

  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    refuse(`cannot read ${file}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`);
  }
  const doc = parseBudgetFile(text);
  const result = computeBudget(doc, { trials, seed: values.seed, monteCarlo: !values['no-monte-carlo'] });
  process.stdout.write(values.format === 'table' ? formatBudgetTable(doc, result) : `${JSON.stringify(result, null, 2)}\n`);
}

try {
  main(process.argv.slice(2));
} catch (e) {
  if (e instanceof BudgetError) refuse(e.message);
  if (e instanceof UsageError) refuse(`${e.message}\n${USAGE}`);
  if (e instanceof Error && 'code' in e && String((e as { code: unknown }).code).startsWith('ERR_PARSE_ARGS')) refuse(e.message);
  refuse(`internal error: ${(e as Error).message ?? String(e)}`, 1);
}
