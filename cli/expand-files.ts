import { readdirSync, statSync } from 'node:fs';
import { isAbsolute, join } from 'node:path';

const GLOB = /[*?[]/;

/** A command-line argument the user meant as a pattern rather than a file name. */
function isGlob(arg: string): boolean {
  return GLOB.test(arg);
}

/** One path segment of a pattern as a regular expression: `*`, `?` and `[abc]` / `[!abc]` / `[a-z]` within the segment. */
function segmentPattern(segment: string): RegExp {
  let re = '';
  for (let i = 0; i < segment.length; i++) {
    const c = segment[i];
    if (c === '*') re += '[^/]*';
    else if (c === '?') re += '[^/]';
    else if (c === '[' && segment.indexOf(']', i + 2) > 0) {
      const end = segment.indexOf(']', i + 2);
      let body = segment.slice(i + 1, end);
      const negated = body.startsWith('!') || body.startsWith('^');
      if (negated) body = body.slice(1);
      re += `[${negated ? '^' : ''}${body.replace(/[\\\]^]/g, '\\$&')}]`;
      i = end;
    } else re += c.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
  }
  return new RegExp(`^${re}$`);
}

function isFile(path: string): boolean {
  try {
    return statSync(path).isFile();
  } catch {
    return false;
  }
}

function entries(dir: string) {
  try {
    return readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  } catch {
    return [];
  }
}

/** Walks `rest` (pattern segments) from `dir`; hidden entries match only a segment that starts with a dot, as in a shell; `**` is any depth of folders. */
function walk(dir: string, rest: readonly string[], out: string[]): void {
  if (rest.length === 0) {
    if (isFile(dir)) out.push(dir);
    return;
  }
  const [segment, ...tail] = rest;
  if (segment === '**') {
    walk(dir, tail, out);
    for (const e of entries(dir)) if (e.isDirectory() && !e.name.startsWith('.')) walk(join(dir, e.name), rest, out);
    return;
  }
  if (!isGlob(segment)) {
    walk(join(dir, segment), tail, out);
    return;
  }
  const re = segmentPattern(segment);
  for (const e of entries(dir)) {
    if (e.name.startsWith('.') && !segment.startsWith('.')) continue;
    if (re.test(e.name)) walk(join(dir, e.name), tail, out);
  }
}

/** A result file written by `--beside` or `--out-dir`: never a budget, so patterns pass over it. */
export const RESULT_SUFFIX = '.result.json';

/**
 * The files a pattern names (`examples/*.json`, `lab/**\/*.json`), sorted
 * within each folder; result files (`NAME.result.json`) are left out so a
 * second run over the same folder computes the budgets only. Node 20 has no
 * `fs.globSync`, hence this small matcher.
 */
export function expandGlob(pattern: string): string[] {
  const segments = pattern.split('/');
  let i = 0;
  while (i < segments.length && !isGlob(segments[i])) i++;
  const base = segments.slice(0, i).join('/') || (isAbsolute(pattern) ? '/' : '.');
  const out: string[] = [];
  walk(
    base,
    segments.slice(i).filter((s) => s !== ''),
    out,
  );
  return out.filter((f) => !f.endsWith(RESULT_SUFFIX));
}

/**
 * The budget files of the command line, in the order given: a name is taken
 * as written (an existing file whose name has `*` or `?` too), a pattern is
 * expanded; each file once. Throws when a pattern matches nothing.
 */
export function expandFiles(args: readonly string[]): string[] {
  const seen = new Set<string>();
  const files: string[] = [];
  for (const arg of args) {
    const matches = isGlob(arg) && !isFile(arg) ? expandGlob(arg) : [arg];
    if (matches.length === 0) throw new Error(`no budget file matches "${arg}"`);
    for (const f of matches) {
      if (!seen.has(f)) {
        seen.add(f);
        files.push(f);
      }
    }
  }
  return files;
}
