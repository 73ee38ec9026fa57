import createPlotlyComponent from 'react-plotly.js/factory';
import Plotly from 'plotly.js-basic-dist-min';
import type { HistogramBins } from '../../../shared/budget/result';

const Plot = createPlotlyComponent(Plotly);

export interface HistogramPlotProps {
  histogram: HistogramBins;
  trials: number;
  gum: { estimate: number; standardUncertainty: number; interval: [number, number] };
  mcInterval: [number, number];
  axisTitle: string;
}

/** Monte Carlo values as bars of probability density, the GUM Gaussian over them, and both coverage intervals. */
export default function HistogramPlot({ histogram, trials, gum, mcInterval, axisTitle }: HistogramPlotProps) {
  const { start, width, counts } = histogram;
  const total = counts.reduce((s, c) => s + c, 0) || trials;
  const x = counts.map((_, i) => start + (i + 0.5) * width);
  const density = counts.map((c) => c / (total * width));
  const lo = Math.min(start, gum.interval[0] - gum.standardUncertainty);
  const hi = Math.max(start + width * counts.length, gum.interval[1] + gum.standardUncertainty);
  const curveX = Array.from({ length: 241 }, (_, i) => lo + ((hi - lo) * i) / 240);
  const s = gum.standardUncertainty;
  const curveY = curveX.map((v) => (s > 0 ? Math.exp(-0.5 * ((v - gum.estimate) / s) ** 2) / (s * Math.sqrt(2 * Math.PI)) : 0));
  const top = Math.max(...density, ...curveY) * 1.08;
  const vline = (at: number, color: string, dash: 'solid' | 'dash') => ({
    type: 'line' as const,
    x0: at,
    x1: at,
    y0: 0,
    y1: top,
    line: { color, width: 2, dash },
  });
  return (
    <Plot
      data={[
        { type: 'bar', x, y: density, width: width * 0.98, name: 'Monte Carlo (histogram)', marker: { color: '#a8a29e' }, hovertemplate: '%{x:.4g}: %{y:.4g}<extra></extra>' },
        { type: 'scatter', mode: 'lines', x: curveX, y: curveY, name: 'GUM (Gaussian, y and u_c)', line: { color: '#176464', width: 2 }, hoverinfo: 'skip' },
        { type: 'scatter', mode: 'lines', x: [null], y: [null], name: 'GUM interval y ± U', line: { color: '#176464', width: 2, dash: 'dash' } },
        { type: 'scatter', mode: 'lines', x: [null], y: [null], name: 'Monte Carlo interval', line: { color: '#7c5214', width: 2 } },
      ]}
      layout={{
        autosize: true,
        height: 300,
        margin: { l: 56, r: 12, t: 8, b: 48 },
        bargap: 0,
        showlegend: true,
        legend: { orientation: 'h', y: -0.25, font: { size: 11 } },
        font: { family: 'Inter Variable, system-ui, sans-serif', size: 12, color: '#292524' },
        xaxis: { title: { text: axisTitle }, zeroline: false, gridcolor: '#f5f5f4', tickfont: { family: 'JetBrains Mono, monospace', size: 11 } },
        yaxis: { title: { text: 'probability density' }, zeroline: false, gridcolor: '#f5f5f4', range: [0, top], tickfont: { family: 'JetBrains Mono, monospace', size: 11 } },
        shapes: [vline(gum.interval[0], '#176464', 'dash'), vline(gum.interval[1], '#176464', 'dash'), vline(mcInterval[0], '#7c5214', 'solid'), vline(mcInterval[1], '#7c5214', 'solid')],
        plot_bgcolor: '#ffffff',
        paper_bgcolor: '#ffffff',
      }}
      config={{ displayModeBar: false, responsive: true }}
      useResizeHandler
      style={{ width: '100%' }}
    />
  );
}
