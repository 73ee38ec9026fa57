import PDFDocument from 'pdfkit';
import { fileStem } from '../budgets/file-name';
import { budgetTable, inputsSection, modelSection, resultSection } from './budget-table';
import { histogramChart, monteCarloFigures, sharesChart } from './charts';
import { COLOR, Cursor, STYLE, rule } from './layout';
import { drawLine, drawParagraph, registerFonts } from './pdf-text';
import type { ReportData } from './report-data';
import { footers, titleBlock } from './title-block';
import { formatDate, formatMoment, groupNumbersIn, plainText } from './typeset';

export const CAUTION =
  'These results support, and do not replace, the laboratory’s documented procedure and its accreditation requirements (ISO/IEC 17025).';

function warningsSection(c: Cursor, r: ReportData): void {
  if (!r.result.warnings.length) {
    c.paragraph('The engine raised no warnings for this version.', { ...STYLE.body, color: COLOR.muted });
    return;
  }
  for (const w of r.result.warnings.map((t) => groupNumbersIn(t))) {
    const h = drawParagraph(c.doc, w, 0, 0, c.width - 14, STYLE.body, { markup: false, dryRun: true });
    c.need(h);
    c.doc.save().rect(c.left, c.y + 3, 3, h - 4).fill(COLOR.warning).restore();
    drawParagraph(c.doc, w, c.left + 10, c.y, c.width - 14, STYLE.body, { markup: false });
    c.y += h + 2;
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

function caution(c: Cursor): void {
  const style = { face: 'sans' as const, size: 8.5, color: COLOR.ink };
  const h = drawParagraph(c.doc, CAUTION, 0, 0, c.width - 20, style, { markup: false, dryRun: true }) + 12;
  c.need(h);
  c.doc.save().lineWidth(0.6).strokeColor(COLOR.rule).rect(c.left, c.y, c.width, h).stroke().restore();
  drawParagraph(c.doc, CAUTION, c.left + 10, c.y + 5, c.width - 20, style, { markup: false });
  c.y += h;
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

  const c = new Cursor(doc);
  titleBlock(c, r);
  let n = 0;
  c.heading(++n, 'Result', 80);
  resultSection(c, r);
  c.heading(++n, 'Measurement model', 40);
  modelSection(c, r);
  c.heading(++n, 'Input quantities', 50);
  inputsSection(c, r);
  c.heading(++n, 'Uncertainty budget', 120);
  budgetTable(c, r);
  c.heading(++n, 'Contributions to the variance, largest first', 80);
  sharesChart(c, r);
  c.heading(++n, 'Monte Carlo propagation of distributions', r.result.monteCarlo ? 330 : 30);
  histogramChart(c, r);
  monteCarloFigures(c, r);
  c.heading(++n, 'Warnings', 30);
  warningsSection(c, r);
  c.heading(++n, 'Signatures', 150);
  caution(c);
  c.gap(10);
  signatures(c, r);
  footers(doc, r);
  doc.end();
  return done;
}

/** The download name: title and version, safe in a header. */
export function reportFileName(r: Pick<ReportData, 'title' | 'version'>): string {
  return `${fileStem(plainText(r.title))}-v${r.version.number}.pdf`;
}
