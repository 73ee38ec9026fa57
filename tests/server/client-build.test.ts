import { mkdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { clientBuildIsStale } from '../../server/client-build';
import { tempDir } from './helpers';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

function project() {
  const root = tempDir();
  dirs.push(root);
  mkdirSync(join(root, 'src', 'features'), { recursive: true });
  writeFileSync(join(root, 'src', 'features', 'page.tsx'), 'export {}');
  const at = (file: string, seconds: number) => utimesSync(file, seconds, seconds);
  at(join(root, 'src', 'features', 'page.tsx'), 1_000);
  at(join(root, 'src', 'features'), 1_000);
  at(join(root, 'src'), 1_000);
  return { root, dist: join(root, 'dist'), at };
}

describe('clientBuildIsStale', () => {
  it('asks for a build when there is none', () => {
    const { root, dist } = project();
    expect(clientBuildIsStale(root, dist, ['src'])).toBe(true);
  });

  it('keeps a build newer than every source and rebuilds after a source changes', () => {
    const { root, dist, at } = project();
    mkdirSync(dist);
    writeFileSync(join(dist, 'index.html'), '<!doctype html>');
    at(join(dist, 'index.html'), 2_000);
    expect(clientBuildIsStale(root, dist, ['src', 'missing.ts'])).toBe(false);
    at(join(root, 'src', 'features', 'page.tsx'), 3_000);
    expect(clientBuildIsStale(root, dist, ['src'])).toBe(true);
  });
});
