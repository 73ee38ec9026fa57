import { Link } from 'react-router-dom';
import { can, type Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { ErrorNote, Spinner } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { useReviewQueue } from '../api/reviews';

/** The home page's list of budgets waiting for this reviewer's signature, oldest first. */
export function ReviewQueue({ role }: { role: Role }) {
  const mayApprove = can(role, 'budget.approve');
  const queue = useReviewQueue(mayApprove);
  if (!mayApprove) return null;
  return (
    <section aria-labelledby="queue-h" data-testid="review-queue" className="mx-auto mt-6 w-full max-w-6xl px-6">
      <div className="rounded-lg border border-accent-600 bg-white p-4">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="queue-h" className="text-base font-semibold text-stone-900">
            Awaiting your review
          </h2>
          <span className="text-xs text-stone-600">Budgets in review that you neither own nor wrote, longest waiting first.</span>
        </div>
        {queue.isPending ? (
          <Spinner label="Loading your review queue" />
        ) : queue.isError ? (
          <ErrorNote title="The review queue could not be loaded">{errorMessage(queue.error)}</ErrorNote>
        ) : queue.data.length === 0 ? (
          <p className="text-sm text-stone-700">Nothing is waiting for you.</p>
        ) : (
          <ul className="flex flex-col divide-y divide-stone-100">
            {queue.data.map((q) => (
              <li key={q.budgetId} className="flex flex-wrap items-baseline gap-x-4 gap-y-0.5 py-2 text-sm">
                <Link to={`/budgets/${q.budgetId}`} className="font-medium text-accent-700 underline">
                  {q.title}
                </Link>
                <span className="num text-stone-700">version {q.version}</span>
                <span className="text-stone-700">
                  by {q.authorName}
                  {q.authorName !== q.ownerName ? ` for ${q.ownerName}` : ''}
                </span>
                <span className="text-xs text-stone-600">in review since {formatDateTime(q.since)}</span>
                {q.openThreads ? (
                  <span className="rounded-full border border-caution-500 bg-caution-50 px-2 text-xs font-medium text-caution-700">
                    {q.openThreads} open thread{q.openThreads === 1 ? '' : 's'}
                  </span>
                ) : (
                  <span className="text-xs text-stone-600">no open threads</span>
                )}
              </li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}
