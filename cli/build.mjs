/**
 * Builds the command line once into cli/dist/ (npm run build:cli, run by
 * `prepare` and `npm run build`), with source maps, so `dubito` starts on plain
 * node with no TypeScript loader:
 * - the plain build: one ESM bundle per entry (the command line and its worker
 *   thread) with the engine in a shared chunk and the `#!/usr/bin/env node`
 *   line; code loaded by `await import()` (the engine, the table) stays in
 *   chunks of its own, read only when needed;
 * - the start-up snapshot `dubito-<node version>-<machine>.blob` (see
 *   cli/snapshot.ts), made by this very node from a CommonJS bundle, which is
 *   what `node --build-snapshot` runs. cli/bin/dubito starts from it when the
 *   node at hand is the one it was built by, and from the plain build otherwise.
 */
import { build } from 'esbuild';
import { spawnSync } from 'node:child_process';
import { chmodSync, rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { snapshotBlobName } from './snapshot-blob.mjs';

const here = (path) => fileURLToPath(new URL(path, import.meta.url));
const outdir = here('./dist');

rmSync(outdir, { recursive: true, force: true });
await build({
  entryPoints: { dubito: here('./dubito.ts'), 'batch-worker': here('./batch-worker.ts') },
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  sourcemap: true,
  // packages written as CommonJS call require() for Node's own modules; an ESM bundle has none of its own
  banner: { js: "import { createRequire as __dubitoRequire } from 'node:module'; const require = __dubitoRequire(import.meta.url);" },
  logLevel: 'warning',
});
chmodSync(`${outdir}/dubito.js`, 0o755);

await build({
  entryPoints: { snapshot: here('./snapshot.ts') },
  outdir,
  outExtension: { '.js': '.cjs' },
  bundle: true,
  format: 'cjs',
  platform: 'node',
  target: 'node20',
  sourcemap: true,
  logLevel: 'warning',
});
const blob = `${outdir}/${snapshotBlobName()}`;
const made = spawnSync(process.execPath, ['--snapshot-blob', blob, '--build-snapshot', `${outdir}/snapshot.cjs`, here('../examples')], { encoding: 'utf8' });
// Without a snapshot the command still works (cli/bin/dubito runs the plain build), so a node that cannot make one
// must not fail the install; the tests check that the snapshot is there.
if (made.status !== 0) {
  rmSync(blob, { force: true });
  console.warn(`cli/build.mjs: no start-up snapshot made, dubito will start from the plain build:\n${made.stderr}`);
}
