import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { snapshotBlobName } from '../../cli/snapshot-blob.mjs';
import { ensureBuilt, projectRoot } from '../support/built-once';

/** The `dubito` command as installed (package.json "bin"). */
export const binDubito = join(projectRoot, 'cli', 'bin', 'dubito');
/** The plain build, which the command runs when no start-up snapshot was built for the node at hand. */
export const builtCli = join(projectRoot, 'cli', 'dist', 'dubito.js');
/** The start-up snapshot `npm run build:cli` makes with this node. */
export const snapshotBlob = join(projectRoot, 'cli', 'dist', snapshotBlobName());

/** Builds cli/dist/ when it is missing or older than the sources of the command line and the engine. */
export function ensureBuiltCli(): void {
  ensureBuilt('cli', 'dubito.js');
}

/** Runs `dubito` as a user does: the installed command, which starts from the snapshot. */
export function dubito(...args: string[]) {
  const r = spawnSync(binDubito, args, { cwd: projectRoot, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Runs the plain build on node, without the snapshot. */
export function plainDubito(...args: string[]) {
  const r = spawnSync(process.execPath, [builtCli, ...args], { cwd: projectRoot, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
