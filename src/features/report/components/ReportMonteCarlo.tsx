import type { HistogramBins } from '../../../../shared/budget/result';
import { atDecimalPlace } from '../../../../shared/presentation/figures';
import type { ResultModel } from '../../../../shared/presentation/result-model';
import { MonteCarloComparison, ValidationVerdict } from '../../../budget/components/MonteCarloComparison';

/** A print-friendly histogram: bars of the Monte Carlo values, both coverage intervals marked. */
function Histogram({ h, gum, mc, unit, place }: { h: HistogramBins; gum: [number, number]; mc: [number, number]; unit: string; place: number }) {
  const W = 640;
  const H = 200;
  const pad = { l: 8, r: 8, t: 8, b: 36 };
  const max = Math.max(...h.counts, 1);
  const lo = Math.min(h.start, gum[0], mc[0]);
  const hi = Math.max(h.start + h.width * h.counts.length, gum[1], mc[1]);
  const x = (v: number) => pad.l + ((v - lo) / (hi - lo || 1)) * (W - pad.l - pad.r);
  const y = (c: number) => H - pad.b - (c / max) * (H - pad.t - pad.b);
  const ticks = [lo, (lo + hi) / 2, hi];
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="w-full"
      role="img"
      aria-label="Histogram of the Monte Carlo values with the GUM interval (dashed) and the Monte Carlo interval (solid); the figures are in the table above"
    >
      {h.counts.map((c, i) => {
        const x0 = x(h.start + i * h.width);
        const x1 = x(h.start + (i + 1) * h.width);
        return <rect key={i} x={x0} y={y(c)} width={Math.max(0.5, x1 - x0 - 0.3)} height={H - pad.b - y(c)} fill="#b9cada" />;
      })}
      <line x1={pad.l} x2={W - pad.r} y1={H - pad.b} y2={H - pad.b} stroke="#57534e" />
      {[gum[0], gum[1]].map((v, i) => (
        <line key={`g${i}`} x1={x(v)} x2={x(v)} y1={pad.t} y2={H - pad.b} stroke="#1f5a85" strokeWidth="2" strokeDasharray="6 4" />
      ))}
      {[mc[0], mc[1]].map((v, i) => (
        <line key={`m${i}`} x1={x(v)} x2={x(v)} y1={pad.t} y2={H - pad.b} stroke="#1c1917" strokeWidth="1.5" />
      ))}
      {ticks.map((t, i) => (
        <text key={i} x={x(t)} y={H - pad.b + 14} fontSize="11" textAnchor={i === 0 ? 'start' : i === 2 ? 'end' : 'middle'} fontFamily="JetBrains Mono, monospace" fill="#292524">
          {atDecimalPlace(t, place).text}
        </text>
      ))}
      <text x={W / 2} y={H - 4} fontSize="11" textAnchor="middle" fill="#44403c">
        {unit ? `value / ${unit}` : 'value'} · dashed: GUM interval y ± U · solid: Monte Carlo interval
      </text>
    </svg>
  );
}

/** 4 Monte Carlo: the GUM and Monte Carlo figures side by side, the validation verdict and the histogram. */
export function ReportMonteCarlo({ model: m, histogram }: { model: ResultModel; histogram?: { bins: HistogramBins; gum: [number, number]; mc: [number, number] } }) {
  const mc = m.monteCarlo;
  const unit = m.measurand.unit;
  if (!mc) return null;
  return (
    <section aria-labelledby="rep-mc" className="break-inside-avoid">
      <h2 id="rep-mc" className="mb-1 text-base font-semibold">
        4 Monte Carlo propagation of distributions (JCGM 101:2008)
      </h2>
      <MonteCarloComparison view={mc} unit={unit.text} heading={`Monte Carlo (${mc.heading})`} dense />
      {m.validation ? (
        <div className="mt-2">
          <ValidationVerdict view={m.validation} />
        </div>
      ) : null}
      {histogram ? <Histogram h={histogram.bins} gum={histogram.gum} mc={histogram.mc} unit={unit.text} place={mc.place} /> : null}
    </section>
  );
}
