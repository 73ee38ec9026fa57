import { useComments } from '../api/reviews';

function BubbleIcon() {
  return (
    <svg aria-hidden viewBox="0 0 16 16" className="h-3 w-3" fill="none" stroke="currentColor" strokeWidth="1.6">
      <path d="M2.5 3.5h11v7h-6l-3 2.5v-2.5h-2z" strokeLinejoin="round" />
    </svg>
  );
}

/** The count badge on a budget-table row: opens the comment thread of that quantity. */
export function CommentBadge({ budgetId, symbol, open, onOpen }: { budgetId: number; symbol: string; open: boolean; onOpen(symbol: string): void }) {
  const comments = useComments(budgetId);
  const mine = (comments.data ?? []).filter((c) => c.symbol === symbol);
  const unresolved = mine.filter((c) => !c.resolved).length;
  const label = mine.length ? `${mine.length} comment${mine.length === 1 ? '' : 's'} on ${symbol}` : `Comment on ${symbol}`;
  return (
    <button
      type="button"
      aria-label={label}
      aria-expanded={open}
      title={mine.length ? `${mine.length} comment${mine.length === 1 ? '' : 's'}, ${unresolved} open` : 'Comment on this contribution'}
      onClick={(e) => {
        e.stopPropagation();
        onOpen(symbol);
      }}
      onKeyDown={(e) => e.stopPropagation()}
      className={`no-print ml-1.5 inline-flex min-w-[1.75rem] items-center justify-center gap-0.5 rounded-full border px-1.5 text-[11px] font-semibold leading-5 ${
        open
          ? 'border-accent-700 bg-accent-700 text-white'
          : unresolved
            ? 'border-caution-500 bg-caution-50 text-caution-700'
            : mine.length
              ? 'border-stone-400 bg-white text-stone-700'
              : 'border-dashed border-stone-300 bg-white text-stone-500 hover:border-stone-500'
      }`}
    >
      <BubbleIcon />
      {mine.length ? <span className="num">{mine.length}</span> : <span aria-hidden>+</span>}
    </button>
  );
}
