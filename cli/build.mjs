/**
 * Builds the command line once into cli/dist/ (npm run build:cli, run by
 * `prepare` and `npm run build`): one ESM bundle per entry (the command line
 * and its worker thread) with the engine in a shared chunk, source maps, and
 * the `#!/usr/bin/env node` line, so `dubito` starts on plain node with no
 * TypeScript loader. Code loaded by `await import()` (the engine, the table)
 * stays in chunks of its own, read only when needed.
 */
import { build } from 'esbuild';
import { chmodSync, rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

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
