import { atDecimalPlace, count, share, significantFigure } from '../../shared/presentation/figures';
import type { ResultModel } from '../../shared/presentation/result-model';
import { COLOR, STYLE, type Cursor, rule } from './layout';
import { drawLine, drawParagraph, textWidth, type Doc, type TextStyle } from './pdf-text';
import { symbolMarkup, symbolParts } from '../../shared/format/symbols';
import type { ReportData } from './report-data';

const tick: TextStyle = { face: 'mono', size: 6.8, color: COLOR.muted };

/**
 * The contributions ranked, largest first: a column per input for its share of the
 * variance, a line for the running total, and the dominant term named in words.
 */
export function contributionsChart(c: Cursor, m: ResultModel): void {
  const { doc } = c;
  const terms = m.budget.ranked;
  const plotH = 110;
  const h = plotH + 72;
  c.need(h);
  const top = c.y;
  c.y += drawParagraph(doc, m.budget.dominant.markup, c.left, top, c.width, { face: 'bold', size: 9, color: COLOR.ink });
  const L = c.left + 30;
  const R = c.right - 30;
  const T = c.y + 6;
  const B = T + plotH;
  const slot = (R - L) / Math.max(1, terms.length);
  const barW = Math.min(34, slot * 0.62);
  const Y = (f: number) => B - f * (B - T);
  for (const f of [0, 0.25, 0.5, 0.75, 1]) {
    doc
      .save()
      .lineWidth(f === 0 ? 0.7 : 0.4)
      .strokeColor(f === 0 ? COLOR.muted : COLOR.hairline)
      .moveTo(L, Y(f))
      .lineTo(R, Y(f))
      .stroke()
      .restore();
    drawLine(doc, share(f).markup, L - 4, Y(f) + 2.4, tick, { align: 'right' });
  }
  drawLine(doc, 'cumulative', R + 4, Y(1) + 2.4, { ...tick, color: COLOR.accent });
  const points: [number, number][] = [];
  terms.forEach((t, i) => {
    const cx = L + slot * (i + 0.5);
    const v = t.share.value ?? 0;
    if (v > 0)
      doc
        .save()
        .rect(cx - barW / 2, Y(v), barW, Math.max(0.6, B - Y(v)))
        .fill(i === 0 ? COLOR.accent : COLOR.accentLight)
        .restore();
    const { base, sub } = symbolParts(t.symbol);
    let tail = sub ?? '';
    const label = () => (sub === null ? base : `${base}_{${tail}}`);
    while (tail.length > 2 && textWidth(doc, label(), { face: 'mono', size: 7.4 }) > slot - 2) tail = `${tail.slice(0, -2)}…`;
    drawLine(doc, label(), cx, B + 10, { face: 'mono', size: 7.4, color: COLOR.ink }, { align: 'center' });
    drawLine(doc, t.share.markup, cx, B + 19, { face: 'mono', size: 7, color: COLOR.muted }, { align: 'center' });
    points.push([cx, Y(t.cumulative.value ?? 0)]);
  });
  if (points.length > 1) {
    doc.save().lineWidth(1).strokeColor(COLOR.accent);
    points.forEach(([px, py], i) => (i === 0 ? doc.moveTo(px, py) : doc.lineTo(px, py)));
    doc.stroke().restore();
    for (const [px, py] of points) doc.save().circle(px, py, 1.8).fill(COLOR.accent).restore();
  }
  drawLine(doc, 'share of the variance u_{c}² per input, largest first; the line is the running total', (L + R) / 2, B + 31, STYLE.small, { align: 'center' });
  c.y = B + 39;
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
    doc
      .moveTo(x, y - 3)
      .lineTo(x + 14, y - 3)
      .stroke();
  }
  doc.restore();
  return 18 + drawLine(doc, label, x + 18, y, STYLE.small) + 14;
}

/** The Monte Carlo histogram with the GUM normal curve and both coverage intervals. */
export function histogramChart(c: Cursor, r: ReportData, m: ResultModel): void {
  const mc = r.result.monteCarlo;
  if (!mc) return;
  const { doc } = c;
  const g = r.result.gum;
  const { start, width, counts } = mc.histogram;
  const total = counts.reduce((a, b) => a + b, 0);
  const unit = m.measurand.unit.markup;
  const symbol = symbolMarkup(m.measurand.symbol);

  const plotH = 168;
  const h = plotH + 70;
  // the chart keeps the table of figures under it on the same page
  c.need(h + 90);
  const top = c.y;
  // legend
  let lx = c.left + 34;
  lx += legendItem(doc, lx, top + 8, 'bar', `Monte Carlo, ${count(mc.trials).markup} trials`);
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
    drawLine(doc, count(t).markup, L - 4, Y(t) + 2.4, tick, { align: 'right' });
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
    doc
      .save()
      .lineWidth(0.9)
      .strokeColor(kind === 'solid' ? COLOR.ink : COLOR.accent);
    if (kind === 'dash') doc.dash(2.5, { space: 2 });
    doc
      .moveTo(X(x), T + 2)
      .lineTo(X(x), B)
      .stroke()
      .restore();
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
    doc
      .save()
      .lineWidth(0.6)
      .strokeColor(COLOR.muted)
      .moveTo(X(t), B)
      .lineTo(X(t), B + 3)
      .stroke()
      .restore();
    drawLine(doc, atDecimalPlace(t, xt.exponent).markup, X(t), B + 11, tick, { align: 'center' });
  }
  drawLine(doc, unit ? `${symbol} in ${unit}` : symbol, (L + R) / 2, B + 24, { face: 'sans', size: 8, color: COLOR.ink }, { align: 'center' });
  if (trimmed) drawLine(doc, 'axis: central 99.9 % of the trials', R, B + 24, { ...STYLE.small, size: 6.8, color: COLOR.faint }, { align: 'right' });
  doc.save();
  doc.rotate(-90, { origin: [c.left + 6, (T + B) / 2] });
  drawLine(
    doc,
    `trials per bin (bin width ${significantFigure(width, 2).markup}${unit ? ` ${unit}` : ''})`,
    c.left + 6,
    (T + B) / 2 + 2,
    { face: 'sans', size: 7.2, color: COLOR.muted },
    { align: 'center' },
  );
  doc.restore();
  c.y = B + 34;
}

/** The Monte Carlo figures beside the GUM ones, and the verdict in words, as the result model gives them. */
export function monteCarloFigures(c: Cursor, m: ResultModel): void {
  const mc = m.monteCarlo;
  const { doc } = c;
  if (!mc) {
    c.paragraph('No Monte Carlo propagation was run for this version; the result rests on the law of propagation of uncertainty alone.');
    return;
  }
  const v = m.validation;
  const verdict = v ? `${v.headline} ${v.detail.markup}` : 'The GUM result was not compared with the Monte Carlo result for this version.';
  const vStyle: TextStyle = { face: 'sans', size: 9, color: v?.tone === 'warning' ? COLOR.warning : COLOR.ink };
  const verdictH = drawParagraph(doc, verdict, 0, 0, c.width, vStyle, { dryRun: true });
  const stabilityH = mc.stability ? drawParagraph(doc, mc.stability, 0, 0, c.width, STYLE.small, { dryRun: true }) + 4 : 0;
  const c1 = 150;
  const c2 = (c.width - c1) / 2;
  // the figures and the verdict stay together
  c.need(14 * (mc.rows.length + 1) + 12 + verdictH + stabilityH);
  const unit = m.measurand.unit.markup;
  drawLine(doc, unit ? `values in ${unit}` : 'dimensionless values', c.left, c.y + 9, STYLE.small);
  drawLine(doc, 'GUM (law of propagation)', c.left + c1, c.y + 9, { face: 'bold', size: 7.6, color: COLOR.ink });
  drawLine(doc, `Monte Carlo (${mc.heading})`, c.left + c1 + c2, c.y + 9, { face: 'bold', size: 7.6, color: COLOR.ink });
  c.y += 13;
  rule(doc, c.left, c.right, c.y, COLOR.rule, 0.5);
  for (const row of mc.rows) {
    drawLine(doc, row.label, c.left, c.y + 9.8, { face: 'sans', size: 8, color: COLOR.muted });
    drawLine(doc, row.gum ? row.gum.markup : '—', c.left + c1, c.y + 9.8, { face: 'mono', size: 7.8, color: COLOR.ink });
    drawLine(doc, row.monteCarlo.markup, c.left + c1 + c2, c.y + 9.8, { face: 'mono', size: 7.8, color: COLOR.ink });
    c.y += 14;
    rule(doc, c.left, c.right, c.y, COLOR.hairline, 0.5);
  }
  c.gap(6);
  if (mc.stability) {
    c.paragraph(mc.stability, STYLE.small);
    c.gap(4);
  }
  c.paragraph(verdict, vStyle);
}
