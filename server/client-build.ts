import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** What the client build is made from, relative to the project root. */
const CLIENT_SOURCES = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newestChange(path: string): number {
  let st;
  try {
    st = statSync(path);
  } catch {
    return 0;
  }
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestChange(join(path, entry)));
  return newest;
}

/**
 * Whether `dist/` must be (re)built: it has no index.html, or a client source
 * changed after it was written (make's rule), so an updated checkout never
 * serves the client of an older one.
 */
export function clientBuildIsStale(root: string, dist: string, sources = CLIENT_SOURCES): boolean {
  const built = newestChange(join(dist, 'index.html'));
  if (built === 0) return true;
  return sources.some((s) => newestChange(join(root, s)) > built);
}
