import { spawnSync } from 'node:child_process';
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** The project's root folder. */
export const projectRoot = join(__dirname, '..', '..');

/** The latest change of any file under `dir`, builds and packages left out. */
function newestSource(dir: string): number {
  let newest = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    if (e.name === 'dist' || e.name === 'node_modules') continue;
    const path = join(dir, e.name);
    newest = Math.max(newest, e.isDirectory() ? newestSource(path) : statSync(path).mtimeMs);
  }
  return newest;
}

/**
 * Runs the build script `<part>/build.mjs` (as `npm run build:<part>` does) when `<part>/dist/<entry>`
 * is missing or older than the sources of the part and of the engine, so a test runs what users run.
 */
export function ensureBuilt(part: 'cli' | 'server', entry: string): string {
  const output = join(projectRoot, part, 'dist', entry);
  let built = 0;
  try {
    built = statSync(output).mtimeMs;
  } catch {
    // not built yet
  }
  if (built > Math.max(newestSource(join(projectRoot, part)), newestSource(join(projectRoot, 'shared')))) return output;
  const r = spawnSync(process.execPath, [join(projectRoot, part, 'build.mjs')], { cwd: projectRoot, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`building ${part}/dist/ failed: ${r.stderr}`);
  return output;
}
