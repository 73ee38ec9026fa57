import { lazy, Suspense, useMemo } from 'react';
import { duration } from '../../../../shared/presentation/figures';
import { presentMonteCarlo } from '../../../../shared/presentation/result-model';
import type { MonteCarloSlotProps } from '../../../app/slots';
import { Button, Field, Select, Spinner, TextInput } from '../../../app/ui/controls';
import { formatCount } from '../../../app/ui/numbers';
import { WhenNearView } from '../../../app/ui/near-view';
import { ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
import { formatUnit } from '../../../app/ui/units';
import { MonteCarloComparison, ValidationVerdict } from '../../../budget/components/MonteCarloComparison';
import { DEFAULTS } from '../../../../shared/budget/limits';
import { useComputeLimits } from '../api/compute-limits';
import { useMonteCarloRun } from '../api/use-monte-carlo';

const HistogramPlot = lazy(() => import('../../../budget/components/HistogramPlot'));
const chartLoading = (
  <div className="flex h-[300px] items-center justify-center">
    <Spinner label="Loading the chart" />
  </div>
);
/** The chart's place while it is far below the viewport: its size, nothing to announce. */
const chartPlace = <div className="h-[300px]" />;

const TRIAL_CHOICES = [10_000, 100_000, 200_000, 1_000_000, 2_000_000, 5_000_000];

const seconds = (ms: number): string => duration(ms).text;
const trialsText = (t: number | 'adaptive'): string => (t === 'adaptive' ? 'adaptive (JCGM 101 7.9)' : formatCount(t));

export function MonteCarloPanel({ document, measurand, stored, settings, onSettings, readOnly }: MonteCarloSlotProps) {
  const { state, run, cancel } = useMonteCarloRun();
  // A run in the browser uses the server's cap, so the run a save stores is the run seen here (JCGM 101:2008 7.2).
  const limits = useComputeLimits();
  const cap = limits.data?.trialsCap ?? null;
  // Unset in the budget, trials and seed are the defaults a save uses too.
  const trials: number | 'adaptive' = settings?.trials ?? DEFAULTS.trials;
  const seed = String(settings?.seed ?? DEFAULTS.seed);
  const overCap = cap !== null && typeof trials === 'number' && trials > cap;
  const unit = formatUnit(measurand.unit);

  const shown = state.phase === 'done' ? { result: state.result, label: `run in this browser in ${seconds(state.ms)}` } : state.phase === 'idle' ? stored : null;
  const mc = shown?.result.monteCarlo ?? null;
  // eslint-disable-next-line react-hooks/exhaustive-deps -- the figures depend on the shown result alone, not on its label
  const figures = useMemo(() => (shown ? presentMonteCarlo(shown.result, measurand.unit) : null), [shown?.result, measurand.unit]);
  const running = state.phase === 'running';
  // eslint-disable-next-line react-hooks/purity -- the elapsed time is read again on each progress message, which re-renders the panel
  const elapsed = running ? performance.now() - state.startedAt : 0;
  const left = running && state.done > 0 ? (elapsed / state.done) * (state.total - state.done) : null;

  const setTrials = (t: number | 'adaptive') => onSettings({ ...(settings ?? {}), trials: t });
  const setSeed = (text: string) => onSettings({ ...(settings ?? {}), seed: text });
  const choices = typeof trials === 'number' && !TRIAL_CHOICES.includes(trials) ? [...TRIAL_CHOICES, trials].sort((a, b) => a - b) : TRIAL_CHOICES;

  return (
    <section aria-labelledby="mc-h" className="rounded-lg border border-stone-200 bg-stone-50/60 p-4">
      <div className="mb-3">
        <h2 id="mc-h" className="text-base font-semibold text-stone-900">
          Monte Carlo method
        </h2>
        <p className="text-xs text-stone-600">Propagation of distributions (JCGM 101:2008), run in the background of this page; the same seed and trials give the same numbers.</p>
      </div>
      <div className="grid items-end gap-3 md:grid-cols-[12rem_1fr_auto]">
        {readOnly ? (
          // a reader runs the budget's own trials and seed, which reproduce the stored run
          <ReadOnlyList className="md:col-span-2 md:grid-cols-[12rem_1fr]" label="Monte Carlo settings">
            <ReadOnlyField label="Trials M" numeric note={overCap ? `a run uses the server's cap of ${formatCount(cap)}` : undefined}>
              {trialsText(trials)}
            </ReadOnlyField>
            <ReadOnlyField label="Seed" numeric>
              {seed}
            </ReadOnlyField>
          </ReadOnlyList>
        ) : (
          <>
            <Field label="Trials M">
              {(p) => (
                <Select {...p} value={String(trials)} disabled={running} onChange={(e) => setTrials(e.target.value === 'adaptive' ? 'adaptive' : Number(e.target.value))}>
                  {choices.map((t) => (
                    <option key={t} value={t} disabled={cap !== null && t > cap}>
                      {formatCount(t)}
                      {cap !== null && t > cap ? ' (above the server cap)' : ''}
                    </option>
                  ))}
                  <option value="adaptive">{trialsText('adaptive')}</option>
                </Select>
              )}
            </Field>
            <Field label="Seed" hint="Any text; keep it to reproduce a run.">
              {(p) => <TextInput {...p} className="num" value={seed} disabled={running} onChange={(e) => setSeed(e.target.value)} />}
            </Field>
          </>
        )}
        <div className="flex gap-2">
          {running ? (
            <Button variant="danger" onClick={cancel}>
              Cancel
            </Button>
          ) : (
            <Button
              variant="primary"
              disabled={!document || cap === null}
              onClick={() => document && cap !== null && run(document, trials, seed, cap)}
              title={!document ? 'Fix the problems of the budget first' : cap === null ? 'Reading the server limits' : undefined}
            >
              Run Monte Carlo
            </Button>
          )}
        </div>
      </div>

      {cap !== null ? (
        readOnly ? null : (
          <p className="mt-2 text-xs text-stone-600">
            A saved version stores at most <span className="num">{formatCount(cap)}</span> trials, computed on the server with this seed: the browser runs with the same cap, so the stored result is
            the one seen here.
            {overCap ? (
              <span className="text-caution-700">
                {' '}
                These settings ask for <span className="num">{formatCount(trials as number)}</span>; the run and the save use <span className="num">{formatCount(cap)}</span>.
              </span>
            ) : null}
          </p>
        )
      ) : limits.isError ? (
        <p role="alert" className="mt-2 text-xs text-caution-700">
          The server's trials cap could not be read, so a run here might differ from the stored one; reload the page to try again.
        </p>
      ) : null}
      {running ? (
        <div className="mt-3" aria-live="polite">
          <div className="flex justify-between text-xs text-stone-700">
            <span className="num">
              {formatCount(state.done)} of {formatCount(state.total)} trials{state.trials === 'adaptive' ? ' (at most)' : ''}
            </span>
            <span>{left !== null ? `about ${seconds(left)} left` : 'starting…'}</span>
          </div>
          <div
            role="progressbar"
            aria-label="Monte Carlo progress"
            aria-valuemin={0}
            aria-valuemax={state.total}
            aria-valuenow={state.done}
            className="mt-1 h-2 overflow-hidden rounded-full bg-stone-200"
          >
            <div className="h-2 rounded-full bg-accent-600 transition-[width]" style={{ width: `${(state.done / Math.max(1, state.total)) * 100}%` }} />
          </div>
        </div>
      ) : null}
      {state.phase === 'cancelled' ? <p className="mt-3 text-sm text-stone-700">Stopped after {formatCount(state.done)} trials; nothing was kept. Run again to get a result.</p> : null}
      {state.phase === 'error' ? (
        <p role="alert" className="mt-3 rounded-md border border-caution-500 bg-caution-50 px-3 py-2 text-sm text-caution-700">
          {state.message}
        </p>
      ) : null}

      {shown && mc ? (
        <div className="mt-4 flex flex-col gap-3">
          <p className="text-xs text-stone-600">
            <span className="num">{figures?.monteCarlo?.heading}</span>, seed <span className="num rounded bg-white px-1 text-stone-800">{mc.seed}</span> — {shown.label}
          </p>
          <div className="grid gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <div className="rounded-md border border-stone-200 bg-white p-2">
              <WhenNearView placeholder={chartPlace}>
                <Suspense fallback={chartLoading}>
                  <HistogramPlot
                    histogram={mc.histogram}
                    trials={mc.trials}
                    gum={{ estimate: shown.result.gum.estimate, standardUncertainty: shown.result.gum.standardUncertainty, interval: shown.result.gum.interval }}
                    mcInterval={mc.interval}
                    axisTitle={`${measurand.symbol}${unit ? ` / ${unit}` : ''}`}
                  />
                </Suspense>
              </WhenNearView>
            </div>
            <div className="flex flex-col gap-3">
              {figures?.monteCarlo ? <MonteCarloComparison view={figures.monteCarlo} unit={figures.unit.text} /> : null}
              <ValidationVerdict view={figures?.validation ?? null} />
            </div>
          </div>
        </div>
      ) : !running && state.phase !== 'error' ? (
        <p className="mt-3 text-sm text-stone-600">No Monte Carlo result yet for these inputs. Run it to compare the distribution of the measurand with the GUM result.</p>
      ) : null}
    </section>
  );
}
