import type { BudgetDiff, Delta, FieldChange, KeyedDiff } from '../../shared/api/diff';
import type { BudgetResult } from '../../shared/budget/result';

type Obj = Record<string, unknown>;

const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** Leaf-by-leaf differences of two JSON values; arrays count as leaves. */
export function fieldChanges(a: unknown, b: unknown, prefix = ''): FieldChange[] {
  if (isObj(a) && isObj(b)) {
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
    return keys.flatMap((k) => fieldChanges(a[k], b[k], prefix ? `${prefix}.${k}` : k));
  }
  return same(a, b) ? [] : [{ field: prefix, from: a ?? null, to: b ?? null }];
}

function keyed(a: Obj[], b: Obj[], key: (o: Obj) => string): KeyedDiff<Obj> {
  const ma = new Map(a.map((o) => [key(o), o]));
  const mb = new Map(b.map((o) => [key(o), o]));
  return {
    added: b.filter((o) => !ma.has(key(o))),
    removed: a.filter((o) => !mb.has(key(o))),
    changed: [...mb.entries()]
      .filter(([k]) => ma.has(k))
      .map(([k, o]) => ({ key: k, changes: fieldChanges(ma.get(k), o) }))
      .filter((c) => c.changes.length > 0),
  };
}

function delta(a: number | null | undefined, b: number | null | undefined): Delta {
  const from = typeof a === 'number' && Number.isFinite(a) ? a : null;
  const to = typeof b === 'number' && Number.isFinite(b) ? b : null;
  return { from, to, delta: from !== null && to !== null ? to - from : null };
}

const list = (v: unknown): Obj[] => (Array.isArray(v) ? v.filter(isObj) : []);
const pairKey = (o: Obj) => (Array.isArray(o.between) ? [...(o.between as string[])].sort().join('|') : JSON.stringify(o));

/** The structured difference between two versions of a budget. */
export function diffBudgets(from: { number: number; document: Obj; result: BudgetResult }, to: { number: number; document: Obj; result: BudgetResult }): BudgetDiff {
  const a = from.document;
  const b = to.document;
  const structural = new Set(['model', 'measurand', 'inputs', 'constants', 'correlations']);
  const otherKeys = [...new Set([...Object.keys(a), ...Object.keys(b)])].filter((k) => !structural.has(k)).sort();
  const ra = from.result;
  const rb = to.result;
  const ca = new Map(ra.gum.contributions.map((c) => [c.symbol, c]));
  const cb = new Map(rb.gum.contributions.map((c) => [c.symbol, c]));
  const symbols = [...new Set([...ca.keys(), ...cb.keys()])];
  return {
    from: from.number,
    to: to.number,
    model: { changed: a.model !== b.model, from: String(a.model ?? ''), to: String(b.model ?? '') },
    measurand: fieldChanges(a.measurand, b.measurand),
    inputs: keyed(list(a.inputs), list(b.inputs), (o) => String(o.symbol)),
    constants: keyed(list(a.constants), list(b.constants), (o) => String(o.symbol)),
    correlations: keyed(list(a.correlations), list(b.correlations), pairKey),
    other: otherKeys.flatMap((k) => fieldChanges(a[k], b[k], k)),
    result: {
      estimate: delta(ra.gum.estimate, rb.gum.estimate),
      standardUncertainty: delta(ra.gum.standardUncertainty, rb.gum.standardUncertainty),
      expandedUncertainty: delta(ra.gum.expandedUncertainty, rb.gum.expandedUncertainty),
      coverageFactor: delta(ra.gum.coverageFactor, rb.gum.coverageFactor),
      effectiveDof: delta(ra.gum.effectiveDof, rb.gum.effectiveDof),
      monteCarlo:
        ra.monteCarlo || rb.monteCarlo
          ? {
              estimate: delta(ra.monteCarlo?.estimate, rb.monteCarlo?.estimate),
              standardUncertainty: delta(ra.monteCarlo?.standardUncertainty, rb.monteCarlo?.standardUncertainty),
              intervalLow: delta(ra.monteCarlo?.interval[0], rb.monteCarlo?.interval[0]),
              intervalHigh: delta(ra.monteCarlo?.interval[1], rb.monteCarlo?.interval[1]),
            }
          : null,
      contributions: symbols.map((s) => ({
        symbol: s,
        contribution: delta(ca.get(s)?.contribution, cb.get(s)?.contribution),
        varianceShare: delta(ca.get(s)?.varianceShare, cb.get(s)?.varianceShare),
        sensitivity: delta(ca.get(s)?.sensitivity, cb.get(s)?.sensitivity),
        standardUncertainty: delta(ca.get(s)?.standardUncertainty, cb.get(s)?.standardUncertainty),
      })),
    },
  };
}
