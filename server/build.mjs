/**
 * Builds the server once into server/dist/ (npm run build:server, run by
 * `prepare` and `npm run build`), so that `npm start` runs plain JavaScript
 * with no TypeScript loader: ESM bundles of the start-up script, the compute
 * worker thread and the engine module the worker loads, with shared code in
 * chunks beside them and source maps. Packages stay in node_modules (a native
 * database driver, font and PDF data read from their own folders), except
 * mathjs: bundled, it keeps only the factories each thread uses, where loading
 * the package would load its whole ES module graph (some 1 000 modules, tens of
 * MB of live heap on the main thread, which only reads units). Files the
 * server reads beside its code are copied next to the bundles.
 */
import { build } from 'esbuild';
import { copyFileSync, rmSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const here = (path) => fileURLToPath(new URL(path, import.meta.url));
const outdir = here('./dist');

/**
 * Every package stays external but mathjs. A bare import from a file inside node_modules can only
 * come from mathjs's own files (nothing else there is bundled), so mathjs's dependencies
 * (typed-function, fraction.js, …) are bundled with it.
 */
const externalPackagesButMathjs = {
  name: 'external-packages-but-mathjs',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, (args) => {
      const bundled = args.path === 'mathjs' || args.path.startsWith('mathjs/') || /[\\/]node_modules[\\/]/.test(args.importer);
      return bundled ? undefined : { path: args.path, external: true };
    });
  },
};

rmSync(outdir, { recursive: true, force: true });
await build({
  entryPoints: {
    start: here('./start.ts'),
    // The names the supervisor looks for beside itself when it runs from this build.
    'task-worker': here('./compute/task-worker.ts'),
    'compute-budget': here('../shared/compute/compute-budget.ts'),
  },
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  plugins: [externalPackagesButMathjs],
  sourcemap: true,
  logLevel: 'warning',
});
// Read through new URL('./common-passwords.txt', import.meta.url): it must lie beside the chunk that reads it.
copyFileSync(here('./accounts/common-passwords.txt'), `${outdir}/common-passwords.txt`);
