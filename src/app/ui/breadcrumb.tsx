import { Fragment, type ReactNode } from 'react';
import { Link } from 'react-router-dom';

/** Where the page sits: linked steps up, the page itself last and plain. */
export function Breadcrumb({ trail }: { trail: { label: ReactNode; to?: string }[] }) {
  return (
    <nav aria-label="Breadcrumb" className="text-xs text-stone-600">
      {trail.map((step, i) => (
        <Fragment key={i}>
          {i > 0 ? ' / ' : null}
          {step.to ? (
            <Link to={step.to} className="hover:text-accent-700 hover:underline">
              {step.label}
            </Link>
          ) : (
            step.label
          )}
        </Fragment>
      ))}
    </nav>
  );
}
