import type { BudgetStatus } from '../../../shared/policy/policy';

export type DisplayStatus = BudgetStatus | 'returned';

/** Draft, in review, approved and returned: each its own colour, shape and word. */
const STYLES: Record<DisplayStatus, { label: string; mark: string; className: string }> = {
  draft: { label: 'Draft', mark: '○', className: 'border-stone-400 bg-white text-stone-700' },
  in_review: { label: 'In review', mark: '◐', className: 'border-accent-600 bg-accent-50 text-accent-700' },
  approved: { label: 'Approved', mark: '✓', className: 'border-accent-700 bg-accent-700 text-white' },
  returned: { label: 'Returned', mark: '↩', className: 'border-caution-500 bg-caution-50 text-caution-700' },
};

export function displayStatus(status: BudgetStatus, returned?: boolean): DisplayStatus {
  return status === 'draft' && returned ? 'returned' : status;
}

export function statusLabel(s: DisplayStatus): string {
  return STYLES[s].label;
}

export function StatusBadge({ status, returned }: { status: BudgetStatus; returned?: boolean }) {
  const s = STYLES[displayStatus(status, returned)];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold ${s.className}`}>
      <span aria-hidden>{s.mark}</span>
      {s.label}
    </span>
  );
}
