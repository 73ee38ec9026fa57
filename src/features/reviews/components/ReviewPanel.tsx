import { Sym } from '../../../app/ui/quantity';
import { useComments, useReviewState } from '../api/reviews';
import { GENERAL, type ReviewContext, type Reviewer as Me, type ThreadKey } from '../review-context';
import { openThreadCount, threadCounts } from '../thread-order';
import { Thread } from './CommentThread';
import { DecisionLine } from './SigningBrief';

/** The review column beside the budget: the open thread of a row, or the overview of every thread. */
export function ReviewPanel({ ctx, me, thread, onThread }: { ctx: ReviewContext; me: Me; thread: ThreadKey | null; onThread(t: ThreadKey | null): void }) {
  const comments = useComments(ctx.budgetId);
  const review = useReviewState(ctx.budgetId);
  const decisions = review.data?.decisions ?? [];
  const all = comments.data ?? [];
  const open = openThreadCount(all);
  const bySymbol = threadCounts(all);
  return (
    <section aria-labelledby="review-h" data-testid="review-panel" className="no-print rounded-lg border border-stone-200 bg-white p-3">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id="review-h" className="text-sm font-semibold text-stone-900">
          Review
        </h2>
        <span className="text-xs text-stone-600">
          {all.length} comment{all.length === 1 ? '' : 's'}, {open} open thread{open === 1 ? '' : 's'}
        </span>
      </div>
      {thread && thread !== GENERAL ? (
        <Thread key={thread} ctx={ctx} me={me} thread={thread} onClose={() => onThread(null)} />
      ) : (
        <div className="flex flex-col gap-3">
          {bySymbol.size ? (
            <div>
              <p className="mb-1 text-xs font-medium text-stone-700">Threads on contributions</p>
              <ul className="flex flex-wrap gap-1">
                {[...bySymbol].map(([s, n]) => (
                  <li key={s}>
                    <button
                      type="button"
                      onClick={() => onThread(s)}
                      className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs ${n.open ? 'border-caution-500 bg-caution-50 text-caution-700' : 'border-stone-300 text-stone-700'}`}
                    >
                      <span className="sr-only">Open the thread on </span>
                      <Sym s={s} /> <span className="num">{n.total}</span>
                      <span className="sr-only"> comments, {n.open} open</span>
                      {n.open ? <span aria-hidden>●</span> : <span aria-hidden>✓</span>}
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          ) : (
            <p className="text-xs text-stone-600">To comment on one contribution, use the comment badge beside its symbol in the budget table.</p>
          )}
          <Thread ctx={ctx} me={me} thread={GENERAL} />
          {decisions.length ? (
            <section aria-label="Review decisions" data-testid="review-decisions">
              <p className="mb-1 text-xs font-medium text-stone-700">Approvals and returns</p>
              <ul className="flex flex-col gap-1">
                {[...decisions].reverse().map((d) => (
                  <DecisionLine key={d.id} d={d} />
                ))}
              </ul>
            </section>
          ) : null}
        </div>
      )}
    </section>
  );
}
