import { Button } from './controls';
import { formatCount } from './numbers';

/** The footer of a paged table: which rows are shown, and previous / next. */
export function Pager({ page, pages, pageSize, total, onPage }: { page: number; pages: number; pageSize: number; total: number; onPage(page: number): void }) {
  return (
    <nav aria-label="Pages" className="flex items-center justify-between border-t border-stone-200 px-3 py-2 text-sm text-stone-700">
      <span>
        {formatCount((page - 1) * pageSize + 1)}–{formatCount(Math.min(page * pageSize, total))} of {formatCount(total)}
      </span>
      <div className="flex items-center gap-2">
        <Button size="sm" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          ‹ Previous
        </Button>
        <span>
          Page {page} of {pages}
        </span>
        <Button size="sm" disabled={page >= pages} onClick={() => onPage(page + 1)}>
          Next ›
        </Button>
      </div>
    </nav>
  );
}
