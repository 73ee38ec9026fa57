import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The project directory (the first one above `moduleUrl` that holds
 * package.json), so that paths to examples, the client build and migrations
 * hold both when the server runs from its TypeScript sources (server/) and
 * from its build (server/dist/).
 */
export function projectRoot(moduleUrl: string): string {
  let dir = dirname(fileURLToPath(moduleUrl));
  while (!existsSync(join(dir, 'package.json'))) {
    const up = dirname(dir);
    if (up === dir) throw new Error(`no package.json above ${fileURLToPath(moduleUrl)}`);
    dir = up;
  }
  return dir;
}
