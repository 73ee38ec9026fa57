import { formatDateTime } from '../../../app/ui/numbers';
import { useReviewState } from '../api/reviews';

/** At the top of a returned budget: who sent it back, when, and why. */
export function ReturnedNotice({ budgetId, meId }: { budgetId: number; meId: number }) {
  const state = useReviewState(budgetId);
  const r = state.data?.lastReturn;
  if (!r) return null;
  return (
    <div role="status" data-testid="returned-notice" className="rounded-md border border-caution-500 bg-caution-50 px-3 py-2 text-sm text-stone-900">
      <p className="font-semibold text-caution-700">
        ↩ Returned to draft by {r.actorId === meId ? 'you' : r.actorName} on {formatDateTime(r.at)} (version {r.versionNumber})
      </p>
      <p className="mt-0.5 whitespace-pre-wrap break-words">“{r.reason}”</p>
      <p className="mt-0.5 text-xs text-stone-700">Change the budget, save a version, resolve the threads you answered, then submit it again.</p>
    </div>
  );
}
