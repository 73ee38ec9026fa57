import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSV, PDF } from './fixtures';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;
let id: number;

beforeAll(async () => {
  s = await startTestServer();
  id = (await s.services.budgets.create(s.users.metrologist, { document: sampleDocument(), note: '' })).id;
});
afterAll(async () => {
  await s?.stop();
});

describe('observations from CSV', () => {
  it('returns the numbers of the chosen column and the rows it could not read', async () => {
    const m = await s.as('metrologist');
    const r = await m.post('/api/uploads/observations').field('column', 'reading_mm').attach('file', CSV, { filename: 'r.csv', contentType: 'text/csv' }).expect(200);
    expect(r.body.values).toEqual([10.0012, 10.0015, 10.0011, 10.0013]);
    expect(r.body.header).toBe(true);
    expect(r.body.errors).toEqual([{ row: 4, message: '"oops" is not a number' }]);
    const byIndex = await m.post('/api/uploads/observations').field('column', '2').attach('file', CSV, { filename: 'r.csv', contentType: 'text/csv' }).expect(200);
    expect(byIndex.body.values).toEqual([20.1, 20.2, 20.1, 20]);
    expect(byIndex.body.errors).toEqual([{ row: 5, message: 'the cell is empty' }]);
  });

  it('reads a single column with decimal commas and semicolons', async () => {
    const m = await s.as('trainee');
    const text = Buffer.from('1,5;x\n2,5;y\n3,25;z\n');
    const r = await m.post('/api/uploads/observations').field('column', '1').attach('file', text, { filename: 'r.csv', contentType: 'text/csv' }).expect(200);
    expect(r.body.values).toEqual([1.5, 2.5, 3.25]);
    const one = await m.post('/api/uploads/observations').attach('file', Buffer.from('0.1\n0.2\n0.3\n'), { filename: 'one.txt', contentType: 'text/plain' }).expect(200);
    expect(one.body.values).toEqual([0.1, 0.2, 0.3]);
  });

  it('refuses a CSV file over the size limit', async () => {
    const m = await s.as('metrologist');
    const big = Buffer.alloc(s.config.observationsMaxBytes + 1, '1\n');
    const r = await m.post('/api/uploads/observations').attach('file', big, { filename: 'big.csv', contentType: 'text/csv' }).expect(413);
    expect(r.body.error.code).toBe('too_large');
  });
});

describe('evidence attachments', () => {
  it('keeps a PDF by hash and serves it only to signed-in readers', async () => {
    const m = await s.as('metrologist');
    const up = await m.post(`/api/budgets/${id}/attachments`).field('symbol', 'a').attach('file', PDF, { filename: 'certificate 2025.pdf', contentType: 'application/pdf' }).expect(201);
    expect(up.body).toMatchObject({ budgetId: id, symbol: 'a', fileName: 'certificate 2025.pdf', size: PDF.length, mediaType: 'application/pdf' });
    expect(up.body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const auditor = await s.as('auditor');
    const list = await auditor.get(`/api/budgets/${id}/attachments`).expect(200);
    expect(list.body).toHaveLength(1);
    const file = await auditor.get(`/api/budgets/${id}/attachments/${up.body.id}`).buffer(true).expect(200);
    expect(file.headers['content-type']).toMatch(/application\/pdf/);
    expect(file.headers['content-disposition']).toMatch(/attachment/);
    expect(Buffer.compare(file.body as Buffer, PDF)).toBe(0);
    await s.anonymous().get(`/api/budgets/${id}/attachments/${up.body.id}`).expect(401);
    await auditor.post(`/api/budgets/${id}/attachments`).attach('file', PDF, { filename: 'c.pdf', contentType: 'application/pdf' }).expect(403);
    // Another user's budget: a trainee may not attach to it.
    const t = await s.as('trainee');
    await t.post(`/api/budgets/${id}/attachments`).attach('file', PDF, { filename: 'c.pdf', contentType: 'application/pdf' }).expect(403);
  });

  it('refuses files over 10 MB and writes nothing', async () => {
    const m = await s.as('metrologist');
    const before = s.connection.sqlite.prepare('SELECT count(*) AS n FROM attachments').get() as { n: number };
    const big = Buffer.concat([PDF, Buffer.alloc(10 * 1024 * 1024)]);
    const r = await m.post(`/api/budgets/${id}/attachments`).attach('file', big, { filename: 'big.pdf', contentType: 'application/pdf' }).expect(413);
    expect(r.body.error.code).toBe('too_large');
    const after = s.connection.sqlite.prepare('SELECT count(*) AS n FROM attachments').get() as { n: number };
    expect(after.n).toBe(before.n);
  });
});
