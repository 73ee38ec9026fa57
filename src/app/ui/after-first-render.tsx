import { useDeferredValue, type ReactNode } from 'react';

/**
 * Renders `children` in a render of their own just after the page's first one, `placeholder`
 * in that first one: a part below the fold then adds nothing to the time before the page can be
 * used, and is in the page (for find-in-page, the keyboard and screen readers) a frame later.
 * The second render is a background one, which React interrupts to let the browser paint.
 */
export function AfterFirstRender({ placeholder = null, children }: { placeholder?: ReactNode; children: ReactNode }) {
  const rendered = useDeferredValue(true, false);
  return rendered ? <>{children}</> : <>{placeholder}</>;
}
