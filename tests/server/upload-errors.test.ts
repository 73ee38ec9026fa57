import { execFileSync } from 'node:child_process';
import { readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { systemError } from '../../server/http/error-handler';
import { PDF } from './fixtures';
import { sampleDocument, startTestServer, tempDir, type TestServer } from './helpers';

let s: TestServer;
let id: number;

beforeAll(async () => {
  s = await startTestServer();
  id = (await s.services.budgets.create(s.users.metrologist, { document: sampleDocument(), note: '' })).id;
});
afterAll(async () => {
  await s?.stop();
});

describe('observation files past the row cap', () => {
  it('refuses a 1 000 000-row CSV under the size limit with the cap, not a server error', async () => {
    const m = await s.as('metrologist');
    const rows = Buffer.from('1\n'.repeat(1_000_000));
    expect(rows.length).toBeLessThan(s.config.observationsMaxBytes);
    const r = await m.post('/api/uploads/observations').attach('file', rows, { filename: 'long.csv', contentType: 'text/csv' }).expect(413);
    expect(r.body.error.message).toMatch(/more than 100,000 rows/);
    // At the cap itself, with a header, every value is read.
    const atCap = Buffer.from('reading\n' + '2\n'.repeat(100_000));
    const ok = await m.post('/api/uploads/observations').attach('file', atCap, { filename: 'cap.csv', contentType: 'text/csv' }).expect(200);
    expect(ok.body.values).toHaveLength(100_000);
  });
});

describe('multipart bodies that cannot be read', () => {
  it('answers 400 with what is wrong for a form without boundary and a truncated form', async () => {
    const m = await s.as('metrologist');
    const raw = (contentType: string, body: string) => m.post('/api/uploads/observations').set('Content-Type', contentType).send(body);
    const noBoundary = await raw('multipart/form-data', 'whatever').expect(400);
    expect(noBoundary.body.error).toMatchObject({ code: 'invalid_upload' });
    expect(noBoundary.body.error.message).toMatch(/boundary/);
    const truncated = await raw('multipart/form-data; boundary=XyZ', '--XyZ\r\nContent-Disposition: form-data; name="file"; filename="r.csv"\r\nContent-Type: text/csv\r\n\r\n1\n2\n').expect(400);
    expect(truncated.body.error).toMatchObject({ code: 'invalid_upload' });
    expect(truncated.body.error.message).toMatch(/ended before the form was complete/);
  });
});

describe('file names', () => {
  it('keeps a UTF-8 file name as sent', async () => {
    const m = await s.as('metrologist');
    const up = await m.post(`/api/budgets/${id}/attachments`).attach('file', PDF, { filename: 'Prüfschein Ø 12 µm.pdf', contentType: 'application/pdf' }).expect(201);
    expect(up.body.fileName).toBe('Prüfschein Ø 12 µm.pdf');
  });
});

describe('storage failures', () => {
  it('answers 507 with a message when the database is full', async () => {
    const m = await s.as('metrologist');
    const db = s.connection.sqlite;
    const pages = db.pragma('page_count', { simple: true }) as number;
    db.pragma(`max_page_count = ${pages}`);
    try {
      // Under the unknown-field limit, yet larger than the pages left.
      const big = sampleDocument('Too much to store', { labNote: 'x'.repeat(60_000) });
      const r = await m.post('/api/budgets').send({ document: big }).expect(507);
      expect(r.body.error).toMatchObject({ code: 'storage_full' });
      expect(r.body.error.message).toMatch(/no room left/);
    } finally {
      db.pragma('max_page_count = 4294967294');
    }
  });

  it('answers 503 with a message when the database cannot be written', async () => {
    const m = await s.as('metrologist');
    s.connection.sqlite.pragma('query_only = ON');
    try {
      const r = await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Read-only') })
        .expect(503);
      expect(r.body.error).toMatchObject({ code: 'storage_read_only' });
      expect(r.body.error.message).toMatch(/cannot write/);
    } finally {
      s.connection.sqlite.pragma('query_only = OFF');
    }
  });

  it('maps the system codes of a full or read-only disk', () => {
    const err = (code: string) => Object.assign(new Error(code), { code });
    expect(systemError(err('ENOSPC'))?.status).toBe(507);
    expect(systemError(err('SQLITE_FULL'))?.status).toBe(507);
    expect(systemError(err('EROFS'))?.status).toBe(503);
    expect(systemError(err('SQLITE_READONLY'))?.status).toBe(503);
    expect(systemError(err('SQLITE_BUSY'))?.status).toBe(503);
    expect(systemError(err('ENOENT'))).toBeNull();
  });

  // A real full disk: a small tmpfs, which only root may mount (skipped elsewhere).
  it('answers 507 for evidence on a full disk and leaves no partial file behind', async (ctx) => {
    const small = tempDir();
    try {
      execFileSync('mount', ['-t', 'tmpfs', '-o', 'size=64k', 'tmpfs', small], { stdio: 'ignore' });
    } catch {
      rmSync(small, { recursive: true, force: true });
      ctx.skip();
    }
    const t = await startTestServer({ dataDir: small });
    try {
      const budget = (await t.services.budgets.create(t.users.metrologist, { document: sampleDocument(), note: '' })).id;
      const m = await t.as('metrologist');
      const big = Buffer.concat([PDF, Buffer.alloc(200 * 1024, 1)]);
      const r = await m.post(`/api/budgets/${budget}/attachments`).attach('file', big, { filename: 'scan.pdf', contentType: 'application/pdf' }).expect(507);
      expect(r.body.error.code).toBe('storage_full');
      const left = readdirSync(join(small, 'attachments'), { recursive: true }).map(String);
      expect(left.filter((f) => f.endsWith('.tmp'))).toEqual([]);
    } finally {
      await t.stop().catch(() => {});
      execFileSync('umount', [small]);
      rmSync(small, { recursive: true, force: true });
    }
  });
});
