import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';
import { dirname, join, sep } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { ROLES } from '../../shared/policy/policy';
import { CAUTION, presentResult } from '../../shared/presentation/result-model';
import type { ReportData } from '../../server/reports/report-data';
import { groupDigits, plainText } from '../../server/reports/typeset';
import { unitText } from '../../shared/presentation/units';
import { symbolMarkup } from '../../shared/format/symbols';
import { PNG } from './fixtures';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

const STANDARD_FONTS = join(dirname(createRequire(import.meta.url).resolve('pdfjs-dist/package.json')), 'standard_fonts') + sep;

let s: TestServer;
let id: number;

const SYMBOLS = ['L_ref', 'dL_res', 'k_cal'];

function reportDocument(title: string, factor = 1) {
  return sampleDocument(title, {
    measurand: { symbol: 'L', unit: 'um', description: 'deviation of the bar from nominal at 20 °C' },
    model: 'L = (L_ref + dL_res) * k_cal',
    inputs: [
      { symbol: 'L_ref', unit: 'um', description: 'reference value from its certificate', distribution: { kind: 'normal', value: 12.5 * factor, U: 0.4, k: 2 } },
      { symbol: 'dL_res', unit: 'um', description: 'resolution of the indication', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.05 } },
      { symbol: 'k_cal', description: 'calibration factor', distribution: { kind: 'observations', values: [1.0002, 0.9998, 1.0001, 1.0, 0.9999] } },
    ],
  });
}

const reportStatement = (r: ReportData) => presentResult(r.document, r.result).statement.markup;

/** Binary body of a supertest request. */
function binary(req: request.Test): request.Test {
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

/** All text of a PDF, pages joined. */
async function pdfText(data: Buffer): Promise<string> {
  const pdf = await getDocument({ data: new Uint8Array(data), standardFontDataUrl: STANDARD_FONTS, isEvalSupported: false }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const content = await (await pdf.getPage(i)).getTextContent();
    pages.push(content.items.map((it) => ('str' in it ? it.str : '')).join(' '));
  }
  await pdf.destroy();
  // readers give the micro sign as Greek mu; compare in compatibility form
  return pages.join('\n').normalize('NFKC');
}

/** Compares text regardless of spacing and of raised or lowered markup. */
const squash = (t: string) =>
  t
    .normalize('NFKC')
    .replace(/[_^]\{([^}]*)\}/g, '$1')
    .replace(/[\s\u202f\u2009]+/g, '');

beforeAll(async () => {
  s = await startTestServer();
  const b = await s.services.budgets.create(s.users.metrologist, { document: reportDocument('Step gauge KF-SG-3 by comparison'), note: 'first issue' });
  id = b.id;
  await s.services.budgets.save(s.users.metrologist, id, { baseVersion: 1, document: reportDocument('Step gauge KF-SG-3 by comparison', 1.01), note: 'new reference value' });
});
afterAll(async () => {
  await s?.stop();
});

describe('GET /api/budgets/:id/versions/:n/report.pdf', () => {
  it('serves a filed report of the version to a reader', async () => {
    const res = await binary((await s.as('auditor')).get(`/api/budgets/${id}/versions/1/report.pdf`)).expect(200);
    expect(res.headers['content-type']).toMatch(/^application\/pdf/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?step-gauge-kf-sg-3-by-comparison-v1\.pdf"?$/);
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');

    const text = await pdfText(body);
    const flat = squash(text);
    expect(flat).toContain(squash('Step gauge KF-SG-3 by comparison'));
    expect(flat).toContain(squash(`Budget ${id}, version 1`));
    expect(flat).toContain('KestrelFenMetrologyLaboratory');
    // symbols are typeset, the subscript lowered: L_ref reads as L with ref below
    for (const symbol of SYMBOLS) expect(flat).toContain(squash(symbolMarkup(symbol)));
    const data = s.services.reports.data(s.users.auditor, id, 1);
    expect(flat).toContain(squash(reportStatement(data)));
    expect(flat).toContain(squash(CAUTION));
    // units typeset, not as typed
    expect(text).toContain('µm'.normalize('NFKC'));
    expect(text).not.toMatch(/\bum\b/);
    expect(text).toMatch(/Page 1 of \d/);
    expect(data.version.status).toBe('superseded');
    expect(text).toContain('Superseded draft');
    expect(text).toContain(data.version.documentSha256);
    expect(text).toContain('Test metrologist');
  });

  it('the statement rounds U to two significant digits and y to the same place', () => {
    const data = s.services.reports.data(s.users.reviewer, id, 1);
    const st = plainText(reportStatement(data));
    expect(st).toMatch(/^L = \(12\.50 ± 0\.40\) µm\. /);
    expect(st).toContain('k = ');
  });

  it('without a version number gives the current version', async () => {
    const res = await binary((await s.as('trainee')).get(`/api/budgets/${id}/report.pdf`)).expect(200);
    expect(res.headers['content-disposition']).toContain('-v2.pdf');
    const text = await pdfText(res.body as Buffer);
    expect(squash(text)).toContain(squash(`Budget ${id}, version 2 (latest)`));
    expect(text).toContain('new reference value');
  });

  it('is readable by every role and by nobody signed out', async () => {
    for (const role of ROLES) {
      await binary((await s.as(role)).get(`/api/budgets/${id}/versions/2/report.pdf`)).expect(200);
    }
    const anon = await s.anonymous().get(`/api/budgets/${id}/versions/2/report.pdf`).expect(401);
    expect(anon.body.error.code).toBe('unauthenticated');
  });

  it('answers 404 for an unknown budget or version and 400 for a malformed one', async () => {
    const a = await s.as('metrologist');
    expect((await a.get('/api/budgets/99999/report.pdf').expect(404)).body.error.code).toBe('not_found');
    expect((await a.get(`/api/budgets/${id}/versions/9/report.pdf`).expect(404)).body.error.message).toMatch(/no version 9/);
    expect((await a.get(`/api/budgets/${id}/versions/zero/report.pdf`).expect(400)).body.error.field).toBe('n');
    expect((await a.get('/api/budgets/-3/report.pdf').expect(400)).body.error.field).toBe('id');
  });

  it('an approved version names its reviewer and the time of approval', async () => {
    const b = await s.services.budgets.create(s.users.metrologist, { document: reportDocument('Approved bar'), note: '' });
    await s.services.reviews.transition(s.users.metrologist, b.id, { to: 'in_review' });
    const reviewer = await s.as('reviewer');
    await reviewer.post(`/api/budgets/${b.id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(200);
    const res = await binary((await s.as('auditor')).get(`/api/budgets/${b.id}/versions/1/report.pdf`)).expect(200);
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('Approved');
    expect(text).toContain('Test reviewer');
    expect(text).toMatch(/approved with password confirmation, \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
  });
});

describe('evidence in the report (ISO/IEC 17025 7.8.2.1)', () => {
  it('lists each file the version carries with its input, size and SHA-256; an earlier version lists none of the later files', async () => {
    const b = await s.services.budgets.create(s.users.metrologist, { document: reportDocument('Step gauge KF-SG-4 with evidence'), note: 'first issue' });
    await s.services.budgets.save(s.users.metrologist, b.id, { baseVersion: 1, document: reportDocument('Step gauge KF-SG-4 with evidence', 1.01), note: 'new certificate' });
    const file = { originalname: 'KF-cert_2291.png', mimetype: 'image/png', buffer: PNG, size: PNG.length };
    s.services.attachments.add(s.users.metrologist, b.id, file, 'L_ref');
    s.services.attachments.add(s.users.metrologist, b.id, { ...file, originalname: 'bench photo.png' }, null);
    // the digest computed here, apart from the upload path
    const sha = createHash('sha256').update(PNG).digest('hex');

    const data = s.services.reports.data(s.users.auditor, b.id, 2);
    expect(data.evidence.map((e) => [e.fileName, e.symbol, e.size, e.sha256, e.versionNumber])).toEqual([
      ['KF-cert_2291.png', 'L_ref', PNG.length, sha, 2],
      ['bench photo.png', null, PNG.length, sha, 2],
    ]);

    const text = await pdfText((await binary((await s.as('auditor')).get(`/api/budgets/${b.id}/versions/2/report.pdf`)).expect(200)).body as Buffer);
    const flat = squash(text);
    expect(flat).toContain('KF-cert_2291.png');
    expect(flat).toContain('benchphoto.png');
    expect(text).toContain(sha);
    expect(flat).toContain(squash(`for ${symbolMarkup('L_ref')}`));
    expect(flat).toContain('forthewholebudget');
    expect(flat).toContain(`${PNG.length}B`);
    expect(text).toContain('Test metrologist');

    const first = await pdfText((await binary((await s.as('auditor')).get(`/api/budgets/${b.id}/versions/1/report.pdf`)).expect(200)).body as Buffer);
    expect(first).toContain('No evidence is attached to this version.');
    expect(first).not.toContain(sha);
  });
});

describe('typesetting of units and numbers', () => {
  it('writes units as SI prints them', () => {
    const formatUnit = (u: string) => unitText(u).markup;
    expect(plainText(formatUnit('um'))).toBe('µm');
    expect(plainText(formatUnit('degC'))).toBe('°C');
    expect(plainText(formatUnit('m^3'))).toBe('m³');
    expect(plainText(formatUnit('kg/m^3'))).toBe('kg/m³');
    expect(plainText(formatUnit('1/degC'))).toBe('°C⁻¹');
    expect(plainText(formatUnit('N m'))).toBe('N·m');
    expect(formatUnit('ohm')).toBe('Ω');
    expect(formatUnit('1')).toBe('');
  });

  it('groups digits in threes on both sides of the decimal sign', () => {
    expect(plainText(groupDigits('12345.678901'))).toBe('12 345.678 901');
    expect(groupDigits('1234.5678')).toBe('1234.5678');
    expect(groupDigits('-0.5')).toBe('−0.5');
  });
});
