import type { Figure } from '../../shared/presentation/figures';
import type { ResultModel } from '../../shared/presentation/result-model';
import { symbolMarkup } from '../../shared/format/symbols';
import { withUnit } from '../../shared/presentation/units';
import { COLOR, STYLE, rule, type Cursor } from './layout';
import { drawLine, drawParagraph, textWidth, type TextStyle } from './pdf-text';
import type { ReportData } from './report-data';

/*
 * The result, the model and the budget on paper. Every figure comes from the
 * shared result model; this file only places them.
 */

/** Result first: the statement as a certificate gives it, and the reported figures it rests on. */
export function resultSection(c: Cursor, m: ResultModel): void {
  const { doc } = c;
  const f = m.reported;
  const u = m.measurand.unit;
  const pad = 10;
  const stStyle: TextStyle = { face: 'sans', size: 10, color: COLOR.ink };
  const stH = drawParagraph(doc, m.statement.markup, c.left + pad, 0, c.width - 2 * pad, stStyle, { dryRun: true });
  const notes = [`U from ${f.basisWords}.`, ...f.notes].join(' ');
  const notesH = drawParagraph(doc, notes, 0, 0, c.width - 2 * pad, STYLE.small, { dryRun: true });
  const boxH = pad + stH + 8 + 30 + notesH + pad;
  c.need(boxH);
  const top = c.y;
  doc.save().rect(c.left, top, c.width, boxH).fill(COLOR.panel).restore();
  doc.save().rect(c.left, top, 2.2, boxH).fill(COLOR.accent).restore();
  drawParagraph(doc, m.statement.markup, c.left + pad, top + pad, c.width - 2 * pad, stStyle);
  const figures: [string, Figure][] = [
    [symbolMarkup(m.measurand.symbol), withUnit(f.estimate, u)],
    ['u_{c}', withUnit(f.standardUncertainty, u)],
    ['ν_{eff}', f.effectiveDof],
    ...(f.coverageFactor ? ([['k', f.coverageFactor]] as [string, Figure][]) : []),
    [f.coverageFactor ? 'U = k·u_{c}' : 'U', withUnit(f.expandedUncertainty, u)],
    ['p', f.coverageProbability],
  ];
  const y = top + pad + stH + 8;
  rule(doc, c.left + pad, c.right - pad, y - 2, COLOR.rule, 0.4);
  const colW = (c.width - 2 * pad) / figures.length;
  figures.forEach(([label, value], i) => {
    const x = c.left + pad + i * colW;
    drawLine(doc, label, x, y + 9, STYLE.label);
    drawLine(doc, value.markup, x, y + 22, { face: 'mono', size: 9, color: COLOR.ink });
  });
  drawParagraph(doc, notes, c.left + pad, y + 30, c.width - 2 * pad, { ...STYLE.small, color: f.notes.length ? COLOR.warning : COLOR.muted });
  c.y = top + boxH + 6;
  if (f.secondOrder) {
    c.paragraph(`With the second-order terms of the Taylor series (GUM 5.1.2, note) the combined standard uncertainty is ${withUnit(f.secondOrder, u).markup}.`, { ...STYLE.small, color: COLOR.ink });
  }
}

/** The measurement model as written, in the monospace face, with its intermediate quantities and constants. */
export function modelSection(c: Cursor, r: ReportData, m: ResultModel): void {
  const intermediates = m.model.intermediates;
  const { doc } = c;
  const style: TextStyle = { face: 'mono', size: 8.5, color: COLOR.ink };
  const lineH = 12.5;
  const pad = 8;
  const wrapped: string[] = [];
  const maxChars = Math.floor((c.width * 0.62 - 2 * pad) / (style.size * 0.6));
  for (const l of r.document.model.split('\n')) {
    for (let i = 0; i < Math.max(1, l.length); i += maxChars) wrapped.push(l.slice(i, i + maxChars));
  }
  const sideLines = intermediates.length;
  const h = Math.max(wrapped.length, sideLines) * lineH + 2 * pad - 3;
  c.need(h);
  doc.save().rect(c.left, c.y, c.width, h).fill(COLOR.panel).restore();
  wrapped.forEach((l, i) => drawLine(doc, l, c.left + pad, c.y + pad + 8 + i * lineH, style, { markup: false }));
  // the value of each intermediate quantity at the estimates, beside the text
  const sideX = c.left + c.width * 0.64;
  intermediates.forEach((q, i) => drawLine(doc, `${symbolMarkup(q.symbol)} = ${q.value.markup}`, sideX, c.y + pad + 8 + i * lineH, { ...style, color: COLOR.muted }));
  c.y += h + 6;
  const consts = r.document.constants ?? [];
  if (consts.length) {
    c.paragraph('Constants of the model (exact, no uncertainty):', STYLE.small);
    for (const k of m.constants) c.paragraph(k.markup, STYLE.body, { indent: 10 });
    c.gap(4);
  }
}

interface Column {
  key: string;
  head: string;
  sub?: string;
  width: number;
  align: 'left' | 'right';
}

/**
 * The budget as a chain read left to right: what was stated, divided to a standard
 * uncertainty, multiplied by the sensitivity to a contribution, and its share.
 * Each input takes two lines: its symbol and description, then the chain; a warning
 * that names the input sits under it.
 */
export function budgetTable(c: Cursor, m: ResultModel): void {
  const { doc } = c;
  const b = m.budget;
  const yUnit = m.measurand.unit.markup;
  const cols: Column[] = [
    { key: 'stated', head: 'As stated', width: 148, align: 'left' },
    { key: 'divisor', head: '÷ divisor', width: 54, align: 'right' },
    { key: 'u', head: '= u(x_{i})', width: 74, align: 'right' },
    { key: 'c', head: '× c_{i}', width: 84, align: 'right' },
    { key: 'contrib', head: '= |c_{i}| u(x_{i})', sub: yUnit ? `in ${yUnit}` : undefined, width: 66, align: 'right' },
    { key: 'share', head: 'share', width: 34, align: 'right' },
    { key: 'dof', head: 'ν_{i}', width: 0, align: 'right' },
  ];
  cols[cols.length - 1].width = c.width - cols.reduce((s, k) => s + k.width, 0);
  const lefts = new Map<string, number>();
  let x = c.left;
  for (const col of cols) {
    lefts.set(col.key, x);
    x += col.width;
  }
  const pad = 4;
  const at = (key: string, align: 'left' | 'right') => {
    const col = cols.find((k) => k.key === key)!;
    return align === 'right' ? lefts.get(key)! + col.width - pad : lefts.get(key)! + (key === 'stated' ? 0 : pad);
  };
  const cell: TextStyle = { face: 'mono', size: 7.8, color: COLOR.ink };
  const headH = 24;
  const drawHead = () => {
    rule(doc, c.left, c.right, c.y, COLOR.ink, 0.8);
    for (const col of cols) {
      drawLine(doc, col.head, at(col.key, col.align), c.y + 10, { face: 'bold', size: 7.4, color: COLOR.ink }, { align: col.align });
      if (col.sub) drawLine(doc, col.sub, at(col.key, col.align), c.y + 19.5, { face: 'sans', size: 7, color: COLOR.muted }, { align: col.align });
    }
    c.y += headH;
    rule(doc, c.left, c.right, c.y, COLOR.ink, 0.5);
  };
  c.need(headH + 3 * 30 + 40);
  drawHead();
  const totalsH = 13 * 4 + 4;
  b.rows.forEach((row, index) => {
    const warnH = row.warnings.reduce((s, w) => s + drawParagraph(doc, `⚠ ${w.message}`, 0, 0, c.width - 14, STYLE.small, { markup: false, dryRun: true }), 0);
    const h = 28 + warnH;
    // the last input keeps the totals with it
    if (c.y + h + (index === b.rows.length - 1 ? totalsH : 0) > c.doc.page.height - 68) {
      c.newPage();
      drawHead();
    }
    const top = c.y;
    const sw = drawLine(doc, symbolMarkup(row.symbol), c.left, top + 10, { face: 'mono-bold', size: 8.4, color: COLOR.ink });
    const desc = [row.description, row.kind].filter(Boolean).join(' · ');
    let d = desc;
    const room = c.width - sw - 10;
    while (d.length > 4 && drawLine(doc, d, 0, -100, STYLE.small, { markup: false }) > room) d = `${d.slice(0, -2).trimEnd()}…`;
    drawLine(doc, d, c.left + sw + 8, top + 10, STYLE.small, { markup: false });
    const base = top + 22;
    // the value as stated keeps to its column: a smaller size first, then the sans face, which is narrower
    const statedRoom = cols[0].width + cols[1].width - 30;
    let stated: TextStyle = { ...cell, color: COLOR.muted };
    for (const candidate of [stated, { ...stated, size: 7 }, { ...stated, face: 'sans' as const, size: 7.4 }]) {
      stated = candidate;
      if (textWidth(doc, row.stated.markup, candidate) <= statedRoom) break;
    }
    drawLine(doc, row.stated.markup, at('stated', 'left'), base, stated);
    drawLine(doc, row.divisor.markup, at('divisor', 'right'), base, cell, { align: 'right' });
    drawLine(doc, withUnit(row.standardUncertainty, row.unit).markup, at('u', 'right'), base, cell, { align: 'right' });
    const cu = row.sensitivity.unit.markup;
    drawLine(doc, `${row.sensitivity.figure.markup}${cu ? ` ${cu}` : ''}`, at('c', 'right'), base, cell, { align: 'right' });
    drawLine(doc, row.contribution.markup, at('contrib', 'right'), base, { ...cell, face: 'mono-bold' }, { align: 'right' });
    drawLine(doc, row.share.markup, at('share', 'right'), base, cell, { align: 'right' });
    drawLine(doc, row.dof.markup, at('dof', 'right'), base, cell, { align: 'right' });
    c.y = top + 28;
    for (const w of row.warnings) {
      const wh = drawParagraph(doc, `⚠ ${w.message}`, 0, 0, c.width - 14, STYLE.small, { markup: false, dryRun: true });
      drawParagraph(doc, `⚠ ${w.message}`, c.left + 10, c.y - 2, c.width - 14, { ...STYLE.small, color: COLOR.warning }, { markup: false });
      c.y += wh;
    }
    rule(doc, c.left, c.right, c.y, COLOR.hairline, 0.5);
  });
  rule(doc, c.left, c.right, c.y, COLOR.ink, 0.5);
  const t = b.totals;
  const u = m.measurand.unit;
  const totals: [string, Figure][] = [
    [`combined standard uncertainty u_{c}(${symbolMarkup(m.measurand.symbol)}) = √Σ`, withUnit(t.standardUncertainty, u)],
    ['effective degrees of freedom ν_{eff} (GUM G.4.1)', t.effectiveDof],
    [`coverage factor k for p = ${t.coverageProbability.markup}`, t.coverageFactor],
    ['expanded uncertainty U = k·u_{c}', withUnit(t.expandedUncertainty, u)],
  ];
  const rowH = 13;
  c.need(totalsH);
  for (const [label, value] of totals) {
    const base = c.y + 9.6;
    drawLine(doc, label, at('contrib', 'right') - 84, base, { face: 'sans', size: 7.8, color: COLOR.ink }, { align: 'right' });
    drawLine(doc, value.markup, at('contrib', 'right'), base, { ...cell, face: 'mono-bold' }, { align: 'right' });
    c.y += rowH;
  }
  rule(doc, c.left, c.right, c.y, COLOR.rule, 0.5);
  c.gap(4);
  c.paragraph(b.method.markup, STYLE.small);
}
