import type { ReactNode } from 'react';

/** One section of the editor: a heading, an optional line under it and actions beside it. */
export function Section({ id, title, children, actions, description }: { id: string; title: string; children: ReactNode; actions?: ReactNode; description?: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-h`} className="rounded-lg border border-stone-200 bg-stone-50/60 p-4">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <div>
          <h2 id={`${id}-h`} className="text-base font-semibold text-stone-900">
            {title}
          </h2>
          {description ? <p className="text-xs text-stone-600">{description}</p> : null}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}
