import { useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { problemWords, type BudgetProblem } from '../../../shared/budget/problems';
import type { BudgetResult } from '../../../shared/budget/result';
import type { BudgetDocument } from '../../../shared/budget/schema';
import { nextUMove, uReadingOf, type UReading } from './u-move';

/** A problem of the draft: placed by `field` (and `location` in the model), never by its words. */
export type Problem = BudgetProblem;

export interface LiveOutcome {
  /** Field problems by path (`inputs[2].distribution.u`, `model`, `correlations`…). */
  problems: Problem[];
  result: BudgetResult | null;
  /** The document as validated (null when it has problems). */
  valid: BudgetDocument | null;
}

/** The problem's words without the place it names, which the UI shows by placing it. */
export function plainMessage(p: Problem): string {
  return problemWords(p);
}

/** One recompute asked of the live worker, and its answer. */
export interface LiveRequest {
  id: number;
  document: BudgetDocument;
}
export interface LiveReply {
  id: number;
  outcome: LiveOutcome;
}

/** A live recompute longer than this is stopped: the page never waits on a budget the server computes on save anyway. */
const LIVE_TIME_LIMIT_MS = 20_000;

export interface UMove {
  from: number;
  to: number;
}

interface Job {
  id: number;
  doc: BudgetDocument;
  timer: ReturnType<typeof setTimeout>;
}

/**
 * Recomputes the GUM result on every edit in a Web Worker (deferred, so
 * typing stays fluid) and tracks how U moved with the last edit. A draft
 * identical to the stored version shows the stored result and asks the worker
 * nothing (the worker starts with the first edit); a recompute past
 * LIVE_TIME_LIMIT_MS is stopped and reported as a problem of the draft.
 */
export function useLiveResult(doc: BudgetDocument, stored?: { document: BudgetDocument; result: BudgetResult } | null) {
  const deferred = useDeferredValue(doc);
  const [computed, setComputed] = useState<{ doc: BudgetDocument; outcome: LiveOutcome } | null>(null);
  const [stopped, setStopped] = useState<{ doc: BudgetDocument; seconds: number } | null>(null);
  const worker = useRef<Worker | null>(null);
  const job = useRef<Job | null>(null);
  const waiting = useRef<BudgetDocument | null>(null);
  const nextId = useRef(1);

  // eslint-disable-next-line react-hooks/refs -- the function kept here reads its refs only when called from effects and worker messages, never during render
  const send = useRef((d: BudgetDocument) => {
    if (job.current) {
      // One recompute at a time: the latest draft waits for the one running.
      waiting.current = d;
      return;
    }
    const w = worker.current ?? new Worker(new URL('./live.worker.ts', import.meta.url), { type: 'module' });
    if (!worker.current) {
      worker.current = w;
      w.onmessage = (e: MessageEvent<LiveReply>) => {
        const j = job.current;
        if (!j || e.data.id !== j.id) return;
        clearTimeout(j.timer);
        job.current = null;
        setComputed({ doc: j.doc, outcome: e.data.outcome });
        setStopped(null);
        next();
      };
      w.onerror = (e) => {
        const j = job.current;
        if (!j) return;
        clearTimeout(j.timer);
        job.current = null;
        setComputed({ doc: j.doc, outcome: { problems: [{ code: 'internal', field: '', message: `the live recompute failed: ${e.message}` }], result: null, valid: null } });
        next();
      };
    }
    const id = nextId.current++;
    const timer = setTimeout(() => {
      // The worker is busy in the engine and cannot be asked to stop: end it; the next edit starts a fresh one.
      worker.current?.terminate();
      worker.current = null;
      job.current = null;
      setStopped({ doc: d, seconds: Math.round(LIVE_TIME_LIMIT_MS / 1000) });
      next();
    }, LIVE_TIME_LIMIT_MS);
    job.current = { id, doc: d, timer };
    w.postMessage({ id, document: d } satisfies LiveRequest);
  }).current;
  const next = () => {
    const d = waiting.current;
    waiting.current = null;
    if (d) send(d);
  };

  // eslint-disable-next-line react-hooks/exhaustive-deps -- only the stored document decides the text, not the rest of the stored version
  const storedText = useMemo(() => (stored ? JSON.stringify(stored.document) : null), [stored?.document]);
  const isStored = useMemo(() => storedText !== null && JSON.stringify(deferred) === storedText, [deferred, storedText]);

  // The stored version's own result stands for its document: the worker starts with the first edit, not while the page loads.
  useEffect(() => {
    if (!isStored) send(deferred);
  }, [deferred, isStored, send]);
  useEffect(
    () => () => {
      if (job.current) clearTimeout(job.current.timer);
      job.current = null;
      waiting.current = null;
      worker.current?.terminate();
      worker.current = null;
    },
    [],
  );

  const current = computed?.doc === deferred ? computed.outcome : null;
  const wasStopped = stopped?.doc === deferred ? stopped.seconds : null;
  const stopNote: Problem[] =
    wasStopped === null ? [] : [{ code: 'too_large_to_compute', field: '', message: `live recompute stopped after ${wasStopped} s: this budget takes too long to compute in the page` }];
  const outcome: LiveOutcome =
    current ??
    (isStored && stored
      ? { problems: stopNote, result: stored.result, valid: deferred }
      : wasStopped !== null
        ? { problems: stopNote, result: null, valid: null }
        : (computed?.outcome ?? { problems: [], result: null, valid: null }));

  const last = useRef<UReading | null>(null);
  const [move, setMove] = useState<UMove | null>(null);
  useEffect(() => {
    if (!outcome.result) return;
    const reading = uReadingOf(outcome.result);
    const before = last.current;
    setMove((shown) => nextUMove(before, reading, shown));
    last.current = reading;
  }, [outcome.result]);
  return {
    ...outcome,
    move,
    stopped: current === null && wasStopped !== null,
    stale: deferred !== doc || (current === null && wasStopped === null && !isStored),
    /** The outcome still describes an earlier draft: React has not yet rendered the deferred one. */
    behind: deferred !== doc,
  };
}

/** Problems under a field path prefix, e.g. all of `inputs[2]`. */
export function problemsUnder(problems: readonly Problem[], prefix: string): Problem[] {
  return problems.filter((p) => p.field === prefix || p.field.startsWith(prefix + '.') || p.field.startsWith(prefix + '['));
}

export function problemAt(problems: readonly Problem[], field: string): string | null {
  const p = problems.find((x) => x.field === field);
  return p ? plainMessage(p) : null;
}
