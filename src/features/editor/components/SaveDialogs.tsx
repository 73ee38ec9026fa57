import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { mergeDocuments, type MergeDecision, type TheirChange } from '../../../../shared/budget/merge-documents';
import type { BudgetDocument } from '../../../../shared/budget/schema';
import { errorMessage } from '../../../app/http';
import { Button, ErrorNote, Field, FormDialog, Modal, Spinner, TextArea } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { versionQuery as budgetVersionQuery, versionListQuery as editorVersionsQuery } from '../../../budget/queries';
import { VERSION_NOTE_MAX_LENGTH } from '../../../../shared/api/version-note';
import { noteProblem, noteToSave } from '../save-note';

export function SaveDialog({ open, onClose, onSave, saving, isNew, error }: { open: boolean; onClose(): void; onSave(note: string): void; saving: boolean; isNew: boolean; error: string | null }) {
  const [note, setNote] = useState('');
  // said from the first try to save on, and again at each change after it
  const [tried, setTried] = useState(false);
  const problem = noteProblem(note, isNew);
  return (
    <FormDialog
      open={open}
      onClose={onClose}
      title={isNew ? 'Save the first version' : 'Save a new version'}
      onSubmit={() => {
        setTried(true);
        if (problem === null) onSave(noteToSave(note));
      }}
      submitLabel="Save version"
      pendingLabel="Saving…"
      pending={saving}
    >
      <Field label="Change note" error={tried ? problem : null} hint={isNew ? 'Optional for the first version.' : 'e.g. “new certificate for the reference, U from 30 nm to 25 nm”'}>
        {(p) => <TextArea {...p} rows={3} value={note} onChange={(e) => setNote(e.target.value)} autoFocus maxLength={VERSION_NOTE_MAX_LENGTH} />}
      </Field>
      <p className="text-xs text-stone-600">The server computes the saved version again (GUM and Monte Carlo) and stores the result with it.</p>
      {error ? (
        <p role="alert" className="rounded-md border border-caution-500 bg-caution-50 px-2 py-1 text-sm text-caution-700">
          {error}
        </p>
      ) : null}
    </FormDialog>
  );
}

/** A stored document value as text: numbers exactly as stored, text quoted, absent as "—". */
function shown(v: unknown): string {
  if (v === undefined || v === null) return '—';
  if (typeof v === 'string') return `“${v}”`;
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  return JSON.stringify(v);
}

const KIND_WORD: Record<TheirChange['kind'], string> = { changed: 'changed', added: 'added', removed: 'removed' };

/**
 * Someone saved while this draft was open. Every change of theirs is named with
 * its value and mine; each is kept or dropped here, and the merge is saved on
 * top of the newer version. Nothing of theirs is undone without being shown.
 */
export function ConflictDialog({
  budgetId,
  baseVersion,
  currentVersion,
  mine,
  onReload,
  onSaveMerged,
  onClose,
  saving,
}: {
  budgetId: number;
  baseVersion: number;
  currentVersion: number;
  mine: BudgetDocument;
  onReload(): void;
  onSaveMerged(document: BudgetDocument): void;
  onClose(): void;
  saving: boolean;
}) {
  const versions = useQuery(editorVersionsQuery(budgetId));
  const base = useQuery(budgetVersionQuery(budgetId, baseVersion));
  const theirs = useQuery(budgetVersionQuery(budgetId, currentVersion));
  const [decisions, setDecisions] = useState<Record<string, MergeDecision>>({});
  const newer = (versions.data ?? []).filter((v) => v.number > baseVersion);
  const merge = base.data && theirs.data ? mergeDocuments(base.data.document, theirs.data.document, mine, decisions) : null;
  const undecided = new Set(merge?.undecided ?? []);
  const [tried, setTried] = useState(false);
  return (
    <Modal open onClose={onClose} title="Someone saved this budget meanwhile" wide>
      <p className="text-sm text-stone-700">
        You started from version {baseVersion}; the budget is now at version {currentVersion}. Your changes are still here and kept in this browser. Choose, for each change made meanwhile, whether it
        stays; then save the result as version {currentVersion + 1}.
      </p>
      {versions.isPending ? (
        <Spinner label="Loading the newer versions" />
      ) : (
        <ul className="flex flex-col gap-1 text-sm">
          {newer.map((v) => (
            <li key={v.number} className="rounded-md border border-stone-200 px-2 py-1">
              <span className="num font-semibold">v{v.number}</span> by {v.authorName}, {formatDateTime(v.createdAt)}: {v.note || <em>no note</em>}
            </li>
          ))}
        </ul>
      )}
      {base.isError || theirs.isError ? (
        <ErrorNote title="The versions to merge could not be loaded">{errorMessage(base.error ?? theirs.error)}</ErrorNote>
      ) : !merge ? (
        <Spinner label="Comparing the versions" />
      ) : merge.changes.length === 0 ? (
        <p className="rounded-md bg-stone-50 p-2 text-sm text-stone-800">
          Version {currentVersion} changed nothing in the budget document itself (for example, evidence was added); saving yours on top loses nothing.
        </p>
      ) : (
        <div className="max-h-[50vh] overflow-auto rounded-md border border-stone-200">
          <table className="w-full text-left text-sm" data-testid="merge-table">
            <caption className="sr-only">Changes made in the newer version, with your value and the choice to keep or drop each</caption>
            <thead className="sticky top-0 border-b border-stone-200 bg-stone-50 text-xs text-stone-700">
              <tr>
                <th scope="col" className="px-2 py-1.5 font-semibold">
                  Changed meanwhile
                </th>
                <th scope="col" className="px-2 py-1.5 font-semibold">
                  Theirs (v{currentVersion})
                </th>
                <th scope="col" className="px-2 py-1.5 font-semibold">
                  Yours
                </th>
                <th scope="col" className="px-2 py-1.5 font-semibold">
                  Keep
                </th>
              </tr>
            </thead>
            <tbody>
              {merge.changes.map((c) => {
                const choice = decisions[c.id] ?? (c.conflict ? undefined : 'theirs');
                const name = `keep-${c.id}`;
                return (
                  <tr key={c.id} data-testid="merge-change" className={`border-b border-stone-100 align-top last:border-0 ${c.conflict ? 'bg-caution-50' : ''}`}>
                    <th scope="row" className="px-2 py-1.5 font-medium">
                      {c.label} <span className="text-xs font-normal text-stone-600">{KIND_WORD[c.kind]}</span>
                      {c.conflict ? <p className="text-xs font-semibold text-caution-700">you changed it too: choose</p> : null}
                      <p className="num text-xs font-normal text-stone-600">was {shown(c.base)}</p>
                    </th>
                    <td className="num max-w-[14rem] break-words px-2 py-1.5">{shown(c.theirs)}</td>
                    <td className="num max-w-[14rem] break-words px-2 py-1.5">{shown(c.mine)}</td>
                    <td className="whitespace-nowrap px-2 py-1.5">
                      <fieldset aria-label={`Keep for ${c.label}`} className={tried && undecided.has(c.id) ? 'rounded outline outline-2 outline-caution-500' : ''}>
                        <label className="mr-2 inline-flex items-center gap-1">
                          <input type="radio" name={name} checked={choice === 'theirs'} onChange={() => setDecisions((d) => ({ ...d, [c.id]: 'theirs' }))} />
                          theirs
                        </label>
                        <label className="inline-flex items-center gap-1">
                          <input type="radio" name={name} checked={choice === 'mine'} onChange={() => setDecisions((d) => ({ ...d, [c.id]: 'mine' }))} />
                          {c.conflict ? 'yours' : 'drop it'}
                        </label>
                      </fieldset>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {tried && undecided.size ? (
        <p role="alert" className="text-sm text-caution-700">
          Choose theirs or yours for the {undecided.size} field{undecided.size === 1 ? '' : 's'} you both changed.
        </p>
      ) : null}
      <div className="flex flex-wrap justify-end gap-2">
        <Button onClick={onClose}>Keep editing</Button>
        <Button variant="danger" onClick={onReload}>
          Discard mine, load v{currentVersion}
        </Button>
        <Button
          variant="primary"
          disabled={saving || !merge}
          onClick={() => {
            setTried(true);
            if (merge?.document) onSaveMerged(merge.document);
          }}
        >
          {saving ? 'Saving…' : `Save the merge as v${currentVersion + 1}`}
        </Button>
      </div>
    </Modal>
  );
}

export function LeaveDialog({ open, onStay, onLeave }: { open: boolean; onStay(): void; onLeave(): void }) {
  return (
    <Modal open={open} onClose={onStay} title="Leave without saving?">
      <p className="text-sm text-stone-700">Your changes are not saved as a version. They stay in this browser, and the editor offers them again when you come back.</p>
      <div className="flex justify-end gap-2">
        <Button variant="primary" onClick={onStay}>
          Stay and save
        </Button>
        <Button onClick={onLeave}>Leave</Button>
      </div>
    </Modal>
  );
}
