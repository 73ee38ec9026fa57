import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { expandFiles, expandGlob } from '../../cli/expand-files';

function tree(): string {
  const dir = mkdtempSync(join(tmpdir(), 'dubito-glob-'));
  for (const f of ['a.json', 'b.json', 'b.result.json', 'c.txt', '.hidden.json', 'lab/x1.json', 'lab/x2.json', 'lab/deep/y.json', 'lab/.private/z.json']) {
    mkdirSync(join(dir, f, '..'), { recursive: true });
    writeFileSync(join(dir, f), '{}');
  }
  return dir;
}

// The patterns follow the POSIX shell's pathname expansion (IEEE Std 1003.1, 2.13.3): a leading dot is matched only explicitly; ** is any depth, as in bash's globstar.
describe('expandGlob', () => {
  const dir = tree();
  it.each([
    ['*.json', ['a.json', 'b.json']],
    ['?.json', ['a.json', 'b.json']],
    ['[!a].*', ['b.json', 'c.txt']],
    ['[a-b].json', ['a.json', 'b.json']],
    ['.*.json', ['.hidden.json']],
    ['lab/x*.json', ['lab/x1.json', 'lab/x2.json']],
    ['**/*.json', ['a.json', 'b.json', 'lab/x1.json', 'lab/x2.json', 'lab/deep/y.json']],
    ['lab/**/y.json', ['lab/deep/y.json']],
    ['*.csv', []],
  ])('%s matches %j (result files never)', (pattern, expected) => {
    expect(expandGlob(join(dir, pattern))).toEqual(expected.map((f) => join(dir, f)));
  });
});

describe('expandFiles', () => {
  const dir = tree();
  it('keeps names as given, expands patterns, and names each file once in the order given', () => {
    expect(expandFiles([join(dir, 'b.json'), join(dir, '*.json'), join(dir, 'missing.json')])).toEqual([join(dir, 'b.json'), join(dir, 'a.json'), join(dir, 'missing.json')]);
  });
  it('refuses a pattern that matches nothing', () => {
    expect(() => expandFiles([join(dir, '*.csv')])).toThrow(/no budget file matches/);
  });
});
