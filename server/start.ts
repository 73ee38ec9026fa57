import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { serve } from './main';

const root = fileURLToPath(new URL('..', import.meta.url));
const dist = fileURLToPath(new URL('../dist', import.meta.url));

if (!existsSync(`${dist}/index.html`)) {
  console.log('[dubito] no client build in dist/: running vite build');
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
