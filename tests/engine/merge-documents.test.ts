import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { listTheirChanges, mergeDocuments } from '../../shared/budget/merge-documents';
import type { BudgetDocument } from '../../shared/budget/schema';

/** Invented demo budget: a gauge block length, three inputs. */
function base(): BudgetDocument {
  return {
    format: 'dubito-budget/1',
    title: 'Gauge block 50 mm',
    measurand: { symbol: 'L', unit: 'mm' },
    model: 'L = Ls + d + Ls * a * t',
    inputs: [
      { symbol: 'Ls', unit: 'mm', distribution: { kind: 'normal', value: 50.000012, u: 0.000025 } },
      { symbol: 'd', unit: 'mm', distribution: { kind: 'normal', value: 0.000215, u: 0.000012 } },
      { symbol: 'a', unit: '1/K', distribution: { kind: 'rectangular', value: 0, halfWidth: 1e-6 } },
      { symbol: 't', unit: 'K', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.5 } },
    ],
    monteCarlo: { trials: 100000, seed: 'kf-gb50' },
  };
}
const copy = (d: BudgetDocument) => JSON.parse(JSON.stringify(d)) as BudgetDocument;
const input = (d: BudgetDocument, s: string) => d.inputs.find((q) => q.symbol === s)!;

describe('three-way merge of budget documents', () => {
  it('keeps a change of theirs to a field mine did not touch, next to my change of another field of the same input', () => {
    const theirs = copy(base());
    (input(theirs, 'd').distribution as { u: number }).u = 0.00001;
    const mine = copy(base());
    (input(mine, 'd').distribution as { value: number }).value = 0.00022;
    const m = mergeDocuments(base(), theirs, mine);
    expect(m.changes).toHaveLength(1);
    expect(m.changes[0]).toMatchObject({ label: 'input d: distribution u', kind: 'changed', base: 0.000012, theirs: 0.00001, mine: 0.000012, conflict: false });
    expect(input(m.document!, 'd').distribution).toEqual({ kind: 'normal', value: 0.00022, u: 0.00001 });
  });

  it('drops a change of theirs only when told to, and then keeps mine', () => {
    const theirs = copy(base());
    theirs.title = 'Gauge block 50 mm, grade K';
    const mine = copy(base());
    const changes = listTheirChanges(base(), theirs, mine);
    expect(changes.map((c) => [c.label, c.theirs, c.mine])).toEqual([['title', 'Gauge block 50 mm, grade K', 'Gauge block 50 mm']]);
    expect(mergeDocuments(base(), theirs, mine).document!.title).toBe('Gauge block 50 mm, grade K');
    expect(mergeDocuments(base(), theirs, mine, { [changes[0]!.id]: 'mine' }).document!.title).toBe('Gauge block 50 mm');
  });

  it('reports a field both changed differently as a conflict with both values, and merges nothing until it is decided', () => {
    const theirs = copy(base());
    theirs.model = 'L = Ls + d';
    const mine = copy(base());
    mine.model = 'L = Ls + d + Ls * a * t + 0';
    const m = mergeDocuments(base(), theirs, mine);
    expect(m.changes).toEqual([expect.objectContaining({ label: 'model', conflict: true, theirs: 'L = Ls + d', mine: 'L = Ls + d + Ls * a * t + 0', base: 'L = Ls + d + Ls * a * t' })]);
    expect(m.document).toBeNull();
    expect(m.undecided).toEqual([m.changes[0]!.id]);
    expect(mergeDocuments(base(), theirs, mine, { [m.changes[0]!.id]: 'theirs' }).document!.model).toBe('L = Ls + d');
    expect(mergeDocuments(base(), theirs, mine, { [m.changes[0]!.id]: 'mine' }).document!.model).toBe('L = Ls + d + Ls * a * t + 0');
  });

  it('matches inputs by symbol: a reordering is no change, an input theirs added lands after its neighbour, one they removed goes', () => {
    const theirs = copy(base());
    theirs.inputs.splice(2, 0, { symbol: 'dT', unit: 'K', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.02 } });
    theirs.inputs = theirs.inputs.filter((q) => q.symbol !== 't');
    const mine = copy(base());
    mine.inputs.reverse();
    const m = mergeDocuments(base(), theirs, mine);
    expect(m.changes.map((c) => [c.label, c.kind, c.conflict])).toEqual([
      ['input t', 'removed', false],
      ['input dT', 'added', false],
    ]);
    // mine is a, d, Ls (t removed); dT follows d, its predecessor in theirs
    expect(m.document!.inputs.map((q) => q.symbol)).toEqual(['a', 'd', 'dT', 'Ls']);
  });

  it('treats the removal of an input mine changed as a conflict, and restores theirs whole when theirs changed an input mine removed', () => {
    const theirs = copy(base());
    theirs.inputs = theirs.inputs.filter((q) => q.symbol !== 'a');
    (input(theirs, 't').distribution as { halfWidth: number }).halfWidth = 0.3;
    const mine = copy(base());
    (input(mine, 'a').distribution as { halfWidth: number }).halfWidth = 2e-6;
    mine.inputs = mine.inputs.filter((q) => q.symbol !== 't');
    const m = mergeDocuments(base(), theirs, mine);
    const byLabel = Object.fromEntries(m.changes.map((c) => [c.label, c]));
    expect(byLabel['input a']).toMatchObject({ kind: 'removed', conflict: true });
    expect(byLabel['input t: distribution halfWidth']).toMatchObject({ kind: 'changed', conflict: true, mine: undefined, theirs: 0.3 });
    const keepTheirs = Object.fromEntries(m.changes.map((c) => [c.id, 'theirs' as const]));
    const merged = mergeDocuments(base(), theirs, mine, keepTheirs).document!;
    expect(merged.inputs.map((q) => q.symbol)).toEqual(['Ls', 'd', 't']);
    expect(input(merged, 't')).toEqual({ symbol: 't', unit: 'K', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.3 } });
  });

  it('merges a distribution whose kind changed as one value, never field by field', () => {
    const theirs = copy(base());
    input(theirs, 't').distribution = { kind: 'triangular', value: 0, halfWidth: 0.5 };
    const mine = copy(base());
    const m = mergeDocuments(base(), theirs, mine);
    expect(m.changes.map((c) => c.label)).toEqual(['input t: distribution']);
    expect(input(m.document!, 't').distribution).toEqual({ kind: 'triangular', value: 0, halfWidth: 0.5 });
  });

  it('keys correlations by their pair and constants by symbol, and treats "__proto__" as an ordinary symbol', () => {
    const b = base();
    b.correlations = [{ between: ['Ls', 'd'], r: 0.2 }];
    const theirs = copy(b);
    theirs.correlations = [{ between: ['d', 'Ls'], r: 0.5 }];
    theirs.constants = [{ symbol: '__proto__', value: 1 }];
    const mine = copy(b);
    const m = mergeDocuments(b, theirs, mine);
    expect(m.changes.map((c) => [c.label, c.kind])).toEqual([
      ['correlation Ls–d: between', 'changed'],
      ['correlation Ls–d: r', 'changed'],
      ['constant __proto__', 'added'],
    ]);
    expect(m.document!.correlations).toEqual([{ between: ['d', 'Ls'], r: 0.5 }]);
    expect(m.document!.constants).toEqual([{ symbol: '__proto__', value: 1 }]);
    expect(Object.getPrototypeOf(m.document!)).toBe(Object.prototype);
  });

  it('lists nothing when theirs changed nothing', () => {
    const mine = copy(base());
    mine.title = 'mine only';
    expect(mergeDocuments(base(), base(), mine)).toMatchObject({ changes: [], undecided: [], document: mine });
  });

  describe('properties over random edits (fast-check)', () => {
    const edit = fc.record({
      title: fc.option(fc.string({ minLength: 1, maxLength: 20 }), { nil: undefined }),
      changes: fc.array(fc.record({ i: fc.nat(3), what: fc.constantFrom('value', 'unit', 'remove'), x: fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e3, max: 1e3 }) }), { maxLength: 4 }),
      add: fc.boolean(),
    });
    type Edit = typeof edit extends fc.Arbitrary<infer T> ? T : never;
    function apply(e: Edit, tag: string): BudgetDocument {
      const d = base();
      if (e.title !== undefined) d.title = e.title;
      for (const c of e.changes) {
        const q = d.inputs[c.i];
        if (!q) continue;
        // a budget file is JSON, which has no −0
        if (c.what === 'value') (q.distribution as { value: number }).value = c.x === 0 ? 0 : c.x;
        else if (c.what === 'unit') q.unit = `${tag}${c.i}`;
        else d.inputs.splice(c.i, 1);
      }
      if (e.add) d.inputs.push({ symbol: `n_${tag}`, distribution: { kind: 'normal', value: 1, u: 0.1 } });
      return d;
    }
    const bySymbol = (d: BudgetDocument) => Object.fromEntries(d.inputs.map((q) => [q.symbol, q]));
    const content = (d: BudgetDocument) => ({ ...d, inputs: bySymbol(d) });

    it('with nothing changed on my side, keeping every change of theirs gives theirs', () => {
      fc.assert(
        fc.property(edit, (e) => {
          const theirs = apply(e, 't');
          const m = mergeDocuments(base(), theirs, base());
          expect(m.undecided).toEqual([]);
          expect(content(m.document!)).toEqual(content(theirs));
        }),
      );
    });

    it('with nothing changed on their side, nothing is listed and mine is saved as it is', () => {
      fc.assert(
        fc.property(edit, (e) => {
          const mine = apply(e, 'm');
          expect(mergeDocuments(base(), base(), mine)).toEqual({ changes: [], undecided: [], document: mine });
        }),
      );
    });

    it('dropping every change of theirs gives back mine; each listed change has a value that differs from base', () => {
      fc.assert(
        fc.property(edit, edit, (et, em) => {
          const theirs = apply(et, 't');
          const mine = apply(em, 'm');
          const changes = listTheirChanges(base(), theirs, mine);
          for (const c of changes) expect(JSON.stringify(c.theirs)).not.toBe(JSON.stringify(c.base));
          const dropAll = Object.fromEntries(changes.map((c) => [c.id, 'mine' as const]));
          expect(content(mergeDocuments(base(), theirs, mine, dropAll).document!)).toEqual(content(mine));
        }),
      );
    });
  });
});
