import type { ReactNode } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { BudgetView, VersionMeta } from '../../../../shared/api/budgets';
import { versionStatus } from '../../../../shared/policy/version-status';
import { Breadcrumb } from '../../../app/ui/breadcrumb';
import { Button } from '../../../app/ui/controls';
import { StatusBadge } from '../../../budget/components/StatusBadge';
import type { SaveState } from '../save-rule';
import { SourceNote } from './SourceNote';

const linkButton = 'inline-flex items-center rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm font-medium text-stone-800 hover:bg-stone-100';

/** The title (editable or not), the version's status and people, and the actions on the budget: save, unlock, versions, report, export. */
export function EditorHeader({
  budgetId,
  view,
  shown,
  title,
  onTitle,
  titleProblem,
  readOnly,
  viewingOld,
  baseVersion,
  dirty,
  save,
  unlock,
  headerActions,
}: {
  budgetId?: number;
  view: BudgetView | null;
  /** The version on screen: an older one when viewing history, else the current one. */
  shown: VersionMeta | null;
  title: string;
  onTitle(title: string): void;
  titleProblem: string | null;
  readOnly: boolean;
  viewingOld: boolean;
  baseVersion: number;
  dirty: boolean;
  save: { rule: SaveState; saving: boolean; open(): void };
  /** Offered on an approved version the user may edit: start a new draft from it. */
  unlock: (() => void) | null;
  headerActions: ReactNode;
}) {
  const navigate = useNavigate();
  const isNew = budgetId === undefined;
  return (
    <header className="flex flex-col gap-2">
      <Breadcrumb trail={[{ label: 'Budgets', to: '/budgets' }, { label: isNew ? 'new budget' : `budget ${budgetId}` }]} />
      <div className="flex flex-wrap items-center gap-3">
        {readOnly ? (
          <h1 className="min-w-0 flex-1 px-1 py-0.5 text-xl font-semibold tracking-tight text-stone-900">{title}</h1>
        ) : (
          <>
            {/* the title field is the page's heading; its text is the heading for a reader that lists headings */}
            <h1 className="sr-only">{title || 'New budget'}</h1>
            <label htmlFor="budget-title" className="sr-only">
              Title
            </label>
            <input
              id="budget-title"
              value={title}
              onChange={(e) => onTitle(e.target.value)}
              aria-invalid={!!titleProblem}
              className="min-w-0 flex-1 rounded-md border border-transparent bg-transparent px-1 py-0.5 text-xl font-semibold tracking-tight text-stone-900 hover:border-stone-300 focus:border-stone-300 aria-[invalid=true]:border-caution-500"
            />
          </>
        )}
        {/* the status of the version on screen, not the budget's: an old draft of an approved budget is not approved */}
        <StatusBadge status={view && shown ? versionStatus(view, shown) : 'draft'} />
        {view?.isTemplate ? <span className="rounded-full border border-stone-400 bg-stone-100 px-2 py-0.5 text-xs font-semibold text-stone-700">Template</span> : null}
        {!isNew ? (
          <Link to={`/budgets/${budgetId}/versions`} className="num text-sm text-stone-700 hover:text-accent-700 hover:underline">
            {viewingOld ? `v${baseVersion} of ${view?.currentVersion}` : `v${baseVersion}`}
          </Link>
        ) : null}
        {dirty && !readOnly ? <span className="rounded bg-caution-50 px-2 py-0.5 text-xs font-medium text-caution-700">● unsaved changes</span> : null}
      </div>
      {view && shown ? (
        <p data-testid="budget-people" className="text-xs text-stone-700">
          Owner <span className="font-medium">{view.ownerName}</span> · version {shown.number} saved by <span className="font-medium">{shown.authorName}</span>
          {shown.approverName ? (
            <>
              {' '}
              · approved by <span className="font-medium">{shown.approverName}</span>
            </>
          ) : null}
        </p>
      ) : null}
      {view?.source ? <SourceNote source={view.source} /> : null}
      {titleProblem ? <p className="text-xs text-caution-700">Title: {titleProblem}</p> : null}
      <div className="flex flex-wrap gap-2">
        {!readOnly ? (
          <Button variant="primary" onClick={save.open} disabled={!save.rule.enabled} title={save.rule.title}>
            {save.saving ? 'Saving…' : 'Save version…'}
          </Button>
        ) : null}
        {!readOnly && save.rule.note ? <p className="self-center text-xs text-stone-700">{save.rule.note}</p> : null}
        {unlock ? (
          <Button variant="primary" onClick={unlock}>
            Edit as a new draft
          </Button>
        ) : null}
        {!isNew ? (
          <>
            {headerActions}
            <Button onClick={() => navigate(`/budgets/${budgetId}/versions`)}>Versions</Button>
            <Link to={`/budgets/${budgetId}/versions/${baseVersion}/report`} className={linkButton}>
              Report
            </Link>
            <a href={`/api/budgets/${budgetId}/export?version=${baseVersion}`} download className={linkButton}>
              Export file
            </a>
          </>
        ) : null}
      </div>
    </header>
  );
}
