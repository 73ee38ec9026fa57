import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { BudgetView } from '../../../../shared/api/budgets';
import { ApiError, errorMessage } from '../../../app/http';
import type { MonteCarloSlotProps } from '../../../app/slots';
import { ErrorNote, Spinner } from '../../../app/ui/controls';
import type { Editor as EditorUser } from '../access';
import { useBudget, useBudgetVersion } from '../api/editor';
import type { EditorSlots } from '../slots';
import { Editor } from './Editor';

/** The editor's page: loads the budget (and the past version asked for) and opens the editor on it; a new budget when there is no id. */
export function EditorPage({
  me,
  budgetId,
  versionNumber,
  renderMonteCarlo,
  slots,
}: {
  me: EditorUser;
  budgetId?: number;
  versionNumber?: number;
  renderMonteCarlo(props: MonteCarloSlotProps): ReactNode;
  slots?: EditorSlots;
}) {
  const budget = useBudget(budgetId);
  const version = useBudgetVersion(budgetId, versionNumber);
  const loaded: BudgetView | undefined = budget.data;

  if (budgetId !== undefined && (budget.isPending || (versionNumber !== undefined && version.isPending))) {
    return (
      <div className="p-8">
        <Spinner label="Loading the budget" />
      </div>
    );
  }
  if (budget.isError || version.isError) {
    const e = budget.error ?? version.error;
    return (
      <div className="mx-auto max-w-xl p-8">
        <ErrorNote heading title={e instanceof ApiError && e.status === 404 ? 'No such budget or version' : 'The budget could not be loaded'}>
          {errorMessage(e)}
        </ErrorNote>
        <Link to="/budgets" className="mt-3 inline-block text-sm text-accent-700 underline">
          Back to the budgets
        </Link>
      </div>
    );
  }
  const viewingOld = versionNumber !== undefined && loaded && versionNumber !== loaded.currentVersion;
  const start =
    viewingOld && version.data
      ? { document: version.data.document, result: version.data.result, version: version.data.number }
      : loaded
        ? { document: loaded.document, result: loaded.result, version: loaded.currentVersion }
        : null;
  const shown = viewingOld && version.data ? version.data : (loaded?.version ?? null);
  return <Editor me={me} budgetId={budgetId} view={loaded ?? null} shown={shown} start={start} viewingOld={!!viewingOld} renderMonteCarlo={renderMonteCarlo} slots={slots ?? {}} />;
}
