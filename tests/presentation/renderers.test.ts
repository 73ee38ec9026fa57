import { createRequire } from 'node:module';
import { dirname, join, sep } from 'node:path';
import { createElement } from 'react';
import { renderToString } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { validateBudget } from '../../shared/budget/budget-file';
import { computeBudget } from '../../shared/compute/compute-budget';
import type { Figure } from '../../shared/presentation/figures';
import { presentResult } from '../../shared/presentation/result-model';
import { withUnit } from '../../shared/presentation/units';
import { formatBudgetTable } from '../../cli/budget-table';
import { renderReportPdf } from '../../server/reports/report-pdf';
import { BudgetWithContributions } from '../../src/budget/components/BudgetTable';
import { ResultCard } from '../../src/features/editor/components/ResultCard';
import { MonteCarloComparison, ValidationVerdict } from '../../src/budget/components/MonteCarloComparison';
import { ReportDocument } from '../../src/features/report/components/ReportDocument';

/*
 * One result rendered by every renderer that runs in Node: the PDF (its text
 * read back with pdfjs-dist), the command-line table, and the report page,
 * result card and Monte Carlo figures rendered to HTML by React. They must
 * print the same figures, because they all print the one result model.
 */

const STANDARD_FONTS = join(dirname(createRequire(import.meta.url).resolve('pdfjs-dist/package.json')), 'standard_fonts') + sep;

// invented demo data: a bath check in mK with readings in °C and p = 95.45 % (k = 2 for a normal distribution)
const document = validateBudget({
  format: 'dubito-budget/1',
  title: 'Bath check KF-BATH2 at 60 °C',
  procedure: 'KF-TMP-009 rev. 2',
  equipment: ['KF-SPRT4', 'KF-BATH2'],
  environment: '(20 ± 2) °C, 45 % rh',
  measurand: { symbol: 'E', unit: 'mK', description: 'error of the bath setting' },
  model: 'E = t_set - t_ref - dt_cal',
  inputs: [
    { symbol: 't_set', unit: 'degC', description: 'bath set point', distribution: { kind: 'constant', value: 60 } },
    { symbol: 't_ref', unit: 'degC', description: 'reference readings', distribution: { kind: 'observations', values: [59.962, 59.971, 59.958, 59.969, 59.965] } },
    // a correction is a temperature difference: given in mK it meets the difference t_set − t_ref (the temperature rule)
    { symbol: 'dt_cal', unit: 'mK', description: 'reference calibration', distribution: { kind: 'normal', value: 2, U: 12, k: 2 } },
  ],
  coverageProbability: 0.9545,
  monteCarlo: { trials: 20000, seed: 'renderers' },
});
const result = computeBudget(document);
const model = presentResult(document, result);

/** Text compared regardless of spacing and of raised or lowered markup; the PDF draws √ and ∞ as shapes, not text. */
const squash = (t: string) =>
  t
    .normalize('NFKC')
    .replace(/[_^]\{([^}]*)\}/g, '$1')
    .replace(/[\s\u202f\u2009]+/g, '')
    .replace(/[√∞]/g, '');

async function pdfText(data: Buffer): Promise<string> {
  const pdf = await getDocument({ data: new Uint8Array(data), standardFontDataUrl: STANDARD_FONTS, isEvalSupported: false }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    pages.push(content.items.map((it) => ('str' in it ? it.str : '')).join(' '));
  }
  await pdf.destroy();
  return pages.join('\n');
}

const htmlText = (html: string) =>
  html
    .replace(/<[^>]*>/g, ' ')
    .replace(/&amp;/g, '&')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'");

const facts = {
  lab: 'Kestrel Fen Metrology Laboratory',
  budgetId: 12,
  title: document.title,
  version: 3,
  latest: 3,
  status: 'draft' as const,
  author: 'Avery Marsh',
  savedAt: '2026-11-03 09:12 UTC',
  reviewer: null,
  approvedAt: null,
  note: 'new readings',
  seed: 'renderers',
  engineVersion: result.engineVersion,
  documentSha256: 'cd'.repeat(32),
  procedure: 'KF-TMP-009 rev. 2',
  equipment: ['KF-SPRT4', 'KF-BATH2'],
  environment: '(20 ± 2) °C, 45 % rh',
};

async function renderings(): Promise<Record<string, string>> {
  const pdf = await renderReportPdf({
    lab: facts.lab,
    budgetId: facts.budgetId,
    title: document.title,
    procedure: null,
    version: {
      number: 3,
      latest: 3,
      createdAt: Date.UTC(2026, 10, 3, 9, 12),
      note: facts.note,
      seed: 'renderers',
      engineVersion: result.engineVersion,
      documentSha256: facts.documentSha256,
      status: 'draft',
      author: facts.author,
      reviewer: null,
      approvedAt: null,
    },
    document,
    result,
    evidence: [],
    generatedAt: Date.UTC(2026, 10, 4, 10, 0),
  });
  const report = renderToString(createElement(ReportDocument, { model, facts, evidence: [], renderBudgetTable: (m) => createElement(BudgetWithContributions, { model: m }) }));
  const card = renderToString(createElement(ResultCard, { model, stale: false, move: null, problemsCount: 0, onSelect: () => {} }));
  const panel = renderToString(
    createElement('div', null, createElement(MonteCarloComparison, { view: model.monteCarlo!, unit: model.measurand.unit.text }), createElement(ValidationVerdict, { view: model.validation })),
  );
  return { pdf: await pdfText(pdf), cli: formatBudgetTable(document, result), report: htmlText(report), card: htmlText(card), panel: htmlText(panel) };
}

describe('every renderer prints the figures of the one result model', () => {
  it('the model reads as a hand-written budget would', () => {
    const f = model.reported;
    // p = 95.45 % is never rounded to "95 %" as a share would be
    expect(f.coverageProbability.text).toBe('95.45 %');
    // u(t_ref) is s/√5 of the readings, u(dt_cal) = 0.012/2 °C = 6 mK; c = −1 mK/mK, no −1000 mK/°C
    const cal = model.budget.rows.find((r) => r.symbol === 'dt_cal')!;
    expect(cal.sensitivity.figure.text).toBe('\u22121');
    expect(cal.sensitivity.unit.text).toBe('');
    expect(cal.contribution.text).toBe('6.0');
    expect(cal.stated.text).toBe('U = 12 mK, k = 2');
    expect(cal.divisor.text).toBe('2');
    // the estimate is written at the place of U (JCGM 100:2008 7.2.6): both in whole mK here or both finer
    const places = (s: string) => (s.split('.')[1] ?? '').replace(/\D/g, '').length;
    expect(places(f.estimate.text)).toBe(places(f.expandedUncertainty.text));
    expect(model.statement.text).toContain(`(${f.estimate.text} ± ${f.expandedUncertainty.text}) mK`);
  });

  it('PDF, command line, report page, result card and Monte Carlo panel print the same figures', async () => {
    const r = await renderings();
    const f = model.reported;
    const unit = model.measurand.unit;
    const everywhere: Figure[] = [withUnit(f.estimate, unit), withUnit(f.expandedUncertainty, unit), f.coverageProbability];
    const onPaper: Figure[] = [
      withUnit(f.standardUncertainty, unit),
      f.effectiveDof,
      ...(f.coverageFactor ? [f.coverageFactor] : []),
      ...model.budget.rows.flatMap((row) => [row.contribution, row.share, row.sensitivity.figure, withUnit(row.standardUncertainty, row.unit), row.stated]),
      ...model.monteCarlo!.rows.flatMap((row) => [row.monteCarlo, ...(row.gum ? [row.gum] : [])]),
    ];
    const plain = (t: string) => ({ text: t, markup: t });
    const texts = [model.statement, model.budget.dominant, plain(model.validation!.headline), plain(model.caution)];
    for (const name of ['pdf', 'cli', 'report', 'card'] as const) {
      const flat = squash(r[name]);
      for (const fig of everywhere) expect(flat, `${name}: ${fig.text}`).toContain(squash(fig.markup));
    }
    for (const name of ['pdf', 'cli', 'report'] as const) {
      const flat = squash(r[name]);
      for (const fig of onPaper) expect(flat, `${name}: ${fig.text}`).toContain(squash(fig.markup));
      for (const t of texts) expect(flat, `${name}: ${t.text}`).toContain(squash(name === 'pdf' ? t.markup : t.text));
    }
    for (const row of model.monteCarlo!.rows) expect(squash(r.panel)).toContain(squash(row.monteCarlo.text));
    expect(squash(r.card)).toContain(squash(model.statement.text));
    // the title block names the record of the measurement, and an unapproved version says so on every page
    for (const name of ['pdf', 'report'] as const) {
      for (const t of ['KF-TMP-009 rev. 2', 'KF-SPRT4, KF-BATH2', '(20 ± 2) °C, 45 % rh', 'DRAFT — not approved']) expect(squash(r[name]), `${name}: ${t}`).toContain(squash(t));
    }
    // the raw readings are in the appendix of both documents
    for (const v of ['59.962', '59.958']) {
      expect(r.pdf).toContain(v);
      expect(r.report).toContain(v);
    }
  });
});
