import { useCallback, useEffect, useMemo, useState } from 'react';
import type { BudgetResult } from '../../../shared/budget/result';
import type { BudgetDocument } from '../../../shared/budget/schema';
import { addPhysicalConstant } from '../../../shared/constants/add-constant';
import type { PhysicalConstant } from '../../../shared/constants/physical-constants';
import type { KeyedInput } from './components/InputsList';
import { documentText, draftToOffer, isUnsaved, newDocument, newInput } from './draft';
import { clearDraft, loadDraft, storeDraft, type StoredDraft } from './draft-storage';

/** The version the editor opened with: its document, stored result and number. */
export interface StartingVersion {
  document: BudgetDocument;
  result: BudgetResult;
  version: number;
}

let keySeq = 0;
/** A key for an input row that stays with it while the list is reordered. */
const newKey = () => `q${++keySeq}`;

/** How long the draft rests before it is written to the browser's storage. */
const KEEP_AFTER_MS = 300;

/**
 * The draft on screen: the document, the keys of its input rows, the version
 * it started from, which rows are open, and the draft kept in this browser
 * (offered when the editor opens, written while `keep` is true and there is
 * something unsaved).
 */
export function useDraft({ budgetId, start, viewingOld, keep }: { budgetId?: number; start: StartingVersion | null; viewingOld: boolean; keep: boolean }) {
  const initialDoc = useMemo(() => start?.document ?? newDocument(), [start?.document]);
  const [doc, setDocState] = useState<BudgetDocument>(initialDoc);
  const [keys, setKeys] = useState<string[]>(() => initialDoc.inputs.map(newKey));
  const [stored, setStored] = useState(() => (start ? documentText(start.document) : ''));
  const [baseVersion, setBaseVersion] = useState(start?.version ?? 0);
  const [openKeys, setOpenKeys] = useState<Set<string>>(() => new Set(budgetId === undefined ? keys.slice(0, 1) : []));
  const [offered, setOffered] = useState<StoredDraft | null>(() => draftToOffer(loadDraft(budgetId), initialDoc, viewingOld));

  const dirty = isUnsaved(doc, stored);
  const setDoc = useCallback((fn: (d: BudgetDocument) => BudgetDocument) => setDocState((d) => fn(d)), []);
  /** A whole new document on screen: every input row gets a new key. */
  const replaceDoc = (next: BudgetDocument) => {
    setDocState(next);
    setKeys(next.inputs.map(newKey));
  };

  useEffect(() => {
    if (!keep || !dirty || offered) return;
    const t = setTimeout(() => storeDraft(budgetId, { document: doc, baseVersion, savedAt: Date.now() }), KEEP_AFTER_MS);
    return () => clearTimeout(t);
  }, [doc, dirty, keep, budgetId, baseVersion, offered]);

  const items: KeyedInput[] = doc.inputs.map((input, i) => ({ key: keys[i] ?? `missing${i}`, input }));

  return {
    doc,
    setDoc,
    dirty,
    baseVersion,
    items,
    setItems(next: KeyedInput[]) {
      setKeys(next.map((i) => i.key));
      setDoc((d) => ({ ...d, inputs: next.map((i) => i.input) }));
    },
    openKeys,
    toggleOpen(key: string) {
      setOpenKeys((s) => {
        const n = new Set(s);
        if (n.has(key)) n.delete(key);
        else n.add(key);
        return n;
      });
    },
    addInput() {
      const key = newKey();
      setKeys((k) => [...k, key]);
      setDoc((d) => ({ ...d, inputs: [...d.inputs, newInput(d.inputs)] }));
      setOpenKeys((s) => new Set(s).add(key));
    },
    addConstant(c: PhysicalConstant, asInput: boolean) {
      const next = addPhysicalConstant(doc, c, asInput);
      if (next.inputs.length > doc.inputs.length) setKeys((k) => [...k, newKey()]);
      setDocState(next);
    },
    /** The draft kept in this browser, offered until it is restored or discarded. */
    offered,
    restoreOffered() {
      if (!offered) return;
      replaceDoc(offered.document);
      if (offered.baseVersion) setBaseVersion(offered.baseVersion);
      setOffered(null);
    },
    discardOffered() {
      clearDraft(budgetId);
      setOffered(null);
    },
    /** The document was saved as `version`: it is now the stored one. */
    markSaved(document: BudgetDocument, version: number) {
      clearDraft(budgetId);
      setStored(documentText(document));
      setBaseVersion(version);
    },
    /** The stored `version` replaces the draft. */
    load(document: BudgetDocument, version: number) {
      clearDraft(budgetId);
      replaceDoc(document);
      setStored(documentText(document));
      setBaseVersion(version);
    },
    /** A merge with the newer `version` replaces the draft, still unsaved. */
    adoptMerge(document: BudgetDocument, version: number) {
      replaceDoc(document);
      setBaseVersion(version);
    },
  };
}

export type Draft = ReturnType<typeof useDraft>;
