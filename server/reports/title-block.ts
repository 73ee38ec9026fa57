import { COLOR, PAGE, STYLE, rule, type Cursor } from './layout';
import { drawLine, drawParagraph, textWidth } from './pdf-text';
import type { ResultModel } from '../../shared/presentation/result-model';
import { DRAFT_MARK, STATUS_WORDS, isUnapproved, type VersionStatus } from '../../shared/presentation/status';
import type { ReportData } from './report-data';
import { formatMoment } from './typeset';

const STATUS_COLOR: Record<VersionStatus, string> = {
  approved: COLOR.accent,
  in_review: COLOR.warning,
  draft: COLOR.muted,
  returned: COLOR.warning,
  superseded: COLOR.faint,
};

/** The band at the top of the first page: lab, document kind, title, measurand, and the facts of the version. */
export function titleBlock(c: Cursor, r: ReportData, m: ResultModel): void {
  const { doc } = c;
  const v = r.version;
  drawLine(doc, r.lab.toUpperCase(), c.left, c.y + 8, { face: 'bold', size: 8, color: COLOR.ink });
  drawLine(doc, 'Measurement uncertainty budget', c.right, c.y + 8, { face: 'sans', size: 8, color: COLOR.muted }, { align: 'right' });
  c.y += 14;
  rule(doc, c.left, c.right, c.y, COLOR.ink, 1.2);
  c.y += 14;

  c.y += drawParagraph(doc, r.title, c.left, c.y, c.width, { face: 'bold', size: 16, color: COLOR.ink }, { markup: false, leading: 1.2 });
  c.y += 2;
  const unit = m.measurand.unit.markup;
  const measurand = `Measurand  ${m.measurand.symbol}${unit ? ` in ${unit}` : ' (dimensionless)'}${m.measurand.description ? ` — ${m.measurand.description}` : ''}`;
  c.y += drawParagraph(doc, measurand, c.left, c.y, c.width, { face: 'sans', size: 9.5, color: COLOR.muted });
  c.y += 8;

  const mc = m.monteCarlo;
  const equipment = (r.document.equipment ?? []).map((e) => e.trim()).filter(Boolean);
  const left: [string, string][] = [
    ['Budget and version', `Budget ${r.budgetId}, version ${v.number}${v.latest !== v.number ? ` (latest is ${v.latest})` : ' (latest)'}`],
    ['Status', STATUS_WORDS[v.status]],
    ['Saved by', `${v.author}, ${formatMoment(v.createdAt)}`],
    ['Approved by', v.reviewer && v.approvedAt !== null ? `${v.reviewer}, ${formatMoment(v.approvedAt)}` : 'not approved'],
    ['Change note', v.note.trim() || '—'],
  ];
  const right: [string, string][] = [
    ['Procedure', r.document.procedure?.trim() || r.procedure || '—'],
    ['Equipment', equipment.length ? equipment.join(', ') : '—'],
    ['Environment', r.document.environment?.trim() || '—'],
    ['Coverage probability', m.reported.coverageProbability.text],
    ['Monte Carlo', mc ? mc.heading : 'not run'],
    ['Seed', v.seed],
    ['Engine', v.engineVersion],
  ];
  const colW = (c.width - 16) / 2;
  const labelW = 84;
  const rowH = 15;
  const top = c.y;
  rule(doc, c.left, c.right, top, COLOR.rule, 0.5);
  const drawColumn = (rows: [string, string][], x: number) => {
    let y = top;
    for (const [label, value] of rows) {
      drawLine(doc, label, x, y + 10.5, STYLE.label);
      if (label === 'Status') {
        const color = STATUS_COLOR[v.status];
        doc
          .save()
          .rect(x + labelW, y + 4.2, 6.5, 6.5)
          .fill(color)
          .restore();
        drawLine(doc, value, x + labelW + 11, y + 10.5, { face: 'bold', size: 9, color });
      } else {
        const mono = label === 'Seed' || label === 'Engine';
        let text = value;
        const style = mono ? { ...STYLE.mono, size: 8.5 } : STYLE.value;
        while (textWidth(doc, text, style, false) > colW - labelW && text.length > 4) text = `${text.slice(0, -2).trimEnd()}…`;
        drawLine(doc, text, x + labelW, y + 10.5, style, { markup: false });
      }
      y += rowH;
      rule(doc, x, x + colW, y, COLOR.hairline, 0.5);
    }
  };
  drawColumn(left, c.left);
  drawColumn(right, c.left + colW + 16);
  c.y = top + rowH * Math.max(left.length, right.length);
  drawLine(doc, 'Document SHA-256', c.left, c.y + 10.5, STYLE.label);
  drawLine(doc, v.documentSha256, c.left + labelW, c.y + 10.5, { ...STYLE.mono, size: 7.6 }, { markup: false });
  c.y += rowH;
  rule(doc, c.left, c.right, c.y, COLOR.rule, 0.5);
  c.y += 10;
}

/** Footer of every page: what the page belongs to, and where it sits. */
export function footers(doc: PDFKit.PDFDocument, r: ReportData): void {
  const range = doc.bufferedPageRange();
  const y = PAGE.bottom + 30;
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    if (isUnapproved(r.version.status)) draftMark(doc);
    rule(doc, PAGE.left, PAGE.right, y - 12, COLOR.rule, 0.5);
    const left = `${r.lab} · budget ${r.budgetId}, version ${r.version.number} · SHA-256 ${r.version.documentSha256.slice(0, 16)}…`;
    drawLine(doc, left, PAGE.left, y, STYLE.small, { markup: false });
    drawLine(doc, `Page ${i - range.start + 1} of ${range.count}`, PAGE.right, y, { ...STYLE.small, color: COLOR.ink }, { align: 'right' });
    drawLine(doc, `Produced by Dubito on ${formatMoment(r.generatedAt)} from the stored version; the version, not this print, is the record.`, PAGE.left, y + 10, {
      ...STYLE.small,
      size: 6.8,
      color: COLOR.faint,
    });
  }
}

/** Across the page, light enough to read through: an unapproved version is never mistaken for a record. */
function draftMark(doc: PDFKit.PDFDocument): void {
  const cx = PAGE.width / 2;
  const cy = PAGE.height / 2;
  doc.save();
  doc.rotate(-38, { origin: [cx, cy] });
  doc.fillOpacity(0.1);
  drawLine(doc, DRAFT_MARK, cx, cy + 16, { face: 'bold', size: 46, color: COLOR.warning }, { align: 'center', markup: false });
  doc.restore();
}
