import { roundUncertainty } from '../../shared/gum/rounding';
import { COLOR, STYLE, rule, type Cursor } from './layout';
import { drawLine, drawParagraph, type Doc, type TextStyle } from './pdf-text';
import type { ReportData } from './report-data';
import { formatAt, formatCount, formatPercent, formatSignificant, formatUncertainty, formatUnit } from './typeset';

const tick: TextStyle = { face: 'mono', size: 6.8, color: COLOR.muted };

/** Horizontal bars of the variance shares, largest first. */
export function sharesChart(c: Cursor, r: ReportData): void {
  const { doc } = c;
  const rows = [...r.result.gum.contributions].sort((a, b) => b.varianceShare - a.varianceShare || a.symbol.localeCompare(b.symbol));
  const barH = 9;
  const step = 14;
  const labelW = 70;
  const valueW = 44;
  const plotL = c.left + labelW;
  const plotW = c.width - labelW - valueW;
  const h = rows.length * step + 26;
  c.need(h);
  const top = c.y;
  // gridlines at 0, 25, 50, 75, 100 %
  for (const f of [0, 0.25, 0.5, 0.75, 1]) {
    const x = plotL + f * plotW;
    doc.save().lineWidth(f === 0 ? 0.7 : 0.4).strokeColor(f === 0 ? COLOR.muted : COLOR.hairline).moveTo(x, top).lineTo(x, top + rows.length * step).stroke().restore();
    drawLine(doc, `${f * 100} %`, x, top + rows.length * step + 9, tick, { align: 'center' });
  }
  rows.forEach((k, i) => {
    const y = top + i * step + (step - barH) / 2;
    drawLine(doc, k.symbol, plotL - 6, y + barH - 1.5, { face: 'mono', size: 8, color: COLOR.ink }, { align: 'right', markup: false });
    const w = Math.max(0, k.varianceShare) * plotW;
    if (w > 0) doc.save().rect(plotL, y, Math.max(w, 0.6), barH).fill(i === 0 ? COLOR.accent : COLOR.accentLight).restore();
    drawLine(doc, formatPercent(k.varianceShare), plotL + w + 4, y + barH - 1.5, { face: 'mono', size: 7.4, color: COLOR.ink });
  });
  drawLine(doc, 'share of the variance u_{c}², (c_{i} u(x_{i}))² / Σ (c_{j} u(x_{j}))²', plotL + plotW / 2, top + rows.length * step + 20, STYLE.small, { align: 'center' });
  c.y = top + h + 4;
}

/** Round steps 1, 2, 5 × 10^k for about `n` ticks. */
function niceTicks(lo: number, hi: number, n: number): { ticks: number[]; exponent: number } {
  const raw = (hi - lo) / n;
  const e = Math.floor(Math.log10(raw));
  const f = raw / 10 ** e;
  const m = f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10;
  const step = m * 10 ** e;
  const ticks: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step) ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return { ticks, exponent: m === 10 ? e + 1 : e };
}

function legendItem(doc: Doc, x: number, y: number, kind: 'bar' | 'curve' | 'dash' | 'solid', label: string): number {
  doc.save();
  if (kind === 'bar') doc.rect(x, y - 6, 10, 6).fill(COLOR.accentLight);
  else {
    doc.lineWidth(kind === 'curve' ? 1.3 : 0.9).strokeColor(kind === 'solid' ? COLOR.ink : COLOR.accent);
    if (kind === 'dash') doc.dash(2.5, { space: 2 });
    doc.moveTo(x, y - 3).lineTo(x + 14, y - 3).stroke();
  }
  doc.restore();
  return 18 + drawLine(doc, label, x + 18, y, STYLE.small) + 14;
}

/** The Monte Carlo histogram with the GUM normal curve and both coverage intervals. */
export function histogramChart(c: Cursor, r: ReportData): void {
  const mc = r.result.monteCarlo;
  if (!mc) return;
  const { doc } = c;
  const g = r.result.gum;
  const { start, width, counts } = mc.histogram;
  const total = counts.reduce((a, b) => a + b, 0);
  const unit = formatUnit(r.result.measurand.unit ?? r.document.measurand.unit);
  const symbol = r.result.measurand.symbol;

  const plotH = 168;
  const h = plotH + 70;
  // the chart keeps the table of figures under it on the same page
  c.need(h + 90);
  const top = c.y;
  // legend
  let lx = c.left + 34;
  lx += legendItem(doc, lx, top + 8, 'bar', `Monte Carlo, ${formatCount(mc.trials)} trials`);
  lx += legendItem(doc, lx, top + 8, 'curve', 'GUM: normal N(y, u_{c}²)');
  lx += legendItem(doc, lx, top + 8, 'dash', 'GUM interval y ± U');
  legendItem(doc, lx, top + 8, 'solid', 'Monte Carlo interval');

  const L = c.left + 40;
  const R = c.right - 6;
  const T = top + 20;
  const B = T + plotH;

  // the axis spans the central 99.9 % of the trials (and both intervals): far tails would squeeze the shape
  let first = 0;
  let last = counts.length - 1;
  for (let cum = 0; first < counts.length - 1 && cum + counts[first] <= total * 0.0005; first++) cum += counts[first];
  for (let cum = 0; last > first && cum + counts[last] <= total * 0.0005; last--) cum += counts[last];
  const trimmed = first > 0 || last < counts.length - 1;
  let lo = Math.min(start + first * width, g.interval[0], mc.interval[0]);
  let hi = Math.max(start + (last + 1) * width, g.interval[1], mc.interval[1]);
  const span = hi - lo || Math.abs(lo) * 1e-6 || 1;
  lo -= span * 0.04;
  hi += span * 0.04;
  const u = g.standardUncertainty;
  const density = (x: number) => (u > 0 ? (total * width * Math.exp(-0.5 * ((x - g.estimate) / u) ** 2)) / (u * Math.sqrt(2 * Math.PI)) : 0);
  const yMax = Math.max(1, ...counts, density(g.estimate)) * 1.08;
  const X = (x: number) => L + ((x - lo) / (hi - lo)) * (R - L);
  const Y = (n: number) => B - (n / yMax) * (B - T);

  // y grid and ticks
  const yt = niceTicks(0, yMax, 4);
  for (const t of yt.ticks) {
    if (t > yMax) continue;
    doc.save().lineWidth(0.4).strokeColor(COLOR.hairline).moveTo(L, Y(t)).lineTo(R, Y(t)).stroke().restore();
    drawLine(doc, formatCount(t), L - 4, Y(t) + 2.4, tick, { align: 'right' });
  }
  // bars
  doc.save();
  counts.forEach((n, i) => {
    if (n <= 0) return;
    const x0 = Math.max(L, X(start + i * width));
    const x1 = Math.min(R, X(start + (i + 1) * width));
    if (x1 <= x0) return;
    doc.rect(x0, Y(n), Math.max(0.3, x1 - x0 - (x1 - x0 > 2 ? 0.35 : 0)), B - Y(n));
  });
  doc.fill(COLOR.accentLight);
  doc.restore();
  // GUM curve
  if (u > 0) {
    doc.save().lineWidth(1.3).strokeColor(COLOR.accent);
    const steps = 240;
    for (let i = 0; i <= steps; i++) {
      const x = lo + ((hi - lo) * i) / steps;
      const py = Math.max(T, Y(density(x)));
      if (i === 0) doc.moveTo(X(x), py);
      else doc.lineTo(X(x), py);
    }
    doc.stroke().restore();
  }
  // intervals
  const mark = (x: number, kind: 'dash' | 'solid') => {
    doc.save().lineWidth(0.9).strokeColor(kind === 'solid' ? COLOR.ink : COLOR.accent);
    if (kind === 'dash') doc.dash(2.5, { space: 2 });
    doc.moveTo(X(x), T + 2).lineTo(X(x), B).stroke().restore();
  };
  mark(g.interval[0], 'dash');
  mark(g.interval[1], 'dash');
  mark(mc.interval[0], 'solid');
  mark(mc.interval[1], 'solid');
  // axes
  doc.save().lineWidth(0.7).strokeColor(COLOR.muted).moveTo(L, T).lineTo(L, B).lineTo(R, B).stroke().restore();
  const xt = niceTicks(lo, hi, 6);
  for (const t of xt.ticks) {
    if (t < lo || t > hi) continue;
    doc.save().lineWidth(0.6).strokeColor(COLOR.muted).moveTo(X(t), B).lineTo(X(t), B + 3).stroke().restore();
    drawLine(doc, formatAt(t, xt.exponent), X(t), B + 11, tick, { align: 'center' });
  }
  drawLine(doc, unit ? `${symbol} in ${unit}` : symbol, (L + R) / 2, B + 24, { face: 'sans', size: 8, color: COLOR.ink }, { align: 'center' });
  if (trimmed) drawLine(doc, 'axis: central 99.9 % of the trials', R, B + 24, { ...STYLE.small, size: 6.8, color: COLOR.faint }, { align: 'right' });
  doc.save();
  doc.rotate(-90, { origin: [c.left + 6, (T + B) / 2] });
  drawLine(doc, `trials per bin (bin width ${formatSignificant(width, 2)}${unit ? ` ${unit}` : ''})`, c.left + 6, (T + B) / 2 + 2, { face: 'sans', size: 7.2, color: COLOR.muted }, { align: 'center' });
  doc.restore();
  c.y = B + 34;
}

/** The Monte Carlo figures beside the GUM ones, and the verdict in plain words. */
export function monteCarloFigures(c: Cursor, r: ReportData): void {
  const mc = r.result.monteCarlo;
  const g = r.result.gum;
  const { doc } = c;
  const unit = formatUnit(r.result.measurand.unit ?? r.document.measurand.unit);
  const wu = (s: string) => (unit ? `${s} ${unit}` : s);
  if (!mc) {
    c.paragraph('No Monte Carlo propagation was run for this version; the result rests on the law of propagation of uncertainty alone.');
    return;
  }
  // one digit beyond the two significant digits of u for the interval ends (JCGM 101:2008 7.8)
  const place = roundUncertainty(mc.standardUncertainty).exponent - 1;
  const gPlace = roundUncertainty(g.standardUncertainty).exponent - 1;
  const iv = ([a, b]: [number, number], p: number) => wu(`[${formatAt(a, p)}, ${formatAt(b, p)}]`);
  const rows: [string, string, string][] = [
    ['Estimate y', wu(formatAt(g.estimate, gPlace)), wu(formatAt(mc.estimate, place))],
    ['Standard uncertainty', wu(formatUncertainty(g.standardUncertainty)), wu(formatUncertainty(mc.standardUncertainty))],
    [`Coverage interval, p = ${formatPercent(g.coverageProbability)}`, iv(g.interval, gPlace), iv(mc.interval, place)],
    ['Shortest coverage interval', '—', iv(mc.shortestInterval, place)],
  ];
  const verdictText = verdict(r);
  const verdictH = verdictText ? drawParagraph(doc, verdictText.text, 0, 0, c.width, verdictText.style, { dryRun: true }) : 0;
  const c1 = 150;
  const c2 = (c.width - c1) / 2;
  // the figures and the verdict stay together
  c.need(14 * (rows.length + 1) + 10 + verdictH);
  drawLine(doc, 'GUM (law of propagation)', c.left + c1, c.y + 9, { face: 'bold', size: 7.6, color: COLOR.ink });
  drawLine(doc, `Monte Carlo (${formatCount(mc.trials)} trials${mc.adaptive ? ', adaptive' : ''})`, c.left + c1 + c2, c.y + 9, { face: 'bold', size: 7.6, color: COLOR.ink });
  c.y += 13;
  rule(doc, c.left, c.right, c.y, COLOR.rule, 0.5);
  for (const [label, a, b] of rows) {
    drawLine(doc, label, c.left, c.y + 9.8, { face: 'sans', size: 8, color: COLOR.muted });
    drawLine(doc, a, c.left + c1, c.y + 9.8, { face: 'mono', size: 7.8, color: COLOR.ink });
    drawLine(doc, b, c.left + c1 + c2, c.y + 9.8, { face: 'mono', size: 7.8, color: COLOR.ink });
    c.y += 14;
    rule(doc, c.left, c.right, c.y, COLOR.hairline, 0.5);
  }
  c.gap(8);
  if (!verdictText) c.paragraph('The GUM result was not compared with the Monte Carlo result for this version.');
  else c.paragraph(verdictText.text, verdictText.style);
}

/** The validation verdict in plain words (JCGM 101:2008 8). */
function verdict(r: ReportData): { text: string; style: TextStyle } | null {
  const v = r.result.validation;
  if (!v) return null;
  const unit = formatUnit(r.result.measurand.unit ?? r.document.measurand.unit);
  const d = (x: number) => (unit ? `${formatSignificant(x, 2)} ${unit}` : formatSignificant(x, 2));
  if (v.tolerance === null || v.verdict === 'inconclusive') {
    return { text: `Verdict: the GUM result is not confirmed: ${v.reason} (JCGM 101:2008 8).`, style: { face: 'sans', size: 9, color: COLOR.warning } };
  }
  const tolerance = v.tolerance;
  const text = v.passed
    ? `Verdict: the GUM result is confirmed. Both ends of the GUM coverage interval lie within the tolerance δ = ${d(tolerance)} of the Monte Carlo interval ` +
      `(d_{low} = ${d(v.dLow)}, d_{high} = ${d(v.dHigh)}; ${v.significantDigits} significant digits, JCGM 101:2008 8.2), so the law of propagation of uncertainty is adequate for this model.`
    : `Verdict: the GUM result is not confirmed. At least one end of the GUM coverage interval differs from the Monte Carlo interval by more than the tolerance δ = ${d(tolerance)} ` +
      `(d_{low} = ${d(v.dLow)}, d_{high} = ${d(v.dHigh)}; JCGM 101:2008 8.2). State the Monte Carlo interval, or review the model and the input distributions before this budget is used.`;
  return { text, style: { face: 'sans', size: 9, color: v.passed ? COLOR.ink : COLOR.warning } };
}
