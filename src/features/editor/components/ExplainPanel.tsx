import type { Explanation } from '../explain';

export function ExplainPanel({ explanation, onClose }: { explanation: Explanation | null; onClose(): void }) {
  if (!explanation) {
    return (
      <section aria-label="How it was obtained" className="rounded-lg border border-dashed border-stone-300 p-3 text-xs text-stone-600">
        Select a result or a row of the budget to see the formula, the values put into it and the clause it follows.
      </section>
    );
  }
  return (
    <section aria-label="How it was obtained" aria-live="polite" className="rounded-lg border border-accent-600 bg-white p-3">
      <div className="flex items-start justify-between gap-2">
        <h2 className="text-sm font-semibold text-stone-900">{explanation.title}</h2>
        <button type="button" onClick={onClose} className="rounded px-1 text-xs text-stone-600 hover:bg-stone-100" aria-label="Close the explanation">
          ✕
        </button>
      </div>
      <ol className="mt-2 flex flex-col gap-2">
        {explanation.steps.map((s, i) => (
          <li key={i} className="text-xs">
            <p className="num text-stone-900">{s.formula}</p>
            {s.substituted ? <p className="num mt-0.5 break-words text-stone-700">{s.substituted}</p> : null}
            <p className="mt-0.5 text-accent-700">{s.clause}</p>
            {s.note ? <p className="text-stone-600">{s.note}</p> : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
