import { useSearchParams } from 'react-router-dom';

/**
 * A list page's filters, sort and page kept in the address, so a view can be
 * linked and survives a reload. Changing anything but the page goes back to
 * page one; history is replaced, not stacked, while the user narrows a list.
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
  return { params, set, clear };
}
