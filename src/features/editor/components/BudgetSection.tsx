import type { ReactNode } from 'react';
import type { ResultModel } from '../../../../shared/presentation/result-model';
import { AfterFirstRender } from '../../../app/ui/after-first-render';
import { ErrorNote } from '../../../app/ui/controls';
import type { Problem } from '../live';
import { BudgetTable, ContributionsChart } from '../../../budget/components/BudgetTable';
import { Section } from './Section';

/** The problems with no field of their own, then the uncertainty budget table and the chart of contributions. */
export function BudgetSection({
  model,
  generalProblems,
  selected,
  onSelect,
  adornment,
}: {
  model: ResultModel | null;
  generalProblems: readonly Problem[];
  selected?: string;
  onSelect(symbol: string): void;
  adornment?: (symbol: string) => ReactNode;
}) {
  return (
    <>
      {generalProblems.length ? (
        <ErrorNote title="The budget cannot be computed yet">
          <ul className="ml-4 list-disc">
            {generalProblems.map((p, i) => (
              <li key={i}>{p.message}</li>
            ))}
          </ul>
        </ErrorNote>
      ) : null}
      <Section id="budget" title="Uncertainty budget" description="Recomputed on every edit. Select a row to see how its numbers were obtained.">
        {model ? (
          <div className="grid gap-3 2xl:grid-cols-[minmax(0,1fr)_300px]">
            <BudgetTable model={model} selected={selected} onSelect={onSelect} adornment={adornment} />
            {/* below the table, out of the first screen: drawn just after the page's first render */}
            <AfterFirstRender>
              <ContributionsChart model={model} selected={selected} onSelect={onSelect} />
            </AfterFirstRender>
          </div>
        ) : (
          <p className="text-sm text-stone-600">The table appears as soon as the budget has no problems. Each problem is shown beside its field.</p>
        )}
      </Section>
    </>
  );
}

/** The result in one line, kept at the top of a narrow screen while scrolling (the side column is below there). */
export function ResultStrip({ model }: { model: ResultModel }) {
  return (
    <div className="sticky top-[52px] z-20 -mx-4 flex flex-wrap items-baseline gap-x-5 gap-y-0.5 border-b border-stone-300 bg-white/95 px-4 py-1.5 text-sm shadow-sm lg:hidden" aria-hidden>
      <span className="num font-semibold">
        {model.measurand.symbol} = {model.reported.estimate.text} {model.measurand.unit.text}
      </span>
      <span className="num">
        U = {model.reported.expandedUncertainty.text} {model.measurand.unit.text}
      </span>
      {model.reported.coverageFactor ? <span className="num text-stone-700">k = {model.reported.coverageFactor.text}</span> : null}
    </div>
  );
}
