import type { BudgetStatus } from '../../../shared/policy/policy';
import { STATUS_WORDS, type VersionStatus } from '../../../shared/presentation/status';

export type DisplayStatus = BudgetStatus | 'returned';

/** Draft, in review, approved, returned and superseded: each its own colour and shape; the word is the one the report and the PDF print. */
const STYLES: Record<VersionStatus, { mark: string; className: string; hint: string }> = {
  draft: { mark: '○', className: 'border-stone-400 bg-white text-stone-700', hint: 'a draft: it may still change' },
  in_review: { mark: '◐', className: 'border-accent-600 bg-accent-50 text-accent-700', hint: 'sent for review: read-only until approved or returned' },
  approved: { mark: '✓', className: 'border-accent-700 bg-accent-700 text-white', hint: 'approved by a reviewer: it cannot change' },
  returned: { mark: '↩', className: 'border-caution-500 bg-caution-50 text-caution-700', hint: 'a draft the reviewer sent back' },
  superseded: { mark: '⊘', className: 'border-dashed border-stone-400 bg-stone-100 text-stone-600', hint: 'an older draft, never approved, replaced by a later version' },
};

function displayStatus(status: BudgetStatus, returned?: boolean): DisplayStatus {
  return status === 'draft' && returned ? 'returned' : status;
}

export function statusLabel(s: VersionStatus): string {
  return STATUS_WORDS[s];
}

/** A budget's status (with `returned`) or one version's status (from `versionStatus`). */
export function StatusBadge({ status, returned, prefix, testId }: { status: VersionStatus; returned?: boolean; prefix?: string; testId?: string }) {
  const shown = status === 'draft' || status === 'in_review' || status === 'approved' ? displayStatus(status, returned) : status;
  const s = STYLES[shown];
  return (
    <span title={s.hint} data-testid={testId} className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold ${s.className}`}>
      <span aria-hidden>{s.mark}</span>
      {prefix ? <span className="font-normal">{prefix}</span> : null}
      {STATUS_WORDS[shown]}
    </span>
  );
}
