import PDFDocument from 'pdfkit';
import { fileStem } from '../budgets/file-name';
import { symbolMarkup } from '../../shared/format/symbols';
import { fileSize } from '../../shared/presentation/figures';
import { presentResult, type ResultModel } from '../../shared/presentation/result-model';
import { budgetTable, modelSection, resultSection } from './budget-table';
import { contributionsChart, histogramChart, monteCarloFigures } from './charts';
import { COLOR, Cursor, STYLE, rule } from './layout';
import { drawLine, drawParagraph, registerFonts } from './pdf-text';
import type { ReportData } from './report-data';
import { footers, titleBlock } from './title-block';
import { formatDate, formatMoment, plainText } from './typeset';

function warningsSection(c: Cursor, m: ResultModel): void {
  const beside = m.budget.rows.some((r) => r.warnings.length);
  if (!m.warnings.length) {
    c.paragraph(beside ? 'The warnings of this version stand beside the inputs they concern in the budget.' : 'The engine raised no warnings for this version.', { ...STYLE.body, color: COLOR.muted });
    return;
  }
  for (const w of m.warnings.map((t) => t.message)) {
    const h = drawParagraph(c.doc, w, 0, 0, c.width - 14, STYLE.body, { markup: false, dryRun: true });
    c.need(h);
    c.doc
      .save()
      .rect(c.left, c.y + 3, 3, h - 4)
      .fill(COLOR.warning)
      .restore();
    drawParagraph(c.doc, w, c.left + 10, c.y, c.width - 14, STYLE.body, { markup: false });
    c.y += h + 2;
  }
}

/** Longest run of a file name on one line of its box; names have no spaces to wrap at. */
const NAME_RUN = 72;

/** The evidence files of the version, one unsplit box each: name, size, input quantity, who added it when, SHA-256. */
function evidenceSection(c: Cursor, r: ReportData): void {
  if (!r.evidence.length) {
    c.paragraph('No evidence is attached to this version.', { ...STYLE.body, color: COLOR.muted });
    return;
  }
  c.paragraph('Files kept with this version. Each is identified by its SHA-256: a copy whose digest differs is not the file this version carries.', { ...STYLE.body, color: COLOR.muted });
  c.gap(4);
  const { doc } = c;
  const nameStyle = { face: 'mono-bold' as const, size: 8, color: COLOR.ink };
  const sizeW = 70;
  for (const e of r.evidence) {
    const name = e.fileName.match(new RegExp(`.{1,${NAME_RUN}}`, 'gsu'))?.join('\n') ?? e.fileName;
    const nameW = c.width - 20 - sizeW;
    const nameH = drawParagraph(doc, name, 0, 0, nameW, nameStyle, { markup: false, dryRun: true });
    const h = 6 + nameH + 26 + 4;
    c.need(h + 4);
    const x = c.left + 10;
    const top = c.y;
    doc.save().lineWidth(0.6).strokeColor(COLOR.rule).rect(c.left, top, c.width, h).stroke().restore();
    drawParagraph(doc, name, x, top + 5, nameW, nameStyle, { markup: false });
    drawLine(doc, fileSize(e.size).text, c.right - 10, top + 13, STYLE.mono, { align: 'right', markup: false });
    let y = top + 6 + nameH + 9;
    const forWhat = e.symbol === null ? 'for the whole budget' : `for ${symbolMarkup(e.symbol)}`;
    const w = drawLine(doc, forWhat, x, y, STYLE.small, { markup: e.symbol !== null });
    drawLine(doc, ` · added to version ${e.versionNumber} by ${e.uploaderName}, ${formatMoment(e.createdAt)}`, x + w, y, STYLE.small, { markup: false });
    y += 12;
    const label = drawLine(doc, 'SHA-256 ', x, y, STYLE.small);
    drawLine(doc, e.sha256, x + label, y, { face: 'mono', size: 7.5, color: COLOR.ink }, { markup: false });
    c.y = top + h + 4;
  }
}

function signatures(c: Cursor, r: ReportData): void {
  const { doc } = c;
  const v = r.version;
  const h = 92;
  c.need(h);
  const colW = (c.width - 24) / 2;
  const boxes: { role: string; name: string; detail: string; date: string }[] = [
    { role: 'Prepared by', name: v.author, detail: `saved version ${v.number} on ${formatMoment(v.createdAt)}`, date: formatDate(v.createdAt) },
    v.reviewer && v.approvedAt !== null
      ? { role: 'Approved by', name: v.reviewer, detail: `approved with password confirmation, ${formatMoment(v.approvedAt)}`, date: formatDate(v.approvedAt) }
      : { role: 'Approved by', name: '', detail: 'this version is not approved', date: '' },
  ];
  boxes.forEach((b, i) => {
    const x = c.left + i * (colW + 24);
    const y = c.y;
    drawLine(doc, b.role, x, y + 9, { face: 'bold', size: 8.5, color: COLOR.ink });
    drawLine(doc, b.name || '—', x, y + 24, { face: 'sans', size: 10, color: b.name ? COLOR.ink : COLOR.faint }, { markup: false });
    drawLine(doc, b.detail, x, y + 36, STYLE.small, { markup: false });
    const lineY = y + 72;
    rule(doc, x, x + colW * 0.62, lineY, COLOR.ink, 0.6);
    rule(doc, x + colW * 0.68, x + colW, lineY, COLOR.ink, 0.6);
    drawLine(doc, 'Signature', x, lineY + 9, STYLE.small);
    drawLine(doc, 'Date', x + colW * 0.68, lineY + 9, STYLE.small);
    if (b.date) drawLine(doc, b.date, x + colW * 0.68, lineY - 4, { face: 'mono', size: 8.5, color: COLOR.ink });
  });
  c.y += h + 6;
}

function caution(c: Cursor, m: ResultModel): void {
  const style = { face: 'sans' as const, size: 8.5, color: COLOR.ink };
  const h = drawParagraph(c.doc, m.caution, 0, 0, c.width - 20, style, { markup: false, dryRun: true }) + 12;
  c.need(h);
  c.doc.save().lineWidth(0.6).strokeColor(COLOR.rule).rect(c.left, c.y, c.width, h).stroke().restore();
  drawParagraph(c.doc, m.caution, c.left + 10, c.y + 5, c.width - 20, style, { markup: false });
  c.y += h;
}

/** The raw observations of Type A inputs and the correlation matrix, after the signatures. */
function appendix(c: Cursor, m: ResultModel, n: number): number {
  if (!m.observations.length && !m.correlations) return n;
  if (m.observations.length) {
    c.heading(++n, 'Appendix: observations', 40);
    for (const o of m.observations) {
      const values = o.values.map((v) => v.markup).join(',  ');
      c.paragraph(`${symbolMarkup(o.symbol)}${o.unit.markup ? ` in ${o.unit.markup}` : ''}, ${o.values.length} readings`, { face: 'bold', size: 8.5, color: COLOR.ink }, { markup: true });
      c.paragraph(values, { face: 'mono', size: 8, color: COLOR.ink }, { indent: 10 });
      c.gap(4);
    }
  }
  const k = m.correlations;
  if (k) {
    c.heading(++n, 'Appendix: correlation coefficients r(x_{i}, x_{j})', 30 + 13 * k.symbols.length);
    const { doc } = c;
    const labelW = 80;
    const colW = Math.min(60, (c.width - labelW) / k.symbols.length);
    c.need(13 * (k.symbols.length + 1) + 4);
    k.symbols.forEach((s, j) => drawLine(doc, symbolMarkup(s), c.left + labelW + (j + 1) * colW - 4, c.y + 9, { face: 'mono-bold', size: 7.6, color: COLOR.ink }, { align: 'right' }));
    c.y += 13;
    rule(doc, c.left, c.left + labelW + colW * k.symbols.length, c.y, COLOR.rule, 0.5);
    k.matrix.forEach((row, i) => {
      drawLine(doc, symbolMarkup(k.symbols[i]), c.left, c.y + 9.5, { face: 'mono-bold', size: 7.6, color: COLOR.ink });
      row.forEach((f, j) => drawLine(doc, f.markup, c.left + labelW + (j + 1) * colW - 4, c.y + 9.5, { face: 'mono', size: 7.6, color: j === i ? COLOR.faint : COLOR.ink }, { align: 'right' }));
      c.y += 13;
    });
    c.gap(6);
  }
  return n;
}

/** Renders the filed report of one budget version as a PDF document. */
export function renderReportPdf(r: ReportData): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 0,
    bufferPages: true,
    autoFirstPage: true,
    info: {
      Title: `${r.title} — version ${r.version.number}`,
      Author: r.version.author,
      Subject: `Measurement uncertainty budget ${r.budgetId}, version ${r.version.number}, document SHA-256 ${r.version.documentSha256}`,
      Creator: 'Dubito',
      Producer: 'Dubito',
      CreationDate: new Date(r.generatedAt),
    },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (b: Buffer) => chunks.push(b));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  registerFonts(doc);

  const m = presentResult(r.document, r.result);
  const c = new Cursor(doc);
  titleBlock(c, r, m);
  let n = 0;
  c.heading(++n, 'Result', 80);
  resultSection(c, m);
  c.heading(++n, 'Measurement model', 40);
  modelSection(c, r, m);
  c.heading(++n, 'Uncertainty budget', 120);
  budgetTable(c, m);
  c.heading(++n, 'Contributions, ranked', 170);
  contributionsChart(c, m);
  c.heading(++n, 'Monte Carlo propagation of distributions', r.result.monteCarlo ? 330 : 30);
  histogramChart(c, r, m);
  monteCarloFigures(c, m);
  c.heading(++n, 'Warnings', 30);
  warningsSection(c, m);
  // the explanation stays with the first file's box
  c.heading(++n, 'Evidence', r.evidence.length ? 100 : 20);
  evidenceSection(c, r);
  c.heading(++n, 'Signatures', 150);
  caution(c, m);
  c.gap(10);
  signatures(c, r);
  appendix(c, m, n);
  footers(doc, r);
  doc.end();
  return done;
}

/** The download name: title and version, safe in a header. */
export function reportFileName(r: Pick<ReportData, 'title' | 'version'>): string {
  return `${fileStem(plainText(r.title))}-v${r.version.number}.pdf`;
}
