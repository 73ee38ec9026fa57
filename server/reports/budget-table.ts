import type { Contribution } from '../../shared/budget/result';
import type { Distribution, InputQuantity } from '../../shared/budget/schema';
import { budgetKindLabel } from '../../shared/format/distribution-labels';
import { resultStatement } from '../../shared/gum/statement';
import { COLOR, STYLE, rule, type Cursor } from './layout';
import { drawLine, drawParagraph, type TextStyle } from './pdf-text';
import type { ReportData } from './report-data';
import {
  formatDof,
  formatPercent,
  formatSignificant,
  formatUncertainty,
  formatUnit,
  formatWithUncertainty,
  groupDigits,
  groupNumbersIn,
  ratioUnit,
} from './typeset';

/** The statement for a certificate (GUM 7.2.6 rounding), with the unit typeset and digits grouped. */
export function reportStatement(r: ReportData): string {
  const m = r.result.measurand;
  const text = resultStatement({ symbol: m.symbol, unit: formatUnit(m.unit ?? r.document.measurand.unit) || undefined }, r.result);
  return groupNumbersIn(text).replace(/ν_eff/g, 'ν_{eff}');
}

/** Result first: the statement as a certificate gives it, and the figures it rests on. */
export function resultSection(c: Cursor, r: ReportData): void {
  const { doc } = c;
  const g = r.result.gum;
  const unit = formatUnit(r.result.measurand.unit ?? r.document.measurand.unit);
  const withUnit = (s: string) => (unit ? `${s} ${unit}` : s);
  const statement = reportStatement(r);
  const pad = 10;
  const stStyle: TextStyle = { face: 'sans', size: 10, color: COLOR.ink };
  const stH = drawParagraph(doc, statement, c.left + pad, 0, c.width - 2 * pad, stStyle, { dryRun: true });
  const boxH = pad + stH + 8 + 30 + pad;
  c.need(boxH);
  const top = c.y;
  doc.save().rect(c.left, top, c.width, boxH).fill(COLOR.panel).restore();
  doc.save().rect(c.left, top, 2.2, boxH).fill(COLOR.accent).restore();
  drawParagraph(doc, statement, c.left + pad, top + pad, c.width - 2 * pad, stStyle);
  const figures: [string, string][] = [
    [`${r.result.measurand.symbol}`, withUnit(formatWithUncertainty(g.estimate, g.expandedUncertainty))],
    ['u_{c}', withUnit(formatUncertainty(g.standardUncertainty))],
    ['ν_{eff}', formatDof(g.effectiveDof)],
    ['k', g.coverageFactor.toFixed(2)],
    ['U = k·u_{c}', withUnit(formatUncertainty(g.expandedUncertainty))],
    ['p', formatPercent(g.coverageProbability)],
  ];
  const y = top + pad + stH + 8;
  rule(doc, c.left + pad, c.right - pad, y - 2, COLOR.rule, 0.4);
  const widths = [1.5, 1.1, 0.7, 0.55, 1.2, 0.6];
  const total = widths.reduce((a, b) => a + b, 0);
  let x = c.left + pad;
  figures.forEach(([label, value], i) => {
    drawLine(doc, label, x, y + 9, STYLE.label);
    drawLine(doc, value, x, y + 22, { face: 'mono', size: 9, color: COLOR.ink });
    x += ((c.width - 2 * pad) * widths[i]) / total;
  });
  c.y = top + boxH + 6;
  if (g.standardUncertaintySecondOrder !== null) {
    c.paragraph(
      `With the second-order terms of the Taylor series (GUM 5.1.2, note) the combined standard uncertainty is ${withUnit(formatUncertainty(g.standardUncertaintySecondOrder))}.`,
      { ...STYLE.small, color: COLOR.ink },
    );
  }
}

/** The measurement model as written, in the monospace face, with constants and correlations. */
export function modelSection(c: Cursor, r: ReportData): void {
  const { doc } = c;
  const lines = r.document.model.split('\n');
  const style: TextStyle = { face: 'mono', size: 8.5, color: COLOR.ink };
  const lineH = 12.5;
  const pad = 8;
  const wrapped: string[] = [];
  const maxChars = Math.floor((c.width - 2 * pad) / (style.size * 0.6));
  for (const l of lines) {
    for (let i = 0; i < Math.max(1, l.length); i += maxChars) wrapped.push(l.slice(i, i + maxChars));
  }
  const h = wrapped.length * lineH + 2 * pad - 3;
  c.need(h);
  doc.save().rect(c.left, c.y, c.width, h).fill(COLOR.panel).restore();
  wrapped.forEach((l, i) => drawLine(doc, l, c.left + pad, c.y + pad + 8 + i * lineH, style, { markup: false }));
  c.y += h + 6;
  const consts = r.document.constants ?? [];
  if (consts.length) {
    c.paragraph('Constants of the model (exact, no uncertainty):', STYLE.small);
    for (const k of consts) {
      const unit = formatUnit(k.unit);
      c.paragraph(`${k.symbol} = ${given(k.value)}${unit ? ` ${unit}` : ''}${k.description ? ` — ${k.description}` : ''}`, STYLE.body, { indent: 10 });
    }
    c.gap(4);
  }
  const corr = r.document.correlations ?? [];
  if (corr.length) {
    c.paragraph(`Correlated inputs: ${corr.map((k) => `r(${k.between[0]}, ${k.between[1]}) = ${groupDigits(String(k.r))}`).join('; ')}.`, STYLE.body);
    c.gap(4);
  }
}

/** A number as it was entered, digits grouped. */
function given(x: number): string {
  const a = Math.abs(x);
  if (x === 0 || (a >= 1e-3 && a < 1e6)) return groupDigits(String(x));
  return formatSignificant(x, Math.min(15, x.toExponential().split('e')[0].replace(/[-.]/g, '').length));
}

/** The number of observations of a Type A input, undefined for other kinds. */
function observationCount(q: InputQuantity | undefined): number | undefined {
  return q?.distribution.kind === 'observations' ? q.distribution.values.length : undefined;
}

/** How the standard uncertainty of an input was stated, as entered. */
function statedAs(d: Distribution, unitText: string): string {
  const u = (x: number) => `${given(x)}${unitText ? ` ${unitText}` : ''}`;
  const dof = d.dof !== undefined ? `, ν = ${given(d.dof)}` : d.relativeUncertaintyOfU !== undefined ? `, Δu/u = ${given(d.relativeUncertaintyOfU)}` : '';
  switch (d.kind) {
    case 'normal':
      return d.u !== undefined ? `normal, u = ${u(d.u)}${dof}` : `normal, U = ${u(d.U!)} with k = ${given(d.k!)}${dof}`;
    case 'rectangular':
      return d.halfWidth !== undefined ? `rectangular, ± ${u(d.halfWidth)}${dof}` : `rectangular between ${u(d.lower!)} and ${u(d.upper!)}${dof}`;
    case 'triangular':
    case 'arcsine':
      return `${d.kind}, ± ${u(d.halfWidth)}${dof}`;
    case 'trapezoidal':
      return `trapezoidal, ± ${u(d.halfWidth)}, β = ${given(d.beta)}${dof}`;
    case 'curvilinear-trapezoidal':
      return `curvilinear trapezoidal, ± ${u(d.halfWidth)}, limits known to ± ${u(d.halfWidthUncertainty)}${dof}`;
    case 'student-t':
      return `scaled t, scale ${u(d.scale)}, ν = ${given(d.dof)}`;
    case 'observations':
      return `${d.values.length} observations${d.pooledSd !== undefined ? `, pooled s = ${u(d.pooledSd)} (ν = ${given(d.pooledDof!)})` : ''}`;
    case 'constant':
      return 'exact value';
  }
}

/** Each input: symbol, what it is, and how its uncertainty was stated. */
export function inputsSection(c: Cursor, r: ReportData): void {
  const { doc } = c;
  const symW = 64;
  const srcW = 178;
  const descW = c.width - symW - srcW - 12;
  c.need(14);
  drawLine(doc, 'Quantity', c.left, c.y + 8, STYLE.label);
  drawLine(doc, 'Description', c.left + symW, c.y + 8, STYLE.label);
  drawLine(doc, 'Stated as', c.left + symW + descW + 12, c.y + 8, STYLE.label);
  c.y += 12;
  rule(doc, c.left, c.right, c.y, COLOR.rule, 0.5);
  for (const q of r.document.inputs) {
    const unit = formatUnit(q.unit);
    const desc = q.description?.trim() || '—';
    const src = statedAs(q.distribution, unit);
    const h = Math.max(
      drawParagraph(doc, desc, 0, 0, descW, STYLE.body, { markup: false, dryRun: true }),
      drawParagraph(doc, src, 0, 0, srcW, { ...STYLE.body, size: 8.2 }, { dryRun: true }),
    ) + 3;
    c.need(h);
    drawLine(doc, q.symbol, c.left, c.y + 10.5, { face: 'mono', size: 8.5, color: COLOR.ink }, { markup: false });
    drawParagraph(doc, desc, c.left + symW, c.y + 2, descW, STYLE.body, { markup: false });
    drawParagraph(doc, src, c.left + symW + descW + 12, c.y + 2.5, srcW, { ...STYLE.body, size: 8.2, color: COLOR.muted });
    c.y += h;
    rule(doc, c.left, c.right, c.y, COLOR.hairline, 0.5);
  }
  c.gap(8);
}

interface Column {
  key: string;
  head: string;
  sub?: string;
  width: number;
  kind: 'text' | 'number' | 'unit';
}

/** The uncertainty budget: one row per input, figures right-aligned in the monospace face. */
export function budgetTable(c: Cursor, r: ReportData): void {
  const { doc } = c;
  const g = r.result.gum;
  const yUnit = formatUnit(r.result.measurand.unit ?? r.document.measurand.unit);
  const inputs = new Map(r.document.inputs.map((q) => [q.symbol, q]));
  const cols: Column[] = [
    { key: 'symbol', head: 'Quantity', sub: 'X_{i}', width: 52, kind: 'text' },
    { key: 'estimate', head: 'Estimate', sub: 'x_{i}', width: 78, kind: 'number' },
    { key: 'unit', head: 'Unit', width: 30, kind: 'unit' },
    { key: 'dist', head: 'Distribution', width: 62, kind: 'text' },
    { key: 'u', head: 'Std. unc.', sub: 'u(x_{i})', width: 48, kind: 'number' },
    { key: 'c', head: 'Sensitivity', sub: 'c_{i}', width: 48, kind: 'number' },
    { key: 'cunit', head: '', width: 36, kind: 'unit' },
    { key: 'contrib', head: 'Contribution', sub: `|c_{i}|·u(x_{i})${yUnit ? ` in ${yUnit}` : ''}`, width: 58, kind: 'number' },
    { key: 'share', head: 'Share', width: 34, kind: 'number' },
    { key: 'dof', head: 'ν_{i}', width: 0, kind: 'number' },
  ];
  const used = cols.reduce((s, k) => s + k.width, 0);
  cols[cols.length - 1].width = c.width - used;

  const rows: Record<string, string>[] = g.contributions.map((k: Contribution) => ({
    symbol: k.symbol,
    estimate: formatWithUncertainty(k.estimate, k.standardUncertainty),
    unit: formatUnit(k.unit),
    dist: budgetKindLabel(k.kind, observationCount(inputs.get(k.symbol))),
    u: k.standardUncertainty > 0 ? formatUncertainty(k.standardUncertainty) : '0',
    c: formatSignificant(k.sensitivity, 3),
    cunit: ratioUnit(r.result.measurand.unit ?? r.document.measurand.unit, k.unit),
    contrib: k.contribution > 0 ? formatUncertainty(k.contribution) : '0',
    share: formatPercent(k.varianceShare),
    dof: formatDof(k.dof),
  }));

  const cell: TextStyle = { face: 'mono', size: 7.6, color: COLOR.ink };
  const text: TextStyle = { face: 'sans', size: 7.8, color: COLOR.ink };
  const unitStyle: TextStyle = { face: 'sans', size: 7.8, color: COLOR.ink };
  const cunitStyle: TextStyle = { face: 'sans', size: 7, color: COLOR.muted };
  const pad = 4;
  let x = c.left;
  const lefts = new Map<string, number>();
  for (const col of cols) {
    lefts.set(col.key, x);
    x += col.width;
  }

  const headH = 26;
  const rowH = 14;
  c.need(headH + rowH * Math.min(rows.length, 4) + 40);
  const drawHead = () => {
    rule(doc, c.left, c.right, c.y, COLOR.ink, 0.8);
    for (const col of cols) {
      const l = lefts.get(col.key)!;
      const right = col.kind === 'number';
      const hx = right ? l + col.width - pad : l + (col.key === 'symbol' ? 0 : pad);
      const align = right ? 'right' : 'left';
      drawLine(doc, col.head, hx, c.y + 10, { face: 'bold', size: 7.4, color: COLOR.ink }, { align });
      if (col.sub) {
        const sub = col.sub;
        const style: TextStyle = { face: 'sans', size: 7.2, color: COLOR.muted };
        // the contribution's long sub-heading may run left over the sensitivity's unit column
        drawLine(doc, sub, hx, c.y + 20.5, style, { align });
      }
    }
    c.y += headH;
    rule(doc, c.left, c.right, c.y, COLOR.ink, 0.5);
  };
  drawHead();
  rows.forEach((row) => {
    if (c.y + rowH > c.doc.page.height - 68) {
      c.newPage();
      drawHead();
    }
    const base = c.y + 9.6;
    for (const col of cols) {
      const l = lefts.get(col.key)!;
      const value = row[col.key];
      if (col.key === 'symbol') drawLine(doc, value, l, base, { ...cell, size: 8 }, { markup: false });
      else if (col.kind === 'number') drawLine(doc, value, l + col.width - pad, base, cell, { align: 'right' }); else if (col.key === 'cunit') drawLine(doc, value, l + 1, base, cunitStyle);
      else drawLine(doc, value, l + pad, base, col.key === 'unit' ? unitStyle : text);
    }
    c.y += rowH;
    rule(doc, c.left, c.right, c.y, COLOR.hairline, 0.5);
  });
  rule(doc, c.left, c.right, c.y, COLOR.ink, 0.5);

  // totals: combined, effective degrees of freedom, expanded
  const totals: { label: string; contrib: string; share?: string; dof?: string }[] = [
    { label: `Combined standard uncertainty u_{c}(${r.result.measurand.symbol})`, contrib: formatUncertainty(g.standardUncertainty), share: '100 %', dof: formatDof(g.effectiveDof) },
    {
      label: `Expanded uncertainty U = k·u_{c}, k = ${g.coverageFactor.toFixed(2)}, p = ${formatPercent(g.coverageProbability)}`,
      contrib: formatUncertainty(g.expandedUncertainty),
    },
  ];
  for (const t of totals) {
    c.need(rowH);
    const base = c.y + 9.8;
    drawLine(doc, t.label, lefts.get('dist')!, base, { face: 'bold', size: 7.8, color: COLOR.ink });
    const cr = lefts.get('contrib')! + cols.find((k) => k.key === 'contrib')!.width - pad;
    drawLine(doc, t.contrib, cr, base, { ...cell, face: 'mono-bold' }, { align: 'right' });
    if (t.share) drawLine(doc, t.share, lefts.get('share')! + cols.find((k) => k.key === 'share')!.width - pad, base, cell, { align: 'right' });
    if (t.dof) drawLine(doc, t.dof, c.right - pad, base, cell, { align: 'right' });
    c.y += rowH;
  }
  rule(doc, c.left, c.right, c.y, COLOR.rule, 0.5);
  c.gap(4);
  const methods = new Set(g.contributions.map((k) => k.sensitivityMethod));
  c.paragraph(
    `Sensitivity coefficients c_{i}: partial derivatives of the model at the estimates (${methods.has('numeric') ? (methods.has('symbolic') ? 'symbolic where possible, otherwise numeric' : 'numeric differentiation') : 'symbolic differentiation'}); ` +
      `u_{c}² = Σ c_{i}² u²(x_{i})${(r.document.correlations ?? []).length ? ' + 2 ΣΣ c_{i} c_{j} u(x_{i}) u(x_{j}) r(x_{i}, x_{j})' : ''} (GUM 5.1.2${(r.document.correlations ?? []).length ? ', 5.2.2' : ''}); ν_{eff} by the Welch–Satterthwaite formula (GUM G.4.1). ` +
      `Share = (c_{i} u(x_{i}))² / Σ (c_{j} u(x_{j}))².`,
    STYLE.small,
  );
}
