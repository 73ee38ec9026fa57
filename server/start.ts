import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { clientBuildIsStale } from './client-build';
import { loadConfig, startProblem } from './config';
import { serve } from './main';
import { projectRoot } from './project-root';

const root = projectRoot(import.meta.url);
const dist = join(root, 'dist');

// Say at once, before a client build, when this configuration could sign nobody in.
const problem = startProblem(loadConfig());
if (problem) {
  console.error(`[dubito] refusing to start: ${problem}`);
  process.exit(1);
}

// DUBITO_CLIENT_BUILD=0: serve the API (and whatever dist/ holds) without building the client first.
if (process.env.DUBITO_CLIENT_BUILD !== '0' && clientBuildIsStale(root, dist)) {
  console.log('[dubito] the client build in dist/ is missing or older than its sources: running vite build');
  const r = spawnSync(process.execPath, [join(root, 'node_modules', 'vite', 'bin', 'vite.js'), 'build'], {
    cwd: root,
    stdio: 'inherit',
  });
  if (r.status !== 0) console.error('[dubito] the client build failed; serving the API only');
}

serve({ staticDir: dist }).catch((e) => {
  console.error('[dubito] could not start:', e);
  process.exit(1);
});
