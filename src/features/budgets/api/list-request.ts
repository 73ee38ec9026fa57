import { BUDGET_SORTS, type BudgetSort } from '../../../../shared/api/budgets';
import type { BudgetStatus } from '../../../../shared/policy/policy';
import { pageOf, paramOneOf, SORT_ORDERS } from '../../../app/list-address';
import type { DisplayStatus } from '../../../budget/components/StatusBadge';
import { budgetListQuery } from '../../../budget/queries';

/** Rows on one page of the budget list. */
export const BUDGET_PAGE_SIZE = 12;

/**
 * What the budget list's address asks for: the status shown in the filter, the owner, the sort,
 * the page, and the query to the server (a returned budget is a draft the reviewer sent back: the
 * server tells them apart). `q` is the search text the list sends (the address's, unless the page
 * is still deferring a change of it). The list page and fetching ahead both read the address here.
 */
export function budgetListRequest(params: URLSearchParams, q: string | undefined = params.get('q') || undefined) {
  const status = (params.get('status') ?? '') as DisplayStatus | '';
  const owner = Number(params.get('owner') ?? '') || undefined;
  const sort = paramOneOf<BudgetSort>(params, 'sort', BUDGET_SORTS, 'updated');
  const dir = paramOneOf(params, 'dir', SORT_ORDERS, 'desc');
  const page = pageOf(params);
  const serverStatus: BudgetStatus | undefined = status === 'returned' ? 'draft' : status || undefined;
  const returned = status === 'returned' ? true : status === 'draft' ? false : undefined;
  const query = budgetListQuery({ status: serverStatus, returned, owner, q }, { limit: BUDGET_PAGE_SIZE, offset: (page - 1) * BUDGET_PAGE_SIZE, sort, order: dir });
  return { status, owner, sort, dir, page, query };
}
