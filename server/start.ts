import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { clientBuildIsStale } from './client-build';
import { loadConfig, startProblem } from './config';
import { serve } from './main';

const root = fileURLToPath(new URL('..', import.meta.url));
const dist = fileURLToPath(new URL('../dist', import.meta.url));

// Say at once, before a client build, when this configuration could sign nobody in.
const problem = startProblem(loadConfig());
if (problem) {
  console.error(`[dubito] refusing to start: ${problem}`);
  process.exit(1);
}

if (clientBuildIsStale(root, dist)) {
  console.log('[dubito] the client build in dist/ is missing or older than its sources: running vite build');
  const r = spawnSync(process.execPath, [fileURLToPath(new URL('../node_modules/vite/bin/vite.js', import.meta.url)), 'build'], {
    cwd: root,
    stdio: 'inherit',
  });
  if (r.status !== 0) console.error('[dubito] the client build failed; serving the API only');
}

serve({ staticDir: dist }).catch((e) => {
  console.error('[dubito] could not start:', e);
  process.exit(1);
});
