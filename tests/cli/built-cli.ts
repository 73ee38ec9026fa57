import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { ensureBuilt, projectRoot } from '../support/built-once';

export const builtCli = join(projectRoot, 'cli', 'dist', 'dubito.js');

/** Builds cli/dist/ when it is missing or older than the sources of the command line and the engine. */
export function ensureBuiltCli(): void {
  ensureBuilt('cli', 'dubito.js');
}

/** Runs the built command line. */
export function dubito(...args: string[]) {
  const r = spawnSync(process.execPath, [builtCli, ...args], { cwd: projectRoot, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
