import type { ReportedResult, ValidationResult, ValidationVerdict } from '../budget/result';
import { significantFigure } from './figures';
import { withUnit, type UnitText } from './units';

/** The JCGM 101:2008 clause 8 comparison in words: a headline, the figures behind it, and how it reads. */
export interface VerdictView {
  verdict: ValidationVerdict;
  /** `good` validated, `warning` not validated, `neutral` inconclusive or not possible. */
  tone: 'good' | 'warning' | 'neutral';
  headline: string;
  /** Plain text with Unicode subscripts left as written (d_low); `markup` lowers them for the PDF. */
  detail: { text: string; markup: string };
}

/** A reason as a sentence of its own: first letter raised, one final stop. */
function sentence(reason: string): string {
  const r = reason.trim().replace(/\.+$/, '');
  return `${r.charAt(0).toUpperCase()}${r.slice(1)}.`;
}

/** The verdict of a stored validation; results stored before verdicts existed carry only `passed`. */
export function verdictOf(v: ValidationResult): ValidationVerdict {
  return v.verdict ?? (v.passed ? 'validated' : 'not-validated');
}

/**
 * The comparison of the GUM interval y ± U with the Monte Carlo interval in words (JCGM 101:2008 8.2):
 * validated when d_low and d_high are both within δ, half a unit in the last significant digit of u(y).
 */
export function verdictView(v: ValidationResult, unit: UnitText, reported?: ReportedResult): VerdictView {
  const verdict = verdictOf(v);
  const d = (x: number) => withUnit(significantFigure(x, 2), unit);
  // δ does not exist where the comparison is not possible (no Monte Carlo u)
  const δ = v.tolerance === null ? { text: '—', markup: '—' } : d(v.tolerance);
  const lo = d(v.dLow);
  const hi = d(v.dHigh);
  const both = (f: (s: 'text' | 'markup') => string) => ({ text: f('text'), markup: f('markup') });
  const figures = (s: 'text' | 'markup') =>
    `d${s === 'markup' ? '_{low}' : '_low'} = ${lo[s]}, d${s === 'markup' ? '_{high}' : '_high'} = ${hi[s]}, δ = ${δ[s]}; δ is half a unit in the last of ${v.significantDigits} significant digits of u(y)`;
  switch (verdict) {
    case 'validated':
      return {
        verdict,
        tone: 'good',
        headline: 'The GUM result is validated by the Monte Carlo method.',
        detail: both((s) => `Both ends of the GUM coverage interval lie within δ of the Monte Carlo interval (${figures(s)}; JCGM 101:2008 8.2).`),
      };
    case 'not-validated': {
      const tol = v.tolerance ?? 0;
      const ends = [v.dLow > tol ? 'lower' : null, v.dHigh > tol ? 'upper' : null].filter(Boolean).join(' and ') || 'one';
      const then = reported?.replacedGum
        ? 'The Monte Carlo coverage interval is reported in its place.'
        : 'Report the Monte Carlo coverage interval, or review the model and the input distributions before this budget is used.';
      return {
        verdict,
        tone: 'warning',
        headline: 'The GUM result is not validated by the Monte Carlo method.',
        detail: both((s) => `At the ${ends} end the GUM coverage interval differs from the Monte Carlo interval by more than δ (${figures(s)}; JCGM 101:2008 8.2). ${then}`),
      };
    }
    case 'inconclusive':
      return {
        verdict,
        tone: 'neutral',
        headline: 'The comparison with the Monte Carlo method is inconclusive.',
        detail: v.endpointUncertainty
          ? both((s) => {
              const [uLow, uHigh] = v.endpointUncertainty!;
              const e = (end: 'low' | 'high', u: number) => `2u(y${s === 'markup' ? `_{${end}}` : `_${end}`}) = ${d(2 * u)[s]}`;
              return (
                `The GUM interval's ends are as close to δ as the Monte Carlo interval's ends are uncertain at this number of trials (${figures(s)}; ` +
                `${e('low', uLow)}, ${e('high', uHigh)}), so another seed could give the other verdict. ` +
                'Run more trials: four times as many halve that uncertainty (JCGM 101:2008 8.2, 7.9).'
              );
            })
          : v.reason
            ? both(() => `${sentence(v.reason!)} (JCGM 101:2008 8.2, 7.9.)`)
            : both(
                (s) =>
                  `The numerical accuracy of the Monte Carlo interval is of the size of δ, so another seed could change the verdict (${figures(s)}; JCGM 101:2008 8.2). Run more trials to decide.`,
              ),
      };
    case 'not-possible':
      return {
        verdict,
        tone: 'neutral',
        headline: 'The GUM result cannot be compared with the Monte Carlo method.',
        detail: both(() => sentence(v.reason ?? 'the comparison of JCGM 101:2008 clause 8 is not defined for this budget')),
      };
  }
}
