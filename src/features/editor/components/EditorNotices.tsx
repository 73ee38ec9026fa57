import { Link } from 'react-router-dom';
import { Button } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import type { ReadOnlyReason } from '../access';
import { draftStartedBehind } from '../draft';
import type { StoredDraft } from '../draft-storage';

/** A draft kept in this browser from an earlier visit: restore it or discard it. */
export function DraftOffer({ draft, currentVersion, onRestore, onDiscard }: { draft: StoredDraft; currentVersion?: number; onRestore(): void; onDiscard(): void }) {
  const behind = draftStartedBehind(draft, currentVersion);
  return (
    <div role="status" className="flex flex-wrap items-center gap-3 rounded-md border border-caution-500 bg-caution-50 px-3 py-2 text-sm text-caution-700">
      <span className="flex-1">
        An unsaved draft from {formatDateTime(draft.savedAt)} is kept in this browser
        {behind !== null ? ` (started from version ${behind}; the budget is now at version ${currentVersion})` : ''}.
      </span>
      <Button size="sm" variant="primary" onClick={onRestore}>
        Restore the draft
      </Button>
      <Button size="sm" onClick={onDiscard}>
        Discard it
      </Button>
    </div>
  );
}

/** Why the budget on screen cannot be edited, and what can be done. */
export function ReadOnlyNotice({
  reason,
  budgetId,
  version,
  approvedVersion,
  mayEdit,
  trainee,
}: {
  reason: ReadOnlyReason;
  budgetId?: number;
  version: number;
  approvedVersion?: number | null;
  mayEdit: boolean;
  trainee: boolean;
}) {
  switch (reason) {
    case 'past-version':
      return (
        <p className="rounded-md border border-stone-300 bg-stone-100 px-3 py-2 text-sm text-stone-800">
          You are looking at version {version}, read-only.{' '}
          <Link to={`/budgets/${budgetId}`} className="font-medium text-accent-700 underline">
            Open the current version
          </Link>
          .
        </p>
      );
    case 'in-review':
      return <p className="rounded-md border border-accent-600 bg-accent-50 px-3 py-2 text-sm text-accent-700">This budget is in review: it is read-only until it is approved or returned.</p>;
    case 'approved':
      return (
        <p className="rounded-md border border-accent-700 bg-accent-50 px-3 py-2 text-sm text-accent-700">
          ✓ Version {approvedVersion ?? version} is approved and cannot change.{mayEdit ? ' Editing starts a new draft version; the approved one stays on record.' : ''}
        </p>
      );
    case 'not-yours':
      return (
        <p className="rounded-md border border-stone-300 bg-stone-100 px-3 py-2 text-sm text-stone-800">
          Read-only: only the owner{trainee ? ' (and only while it is a draft)' : ''} can change this budget.
        </p>
      );
    default:
      return null;
  }
}
