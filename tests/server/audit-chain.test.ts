import Database from 'better-sqlite3';
import { cpSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { recordAudit } from '../../server/audit/audit-repository';
import { AuditService, describeDetail, isoSecond } from '../../server/audit/audit-service';
import { inTransaction, openDatabase } from '../../server/db/connection';
import { sampleDocument, startTestServer, tempDir, type TestServer } from './helpers';

const stopping: (() => Promise<void>)[] = [];
afterEach(async () => {
  while (stopping.length) await stopping.pop()!();
});

async function server(): Promise<TestServer> {
  const s = await startTestServer();
  stopping.push(() => s.stop());
  return s;
}

/** Changes the file as someone with the database in hand would: past the triggers. */
function byHand(s: TestServer, ...statements: string[]): void {
  const other = new Database(s.config.dbFile);
  other.exec('DROP TRIGGER audit_events_no_update; DROP TRIGGER audit_events_no_delete;');
  for (const st of statements) other.exec(st);
  other.close();
}

async function budgetWithHistory(s: TestServer): Promise<number> {
  const m = await s.as('metrologist');
  const id = (
    await m
      .post('/api/budgets')
      .send({ document: sampleDocument('Chained') })
      .expect(201)
  ).body.id;
  await m.post(`/api/budgets/${id}/comments`).send({ version: 1, body: 'uncertainty of c: is the 0.01 from the certificate?' }).expect(201);
  await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
  return id;
}

describe('what the trail says', () => {
  let s: TestServer;
  let id: number;
  beforeAll(async () => {
    s = await startTestServer();
    id = await budgetWithHistory(s);
  });
  afterAll(async () => {
    await s?.stop();
  });

  it('gives times to the second with their zone, comment bodies and budget titles', async () => {
    const page = (await (await s.as('auditor')).get(`/api/audit?budget=${id}`).expect(200)).body;
    for (const e of page.events) {
      expect(e.time).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}Z$/);
      expect(e.time).toBe(isoSecond(e.at));
      expect(e.budgetTitle).toBe('Chained');
    }
    expect(isoSecond(Date.UTC(2026, 11, 2, 8, 15, 3, 999))).toBe('2026-12-02T08:15:03Z');
    const comment = page.events.find((e: { action: string }) => e.action === 'comment.created');
    expect(comment.detail.body).toBe('uncertainty of c: is the 0.01 from the certificate?');
  });

  it('exports a UTF-8 CSV with flat columns, details in words and the chain head', async () => {
    const auditor = await s.as('auditor');
    const r = await auditor
      .get(`/api/audit?budget=${id}&format=csv`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    const bytes = r.body as Buffer;
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const lines = bytes.subarray(3).toString('utf8').trim().split('\r\n');
    expect(lines[0]).toBe('event,time,actor_id,actor_name,action,budget_id,budget_title,version,details,hash');
    expect(lines).toHaveLength(4);
    expect(lines.join('\n')).not.toMatch(/[{}]/);
    const submitted = lines.find((l) => l.includes('budget.submitted'))!;
    expect(submitted).toContain(`,Test metrologist,budget.submitted,${id},Chained,1,"from ""draft"" to ""in_review""",`);
    const verify = (await auditor.get('/api/audit/verify').expect(200)).body;
    expect(r.headers['x-audit-chain-head']).toBe(`${verify.head.id}:${verify.head.hash}`);
  });

  it('words the particulars of each kind of event', () => {
    expect(describeDetail({ userId: 7, changes: { role: { from: 'trainee', to: 'metrologist' } }, reason: 'trained' })).toBe('user id 7; changed role "trainee" → "metrologist"; reason "trained"');
    expect(describeDetail({})).toBe('');
  });
});

describe('tamper evidence', () => {
  it('holds for a trail written by the application', async () => {
    const s = await server();
    await budgetWithHistory(s);
    const report = (await (await s.as('auditor')).get('/api/audit/verify').expect(200)).body;
    expect(report).toMatchObject({ intact: true, firstBroken: null });
    expect(report.events).toBeGreaterThan(5);
    expect(report.head.hash).toMatch(/^[0-9a-f]{64}$/);
    // The triggers still refuse changes made through SQL.
    expect(() => s.connection.sqlite.prepare("UPDATE audit_events SET detail = '{}' WHERE id = 1").run()).toThrow(/append-only/);
    expect(() => s.connection.sqlite.prepare('DELETE FROM audit_events WHERE id = 1').run()).toThrow(/append-only/);
  });

  it('names the first altered event', async () => {
    const s = await server();
    const id = await budgetWithHistory(s);
    const row = s.connection.sqlite.prepare("SELECT id FROM audit_events WHERE action = 'comment.created' AND budget_id = ?").get(id) as { id: number };
    byHand(s, `UPDATE audit_events SET detail = '{"commentId":1,"body":"nothing to see"}' WHERE id = ${row.id}`);
    const report = (await (await s.as('admin')).get('/api/audit/verify').expect(200)).body;
    expect(report.intact).toBe(false);
    expect(report.firstBroken.id).toBe(row.id);
    expect(report.firstBroken.problem).toMatch(/does not match its hash/);
  });

  it('names the place of a removed event, also the newest one', async () => {
    const s = await server();
    await budgetWithHistory(s);
    const { n } = s.connection.sqlite.prepare('SELECT max(id) AS n FROM audit_events').get() as { n: number };
    byHand(s, 'DELETE FROM audit_events WHERE id = 3');
    const middle = s.services.audit.verify();
    expect(middle.firstBroken).toEqual({ id: 4, problem: 'event 3 is missing before event 4: it was removed' });

    const t = await server();
    await budgetWithHistory(t);
    const last = (t.connection.sqlite.prepare('SELECT max(id) AS n FROM audit_events').get() as { n: number }).n;
    byHand(t, `DELETE FROM audit_events WHERE id = ${last}`);
    const tail = t.services.audit.verify();
    expect(tail.intact).toBe(false);
    expect(tail.firstBroken!.problem).toMatch(/newest events were removed/);
    expect(n).toBeGreaterThan(3);
  });

  it('detects a re-hashed copy spliced in by comparing with an exported head', async () => {
    const s = await server();
    await budgetWithHistory(s);
    const head = s.services.audit.chainHead()!;
    // Someone rewrites an event and every later hash: the chain holds again, the head does not.
    const other = new Database(s.config.dbFile);
    other.exec('DROP TRIGGER audit_events_no_update');
    other.close();
    const { createHash } = await import('node:crypto');
    const rows = s.connection.sqlite.prepare('SELECT * FROM audit_events ORDER BY id').all() as Record<string, unknown>[];
    let prev = '0'.repeat(64);
    const rewrite = new Database(s.config.dbFile);
    for (const r of rows) {
      const detail = r.id === 2 ? '{"rewritten":true}' : (r.detail as string);
      const hash = createHash('sha256')
        .update(`${prev}\n${JSON.stringify([r.id, r.at, r.actor_id, r.action, r.budget_id, r.version_number, detail])}`)
        .digest('hex');
      rewrite.prepare('UPDATE audit_events SET detail = ?, hash = ? WHERE id = ?').run(detail, hash, r.id);
      prev = hash;
    }
    rewrite.close();
    expect(s.services.audit.verify().intact).toBe(true);
    expect(s.services.audit.chainHead()).not.toEqual(head);
  });
});

describe('events from before the chain', () => {
  it('get their hashes in order when the migration meets them, and the chain goes on', () => {
    const dir = tempDir();
    const file = join(dir, 'old.sqlite');
    // The migrations up to the one that adds the chain.
    const folder = join(dir, 'drizzle');
    cpSync(fileURLToPath(new URL('../../drizzle', import.meta.url)), folder, { recursive: true });
    const journalFile = join(folder, 'meta', '_journal.json');
    const journal = JSON.parse(readFileSync(journalFile, 'utf8')) as { entries: { tag: string }[] };
    journal.entries = journal.entries.slice(
      0,
      journal.entries.findIndex((e) => e.tag.endsWith('audit_chain')),
    );
    writeFileSync(journalFile, JSON.stringify(journal));
    const old = new Database(file);
    migrate(drizzle({ client: old }), { migrationsFolder: folder });
    old.exec(`INSERT INTO users (email, name, role) VALUES ('early@lab.test', 'Early Bird', 'admin')`);
    for (let i = 0; i < 3; i++) old.prepare(`INSERT INTO audit_events (at, actor_id, action, detail) VALUES (?, 1, 'user.created', '{}')`).run(1_700_000_000_000 + i);
    old.close();

    const conn = openDatabase(file);
    try {
      const audit = new AuditService(conn.db);
      const sealed = audit.verify();
      expect(sealed).toMatchObject({ intact: true, events: 3, firstBroken: null });
      inTransaction(conn.db, (tx) => recordAudit(tx, { actorId: 1, action: 'auth.signed_in' }));
      expect(audit.verify()).toMatchObject({ intact: true, events: 4 });
      expect(() => conn.sqlite.prepare("INSERT INTO audit_events (at, action) VALUES (1, 'forged')").run()).toThrow(/chain hash/);
    } finally {
      conn.close();
    }
  });
});
