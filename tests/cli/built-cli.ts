import { spawnSync } from 'node:child_process';
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

export const root = join(__dirname, '..', '..');
export const builtCli = join(root, 'cli', 'dist', 'dubito.js');

function newestSource(dir: string): number {
  let newest = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    if (e.name === 'dist' || e.name === 'node_modules') continue;
    const path = join(dir, e.name);
    newest = Math.max(newest, e.isDirectory() ? newestSource(path) : statSync(path).mtimeMs);
  }
  return newest;
}

/** Builds cli/dist/ (as `npm run build:cli` does) when it is missing or older than the sources of the command line and the engine, so the tests run what users run. */
export function ensureBuiltCli(): void {
  let built = 0;
  try {
    built = statSync(builtCli).mtimeMs;
  } catch {
    // not built yet
  }
  if (built > Math.max(newestSource(join(root, 'cli')), newestSource(join(root, 'shared')))) return;
  const r = spawnSync(process.execPath, [join(root, 'cli', 'build.mjs')], { cwd: root, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`building the command line failed: ${r.stderr}`);
}

/** Runs the built command line. */
export function dubito(...args: string[]) {
  const r = spawnSync(process.execPath, [builtCli, ...args], { cwd: root, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
