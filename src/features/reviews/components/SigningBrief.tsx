import type { BudgetDiff, FieldChange } from '../../../../shared/api/diff';
import type { Comment, ReviewDecision, ReviewState } from '../../../../shared/api/reviews';
import type { ValidationVerdict } from '../../../../shared/budget/result';
import { formatDateTime, formatSignificant } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';

/** The clause 8 verdict in words, with whether it asks the signer for a reason. */
const VERDICT_WORDS: Record<ValidationVerdict, { label: string; ok: boolean }> = {
  validated: { label: 'GUM result validated by the Monte Carlo method', ok: true },
  'not-validated': { label: 'GUM result not validated by the Monte Carlo method', ok: false },
  inconclusive: { label: 'Validation by the Monte Carlo method inconclusive', ok: false },
  'not-possible': { label: 'Validation by the Monte Carlo method not possible', ok: false },
};

/** A stored document value as text: numbers exactly as stored, text quoted, absent as "—". */
function value(v: unknown): string {
  if (v === undefined || v === null) return '—';
  if (typeof v === 'string') return `“${v}”`;
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  return JSON.stringify(v);
}

function fieldLine(prefix: string, c: FieldChange): string {
  return `${prefix}${c.field}: ${value(c.from)} → ${value(c.to)}`;
}

/** Every change of a version comparison as one line each, the result's U last. */
function changeLines(d: BudgetDiff): string[] {
  const lines: string[] = [];
  lines.push(...d.other.map((c) => fieldLine('', c)));
  lines.push(...d.measurand.map((c) => fieldLine('measurand ', c)));
  if (d.model.changed) lines.push(`model: ${value(d.model.from)} → ${value(d.model.to)}`);
  const keyed = (name: string, k: BudgetDiff['inputs'], keyOf: (o: Record<string, unknown>) => string) => {
    for (const o of k.added) lines.push(`${name} ${keyOf(o)} added`);
    for (const o of k.removed) lines.push(`${name} ${keyOf(o)} removed`);
    for (const c of k.changed) for (const f of c.changes) lines.push(fieldLine(`${name} ${c.key}: `, f));
  };
  keyed('input', d.inputs, (o) => String(o.symbol));
  keyed('constant', d.constants, (o) => String(o.symbol));
  keyed('correlation', d.correlations, (o) => (Array.isArray(o.between) ? o.between.join('–') : '?'));
  const U = d.result.expandedUncertainty;
  if (U.from !== U.to) lines.push(`result U: ${U.from === null ? '—' : formatSignificant(U.from, 3)} → ${U.to === null ? '—' : formatSignificant(U.to, 3)}`);
  return lines;
}

export function OpenThreadList({ threads }: { threads: Comment[] }) {
  return (
    <ul data-testid="open-threads" className="flex flex-col gap-1 text-sm">
      {threads.map((c) => (
        <li key={c.id} className="rounded-md border border-caution-500 bg-caution-50 px-2 py-1 text-stone-900">
          <span className="text-xs font-semibold text-caution-700">{c.symbol ? <Sym s={c.symbol} /> : 'whole budget'}</span>{' '}
          <span className="text-xs text-stone-700">
            · {c.authorName}, {formatDateTime(c.createdAt)}
          </span>
          <p className="whitespace-pre-wrap break-words">{c.body.length > 240 ? `${c.body.slice(0, 240)}…` : c.body}</p>
        </li>
      ))}
    </ul>
  );
}

function Heading({ children }: { children: React.ReactNode }) {
  return <h3 className="text-sm font-semibold text-stone-900">{children}</h3>;
}

/** What a signature on the current version covers: verdict, warnings, open threads, changes, evidence. */
export function SigningBrief({ state }: { state: ReviewState }) {
  const v = state.validation;
  const verdict = v ? VERDICT_WORDS[v.verdict] : null;
  const lines = state.changes ? changeLines(state.changes) : [];
  return (
    <div className="flex flex-col gap-3" data-testid="signing-brief">
      <section aria-label="Result" className="flex flex-col gap-1">
        <Heading>Result of version {state.currentVersion} as stored</Heading>
        <p data-testid="signing-statement" className="rounded-md bg-stone-50 px-2 py-1 text-sm text-stone-900">
          {state.result.statement}
        </p>
      </section>
      <section aria-label="Validation" className="flex flex-col gap-1">
        <Heading>Monte Carlo verdict (JCGM 101:2008 clause 8)</Heading>
        <p
          data-testid="signing-verdict"
          className={`rounded-md border px-2 py-1 text-sm ${verdict?.ok ? 'border-accent-600 bg-accent-50 text-accent-700' : 'border-caution-500 bg-caution-50 text-caution-700'}`}
        >
          <span aria-hidden>{verdict?.ok ? '✓ ' : '▲ '}</span>
          {verdict ? verdict.label : 'The Monte Carlo method was not run for this version; its GUM result is not validated'}
          {v?.reason ? `: ${v.reason}` : '.'}
        </p>
      </section>
      <section aria-label="Warnings" className="flex flex-col gap-1">
        <Heading>Warnings of the result</Heading>
        {state.warnings.length ? (
          <ul className="ml-4 list-disc text-sm text-caution-700">
            {state.warnings.map((w, i) => (
              <li key={i} data-warning={w.code}>
                {w.message}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-stone-700">None.</p>
        )}
      </section>
      <section aria-label="Open comments" className="flex flex-col gap-1">
        <Heading>Open comment threads ({state.openThreads.length})</Heading>
        {state.openThreads.length ? <OpenThreadList threads={state.openThreads} /> : <p className="text-sm text-stone-700">Every thread is resolved.</p>}
      </section>
      <section aria-label="Changes" className="flex flex-col gap-1">
        <Heading>
          {state.baseline
            ? `What changed since version ${state.baseline.version} (${state.baseline.basis === 'seen' ? 'the last version you commented on or decided on' : 'the last approved version'})`
            : 'What changed'}
        </Heading>
        {!state.baseline ? (
          <p className="text-sm text-stone-700">No version of this budget was approved or reviewed by you before: review it whole.</p>
        ) : state.baseline.version === state.currentVersion ? (
          <p className="text-sm text-stone-700">Nothing: you already reviewed version {state.currentVersion}.</p>
        ) : lines.length ? (
          <ul data-testid="signing-changes" className="ml-4 list-disc break-words text-sm text-stone-800">
            {lines.map((l, i) => (
              <li key={i} className="num">
                {l}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-stone-700">The document is unchanged; only its record (e.g. evidence) differs.</p>
        )}
      </section>
      <section aria-label="Evidence" className="flex flex-col gap-1">
        <Heading>Evidence ({state.evidence.length})</Heading>
        {state.evidence.length ? (
          <ul className="flex flex-col gap-0.5 text-sm">
            {state.evidence.map((e) => (
              <li key={e.id} className="break-all">
                {e.fileName}{' '}
                <span className="text-xs text-stone-600">
                  ({e.symbol ? `for ${e.symbol}` : 'whole budget'}, v{e.versionNumber})
                </span>{' '}
                {state.baseline && e.versionNumber > state.baseline.version ? (
                  <span className="rounded-full border border-caution-500 bg-caution-50 px-1.5 text-[11px] font-medium text-caution-700">new since v{state.baseline.version}</span>
                ) : null}{' '}
                <span className="num text-[11px] text-stone-600">SHA-256 {e.sha256}</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-stone-700">No evidence is attached.</p>
        )}
      </section>
    </div>
  );
}

const SIGNED_OVER: Record<ValidationVerdict, string | null> = {
  validated: null,
  'not-validated': 'a result the Monte Carlo method did not validate',
  inconclusive: 'an inconclusive validation',
  'not-possible': 'a result that could not be validated',
};

/** One approval or return as the history shows it. */
export function DecisionLine({ d }: { d: ReviewDecision }) {
  const over = [
    d.openThreads ? `${d.openThreads} open thread${d.openThreads === 1 ? '' : 's'}` : null,
    d.validationVerdict ? SIGNED_OVER[d.validationVerdict] : 'a result without a Monte Carlo validation',
  ].filter(Boolean);
  return (
    <li data-testid={`decision-${d.id}`} className="rounded-md border border-stone-200 px-2 py-1 text-xs text-stone-700">
      <span className="font-semibold text-stone-900">{d.decision === 'approved' ? `✓ v${d.versionNumber} approved` : `↩ v${d.versionNumber} returned`}</span> by {d.actorName}, {formatDateTime(d.at)}
      {d.decision === 'approved' && over.length ? <span className="text-caution-700"> — signed over {over.join(' and ')}</span> : null}
      {d.reason ? <p className="mt-0.5 whitespace-pre-wrap break-words text-stone-900">“{d.reason}”</p> : null}
    </li>
  );
}
