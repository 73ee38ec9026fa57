import { useCallback, useEffect, useRef, useState } from 'react';
import type { BudgetResult } from '../../../../shared/budget/result';
import type { BudgetDocument } from '../../../../shared/budget/schema';
import type { RunRequest, WorkerMessage } from '../mc-protocol';

export type RunState =
  | { phase: 'idle' }
  | { phase: 'running'; done: number; total: number; startedAt: number; trials: number | 'adaptive' }
  | { phase: 'done'; result: BudgetResult; ms: number }
  | { phase: 'cancelled'; done: number }
  | { phase: 'error'; message: string };

/** Runs the Monte Carlo method in a Web Worker; the page stays responsive, and a run can be stopped. */
export function useMonteCarloRun() {
  const [state, setState] = useState<RunState>({ phase: 'idle' });
  const worker = useRef<Worker | null>(null);
  const flag = useRef<Int32Array | null>(null);

  const stopWorker = () => {
    worker.current?.terminate();
    worker.current = null;
  };
  useEffect(() => stopWorker, []);

  const run = useCallback((document: BudgetDocument, trials: number | 'adaptive', seed: string, trialsCap: number) => {
    stopWorker();
    const w = new Worker(new URL('../mc.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    const shared = typeof SharedArrayBuffer !== 'undefined' && globalThis.crossOriginIsolated ? new SharedArrayBuffer(4) : undefined;
    flag.current = shared ? new Int32Array(shared) : null;
    const startedAt = performance.now();
    setState({ phase: 'running', done: 0, total: trials === 'adaptive' ? trialsCap : Math.min(trials, trialsCap), startedAt, trials });
    w.onmessage = (e: MessageEvent<WorkerMessage>) => {
      const m = e.data;
      if (m.type === 'progress') setState((s) => (s.phase === 'running' ? { ...s, done: m.done, total: m.total } : s));
      else if (m.type === 'done') {
        setState({ phase: 'done', result: m.result, ms: m.ms });
        stopWorker();
      } else if (m.type === 'cancelled') {
        setState({ phase: 'cancelled', done: m.done });
        stopWorker();
      } else {
        setState({ phase: 'error', message: m.problem.message });
        stopWorker();
      }
    };
    w.onerror = (e) => {
      setState({ phase: 'error', message: e.message || 'the Monte Carlo worker stopped unexpectedly' });
      stopWorker();
    };
    const req: RunRequest = { type: 'run', document, trials, seed, trialsCap, stopFlag: shared };
    w.postMessage(req);
  }, []);

  const cancel = useCallback(() => {
    if (flag.current) {
      // the engine checks this flag between blocks and stops cleanly
      Atomics.store(flag.current, 0, 1);
      return;
    }
    // without shared memory the worker cannot be asked mid-run: stop it outright
    setState((s) => (s.phase === 'running' ? { phase: 'cancelled', done: s.done } : s));
    stopWorker();
  }, []);

  return { state, run, cancel };
}
