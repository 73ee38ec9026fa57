import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));

/**
 * Where JavaScript's own number formatting may be called: the formatters alone. Screens, the PDF,
 * the command line and the engine's own messages all write numbers through them.
 */
const ALLOWED = new Set([
  'shared/presentation/figures.ts', // the formatters of every figure
  'shared/format/significant-digits.ts', // numerals at a place or to significant digits
  'shared/gum/rounding.ts', // GUM 7.2.6 rounding, used by the formatters
]);

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return files(path);
    return /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

describe('a figure is formatted in one place', () => {
  it('no renderer calls toFixed or toPrecision itself', () => {
    const offenders = ['src', 'server', 'shared']
      .flatMap((d) => files(join(root, d)))
      .map((f) => relative(root, f).split('\\').join('/'))
      .filter((f) => !ALLOWED.has(f) && /\.to(Fixed|Precision)\(/.test(readFileSync(join(root, f), 'utf8')));
    expect(offenders).toEqual([]);
  });
});
