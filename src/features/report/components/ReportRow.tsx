import type { ReactNode } from 'react';

/** A term and its value in the report's definition lists. */
export function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-stone-600">{label}</dt>
      <dd className="text-stone-900">{children}</dd>
    </>
  );
}
