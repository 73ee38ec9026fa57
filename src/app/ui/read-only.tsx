import { createContext, useContext, type ReactNode } from 'react';

/*
 * What a user may read but not change is shown as text, not as a locked
 * control: a definition list of labelled values that takes no keyboard focus,
 * so tabbing goes from one action to the next.
 */

/** Whether a field is inside a `ReadOnlyList`: a field on its own is a definition list of one. */
const InList = createContext(false);

/** A definition list laid out like the form it replaces (pass the same grid classes). */
export function ReadOnlyList({ children, className = '', label }: { children: ReactNode; className?: string; label?: string }) {
  return (
    <dl aria-label={label} className={`grid gap-x-4 gap-y-2 ${className}`}>
      <InList.Provider value>{children}</InList.Provider>
    </dl>
  );
}

/** One labelled value; an empty value reads "not given". */
export function ReadOnlyField({ label, children, className = '', numeric, note }: { label: ReactNode; children?: ReactNode; className?: string; numeric?: boolean; note?: ReactNode }) {
  const empty = children === undefined || children === null || children === '';
  const Group = useContext(InList) ? 'div' : 'dl';
  return (
    <Group className={`flex min-w-0 flex-col gap-0.5 ${className}`}>
      <dt className="text-xs font-medium text-stone-600">{label}</dt>
      <dd className="break-words text-sm text-stone-900">
        <span className={numeric ? 'num' : ''}>{empty ? <span className="text-stone-500">not given</span> : children}</span>
        {note ? <span className="block text-xs text-stone-600">{note}</span> : null}
      </dd>
    </Group>
  );
}

/** A number as it was entered in the budget (not rounded: it is a given, not a result). */
export function givenNumber(v: number | undefined | null): string | undefined {
  return v === undefined || v === null || Number.isNaN(v) ? undefined : String(v);
}
