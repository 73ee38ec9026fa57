import { useDeferredValue, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { pageOf, paramOneOf } from './list-address';

export { SORT_ORDERS } from './list-address';

/** Address parameters that order or page a list; every other one narrows it. */
const NOT_FILTERS = new Set(['page', 'sort', 'dir', 'order']);

/**
 * A list page's filters, sort and page kept in the address, so a view can be
 * linked and survives a reload. Changing anything but the page goes back to
 * page one; history is replaced, not stacked, while the user narrows a list.
 * `filtered` says whether any filter is set (what Clear filters would empty).
 */
export function useListParams() {
  const [params, setParams] = useSearchParams();
  const set = (patch: Record<string, string | undefined>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(patch)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    if (!('page' in patch)) next.delete('page');
    setParams(next, { replace: true });
  };
  const clear = () => setParams(new URLSearchParams(), { replace: true });
  const filtered = [...params.keys()].some((k) => !NOT_FILTERS.has(k));
  const page = pageOf(params);
  const oneOf = <T extends string>(key: string, choices: readonly T[], fallback: T): T => paramOneOf(params, key, choices, fallback);
  return { params, set, clear, filtered, page, oneOf };
}

export type ListParams = ReturnType<typeof useListParams>;

/** What a list's search box shows and sends (`SearchField`). */
export interface SearchText {
  /** As typed, a space before the next word kept. */
  text: string;
  onChange(text: string): void;
}

/**
 * The search box of a list: the text as typed, and its trimmed form in the
 * address under `key`, which the list's query reads (`query`) deferred, so
 * typing is not held up while the list is fetched again. When the address
 * changes otherwise (Clear filters, a link to the bare list) the box shows it.
 */
export function useSearchText(list: ListParams, key = 'q'): SearchText & { query: string | undefined } {
  const inAddress = list.params.get(key) ?? '';
  const [text, setText] = useState(inAddress);
  const [seen, setSeen] = useState(inAddress);
  if (inAddress !== seen) {
    setSeen(inAddress);
    if (inAddress !== text.trim()) setText(inAddress);
  }
  const query = useDeferredValue(inAddress) || undefined;
  const onChange = (typed: string) => {
    setText(typed);
    list.set({ [key]: typed.trim() || undefined });
  };
  return { text, onChange, query };
}
