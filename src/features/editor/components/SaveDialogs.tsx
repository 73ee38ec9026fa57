import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '../../../app/http';
import { Button, Field, FormDialog, Modal, Spinner, TextArea } from '../../../app/ui/controls';
import { formatDateTime, formatUncertainty } from '../../../app/ui/numbers';
import { editorVersionsQuery } from '../api/editor';

export function SaveDialog({
  open,
  onClose,
  onSave,
  saving,
  isNew,
  error,
}: {
  open: boolean;
  onClose(): void;
  onSave(note: string): void;
  saving: boolean;
  isNew: boolean;
  error: string | null;
}) {
  const [note, setNote] = useState('');
  const [touched, setTouched] = useState(false);
  const noteError = touched && !isNew && note.trim() === '' ? 'Say in a few words what changed; the note goes into the version history.' : null;
  return (
    <FormDialog
      open={open}
      onClose={onClose}
      title={isNew ? 'Save the first version' : 'Save a new version'}
      onSubmit={() => {
        setTouched(true);
        if (!isNew && note.trim() === '') return;
        onSave(note.trim() || 'first version');
      }}
      submitLabel="Save version"
      pendingLabel="Saving…"
      pending={saving}
    >
      <Field label="Change note" error={noteError} hint={isNew ? 'Optional for the first version.' : 'e.g. “new certificate for the reference, U from 30 nm to 25 nm”'}>
        {(p) => <TextArea {...p} rows={3} value={note} onChange={(e) => setNote(e.target.value)} autoFocus maxLength={2000} />}
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

interface DiffSummary {
  model: { changed: boolean };
  measurand: { field: string }[];
  other: { field: string }[];
  inputs: { added: { symbol?: string }[]; removed: { symbol?: string }[]; changed: { key: string; changes: { field: string }[] }[] };
  result: { expandedUncertainty: { from: number | null; to: number | null } };
}

/** Someone saved while this draft was open: show what happened meanwhile, then reload or save on top. */
export function ConflictDialog({
  budgetId,
  baseVersion,
  currentVersion,
  onReload,
  onSaveOnTop,
  onClose,
  saving,
}: {
  budgetId: number;
  baseVersion: number;
  currentVersion: number;
  onReload(): void;
  onSaveOnTop(): void;
  onClose(): void;
  saving: boolean;
}) {
  const versions = useQuery(editorVersionsQuery(budgetId));
  const diff = useQuery({
    queryKey: ['budgets', budgetId, 'diff', baseVersion, currentVersion],
    queryFn: () => api<DiffSummary>(`/api/budgets/${budgetId}/diff?from=${baseVersion}&to=${currentVersion}`),
  });
  const newer = (versions.data ?? []).filter((v) => v.number > baseVersion);
  const d = diff.data;
  return (
    <Modal open onClose={onClose} title="Someone saved this budget meanwhile" wide>
      <p className="text-sm text-stone-700">
        You started from version {baseVersion}; the budget is now at version {currentVersion}. Your changes are still here and kept in this browser.
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
      {d ? (
        <div className="rounded-md bg-stone-50 p-2 text-sm text-stone-800">
          <p className="font-medium">What changed from v{baseVersion} to v{currentVersion}</p>
          <ul className="ml-4 list-disc">
            {d.other.map((c) => (
              <li key={`o${c.field}`}>{c.field}</li>
            ))}
            {d.measurand.map((c) => (
              <li key={`m${c.field}`}>measurand {c.field}</li>
            ))}
            {d.model.changed ? <li>the model</li> : null}
            {d.inputs.added.map((q, i) => (
              <li key={`a${i}`}>input {q.symbol} added</li>
            ))}
            {d.inputs.removed.map((q, i) => (
              <li key={`r${i}`}>input {q.symbol} removed</li>
            ))}
            {d.inputs.changed.map((c) => (
              <li key={c.key}>
                input {c.key}: {c.changes.map((x) => x.field).join(', ')}
              </li>
            ))}
            {d.result.expandedUncertainty.from !== d.result.expandedUncertainty.to ? (
              <li>
                U from <span className="num">{formatUncertainty(d.result.expandedUncertainty.from ?? NaN)}</span> to{' '}
                <span className="num">{formatUncertainty(d.result.expandedUncertainty.to ?? NaN)}</span>
              </li>
            ) : null}
          </ul>
        </div>
      ) : null}
      <div className="flex flex-wrap justify-end gap-2">
        <Button onClick={onClose}>Keep editing</Button>
        <Button variant="danger" onClick={onReload}>
          Discard mine, load v{currentVersion}
        </Button>
        <Button variant="primary" onClick={onSaveOnTop} disabled={saving}>
          {saving ? 'Saving…' : `Save mine as v${currentVersion + 1}`}
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
