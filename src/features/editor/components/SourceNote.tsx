import { Link } from 'react-router-dom';
import type { BudgetView } from '../../../../shared/api/budgets';
import { useBudget } from '../api/editor';

/** Where a cloned budget came from: the template or budget and its version. */
export function SourceNote({ source }: { source: NonNullable<BudgetView['source']> }) {
  const origin = useBudget(source.budgetId);
  const kind = origin.data?.isTemplate ? 'template' : 'budget';
  return (
    <p data-testid="budget-source" className="text-xs text-stone-700">
      <span aria-hidden>↳ </span>Cloned from {origin.data ? kind : 'budget'}{' '}
      <Link to={`/budgets/${source.budgetId}`} className="font-medium text-accent-700 underline">
        {origin.data?.title ?? `budget ${source.budgetId}`}
      </Link>
      {source.version ? (
        <>
          , <span className="num">version {source.version}</span>
        </>
      ) : null}
      .
    </p>
  );
}
