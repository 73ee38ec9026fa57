/**
 * Three-way merge of budget documents: the version both editors started from
 * (base), the version saved meanwhile by someone else (theirs) and the editor's
 * own draft (mine).
 *
 * Every change theirs made relative to base is listed field by field, with the
 * value in base, theirs and mine. A change mine did not touch is kept by
 * default; a change to a field mine also changed, differently, is a conflict and
 * needs a decision. Nothing theirs changed disappears without being listed, so
 * saving on top of a newer version never reverts another person's change
 * unseen.
 *
 * Inputs and constants are matched by symbol, correlations by their pair of
 * symbols, so reordering is not a change. A distribution is merged field by
 * field while its kind is the same in all three documents; otherwise it is one
 * value (its fields only make sense together).
 */
import type { BudgetDocument } from './schema';

type Obj = Record<string, unknown>;

/** What one change of theirs does to the field it touches. */
type ChangeKind = 'changed' | 'added' | 'removed';

export interface TheirChange {
  /** Stable key of the field, for the decisions map. */
  id: string;
  /** Path in the merged tree (lists keyed by symbol). */
  path: readonly string[];
  /** The field in words, e.g. "input b: distribution halfWidth". */
  label: string;
  kind: ChangeKind;
  base: unknown;
  theirs: unknown;
  mine: unknown;
  /** Mine changed the same field to another value: the user decides which one stays. */
  conflict: boolean;
}

/** For each change of theirs: keep theirs, or keep mine (drop theirs). */
export type MergeDecision = 'theirs' | 'mine';

export interface DocumentMerge {
  changes: TheirChange[];
  /** Ids of conflicts without a decision; `document` is null until there are none. */
  undecided: string[];
  document: BudgetDocument | null;
}

/** Lists kept as maps keyed by their identity, so a merge never depends on order. */
const KEYED: Record<string, (o: Obj) => string> = {
  inputs: (o) => String(o.symbol),
  constants: (o) => String(o.symbol),
  correlations: (o) => (Array.isArray(o.between) ? [...(o.between as unknown[]).map(String)].sort().join('–') : JSON.stringify(o)),
};

const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** A deep copy into prototype-free objects, so a symbol such as "__proto__" is an ordinary key. */
function clone(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(clone);
  if (!isObj(v)) return v;
  const out = Object.create(null) as Obj;
  for (const k of Object.keys(v)) out[k] = clone(v[k]);
  return out;
}

/** The document as a tree in which the keyed lists are maps. */
function toTree(doc: unknown): Obj {
  const tree = clone(doc) as Obj;
  for (const [field, key] of Object.entries(KEYED)) {
    const list = Array.isArray(tree[field]) ? (tree[field] as unknown[]).filter(isObj) : [];
    const map = Object.create(null) as Obj;
    for (const o of list) map[key(o)] = o;
    tree[field] = map;
  }
  return tree;
}

function get(tree: unknown, path: readonly string[]): unknown {
  let v = tree;
  for (const k of path) {
    if (!isObj(v) || !Object.prototype.hasOwnProperty.call(v, k)) return undefined;
    v = v[k];
  }
  return v;
}

/**
 * Sets `path` in `tree` to `value` (undefined removes it). Where `tree` lacks
 * an object on the way, the whole subtree of `source` at that level is taken,
 * so a field is never set inside a half-built input.
 */
function set(tree: Obj, path: readonly string[], value: unknown, source: Obj): void {
  let node = tree;
  for (let i = 0; i < path.length - 1; i++) {
    const next = node[path[i]!];
    if (!isObj(next)) {
      const whole = get(source, path.slice(0, i + 1));
      if (whole === undefined) delete node[path[i]!];
      else node[path[i]!] = clone(whole);
      return;
    }
    node = next;
  }
  const last = path[path.length - 1]!;
  if (value === undefined) delete node[last];
  else node[last] = clone(value);
}

/** A distribution whose kind differs between the documents is merged as one value. */
function atomic(path: readonly string[], values: unknown[]): boolean {
  if (path.length === 3 && path[0] === 'inputs' && path[2] === 'distribution') {
    const kinds = new Set(values.filter(isObj).map((v) => v.kind));
    return kinds.size > 1;
  }
  return false;
}

/** Paths of the smallest fields where `theirs` differs from `base`. */
function changedPaths(base: unknown, theirs: unknown, mine: unknown, path: string[] = []): string[][] {
  if (same(base, theirs)) return [];
  if (isObj(base) && isObj(theirs) && !atomic(path, [base, theirs, mine])) {
    const keys = [...new Set([...Object.keys(base), ...Object.keys(theirs)])];
    return keys.flatMap((k) => changedPaths(base[k], theirs[k], isObj(mine) ? mine[k] : undefined, [...path, k]));
  }
  return [path];
}

const LIST_NAMES: Record<string, string> = { inputs: 'input', constants: 'constant', correlations: 'correlation' };

/** The field in words: the list item by its symbol, then the field names. */
function describeField(path: readonly string[]): string {
  const [head, key, ...rest] = path;
  if (head && LIST_NAMES[head] && key !== undefined) {
    const item = `${LIST_NAMES[head]} ${key}`;
    return rest.length ? `${item}: ${rest.join(' ')}` : item;
  }
  return path.join(' ');
}

/**
 * Every change theirs made relative to base, with the values of all three
 * documents, in document order (title, measurand, model, inputs, …).
 */
export function listTheirChanges(base: BudgetDocument, theirs: BudgetDocument, mine: BudgetDocument): TheirChange[] {
  const [b, t, m] = [toTree(base), toTree(theirs), toTree(mine)];
  return changedPaths(b, t, m).map((path) => {
    const vb = get(b, path);
    const vt = get(t, path);
    const vm = get(m, path);
    return {
      id: path.join('\u0000'),
      path,
      label: describeField(path),
      kind: vb === undefined ? 'added' : vt === undefined ? 'removed' : 'changed',
      base: vb,
      theirs: vt,
      mine: vm,
      conflict: !same(vm, vb) && !same(vm, vt),
    };
  });
}

/** Back from the tree: keyed lists in mine's order, items only theirs has placed after their predecessor in theirs. */
function toDocument(tree: Obj, theirs: BudgetDocument, mine: BudgetDocument): BudgetDocument {
  const out = Object.create(null) as Obj;
  for (const k of Object.keys(tree)) out[k] = tree[k];
  for (const [field, key] of Object.entries(KEYED)) {
    const map = (isObj(tree[field]) ? tree[field] : {}) as Obj;
    const order = (doc: Obj) => (Array.isArray(doc[field]) ? (doc[field] as unknown[]).filter(isObj).map(key) : []);
    const keys = order(mine as Obj).filter((k) => k in map);
    const theirOrder = order(theirs as Obj);
    for (const [i, k] of theirOrder.entries()) {
      if (!(k in map) || keys.includes(k)) continue;
      const before = theirOrder
        .slice(0, i)
        .reverse()
        .find((p) => keys.includes(p));
      keys.splice(before === undefined ? 0 : keys.indexOf(before) + 1, 0, k);
    }
    for (const k of Object.keys(map)) if (!keys.includes(k)) keys.push(k);
    const list = keys.map((k) => map[k]);
    if (list.length || field === 'inputs' || Array.isArray((mine as Obj)[field])) out[field] = list;
    else delete out[field];
  }
  return plain(out) as BudgetDocument;
}

/** Ordinary objects again; `Object.fromEntries` defines "__proto__" as an own key, as JSON.parse does. */
function plain(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(plain);
  if (!isObj(v)) return v;
  return Object.fromEntries(Object.keys(v).map((k) => [k, plain(v[k])]));
}

/**
 * Mine with the changes of theirs applied that the decisions keep. A change
 * without a decision is kept when it does not conflict; a conflict without a
 * decision leaves the document null and is listed in `undecided`.
 */
export function mergeDocuments(base: BudgetDocument, theirs: BudgetDocument, mine: BudgetDocument, decisions: Readonly<Record<string, MergeDecision>> = {}): DocumentMerge {
  const changes = listTheirChanges(base, theirs, mine);
  const undecided = changes.filter((c) => c.conflict && !decisions[c.id]).map((c) => c.id);
  if (undecided.length) return { changes, undecided, document: null };
  const t = toTree(theirs);
  const tree = toTree(mine);
  for (const c of changes) {
    const keep = decisions[c.id] ?? 'theirs';
    if (keep === 'theirs') set(tree, c.path, c.theirs, t);
  }
  return { changes, undecided, document: toDocument(tree, theirs, mine) };
}
