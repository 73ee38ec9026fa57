import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { BudgetDocument } from '../../../shared/budget/schema';
import { ApiError, errorMessage } from '../../app/http';
import { useToast } from '../../app/ui/toasts';
import { budgetQuery } from '../../budget/queries';
import { useSaveBudget } from './api/editor';
import { saveState, type SaveConditions } from './save-rule';
import type { Draft } from './use-draft';

/** The version the server is at when it refuses a save as stale (409), from either shape of its answer; one past ours when it does not say. */
function currentVersionOf(e: ApiError, base: number): number {
  const current = Number((e.body?.error as { currentVersion?: number } | undefined)?.currentVersion ?? (e.body as { currentVersion?: number } | undefined)?.currentVersion);
  return Number.isFinite(current) ? current : base + 1;
}

/**
 * Saving the draft as a new version: the save dialog, the conflict with a
 * version saved meanwhile (merge or reload), and Ctrl+S. `live` says what the
 * live view knows of the draft, for the Save rule (`save-rule.ts`).
 */
export function useSaveFlow({
  budgetId,
  draft,
  readOnly,
  live,
  onSaved,
  allowLeave,
}: {
  budgetId?: number;
  draft: Draft;
  readOnly: boolean;
  live: Omit<SaveConditions, 'dirty' | 'saving'>;
  /** After a save: the approved version is no longer the one being edited. */
  onSaved(): void;
  allowLeave(): void;
}) {
  const isNew = budgetId === undefined;
  const [dialogOpen, setDialogOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [conflict, setConflict] = useState<{ currentVersion: number } | null>(null);
  const lastNote = useRef('');
  const navigate = useNavigate();
  const toast = useToast();
  const qc = useQueryClient();
  const save = useSaveBudget();
  const rule = saveState({ ...live, dirty: draft.dirty, saving: save.isPending });

  const saveAs = (note: string, base: number, from: BudgetDocument = draft.doc) => {
    lastNote.current = note;
    setError(null);
    const document = JSON.parse(JSON.stringify(from)) as BudgetDocument;
    save.mutate(isNew ? { kind: 'create', document, note } : { kind: 'update', id: budgetId, baseVersion: base, document, note }, {
      onSuccess: (r) => {
        draft.markSaved(document, r.version);
        setDialogOpen(false);
        setConflict(null);
        onSaved();
        toast(`Saved as version ${r.version}.`);
        if (isNew) {
          allowLeave();
          navigate(`/budgets/${r.id}`, { replace: true });
        }
      },
      onError: (e) => {
        if (e instanceof ApiError && e.status === 409 && e.code === 'stale_version') {
          setDialogOpen(false);
          setConflict({ currentVersion: currentVersionOf(e, base) });
          return;
        }
        setError(e instanceof ApiError && e.status === 422 ? `The server refused the budget: ${e.message}` : errorMessage(e));
        if (!dialogOpen) toast(`Not saved: ${errorMessage(e)}`, 'error');
      },
    });
  };

  const mayOpen = !readOnly && rule.enabled;
  useEffect(() => {
    const h = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 's') {
        e.preventDefault();
        if (mayOpen) setDialogOpen(true);
      }
    };
    window.addEventListener('keydown', h);
    return () => window.removeEventListener('keydown', h);
  }, [mayOpen]);

  return {
    rule,
    saving: save.isPending,
    dialogOpen,
    openDialog: () => setDialogOpen(true),
    closeDialog: () => setDialogOpen(false),
    error,
    save: (note: string) => saveAs(note, draft.baseVersion),
    conflict,
    closeConflict: () => setConflict(null),
    /** Drops the draft for the budget's current version. */
    async reloadCurrent() {
      if (budgetId === undefined) return;
      const fresh = await qc.fetchQuery({ ...budgetQuery(budgetId), staleTime: 0 });
      draft.load(fresh.document, fresh.currentVersion);
      setConflict(null);
      toast(`Loaded version ${fresh.currentVersion}.`, 'info');
    },
    /** Saves the merge chosen in the conflict dialog on top of the newer version. */
    saveMerged(merged: BudgetDocument) {
      if (!conflict) return;
      draft.adoptMerge(merged, conflict.currentVersion);
      saveAs(lastNote.current || `merged with version ${conflict.currentVersion}`, conflict.currentVersion, merged);
    },
  };
}
