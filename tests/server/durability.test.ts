import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { documentSha256 } from '../../server/budgets/canonical';
import { freePort } from '../../bench/support';
import { ORIGIN, PASSWORD, sampleDocument, tempDir } from './helpers';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const dir = tempDir();
const dbFile = join(dir, 'durable.sqlite');
const children: ChildProcess[] = [];

afterAll(() => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill('SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

/** Starts `server/main.ts` in its own process through tsx and waits until it listens. */
async function startServer(port: number): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      DUBITO_DB: dbFile,
      PORT: String(port),
      HOST: '127.0.0.1',
      DUBITO_DEMO: '0',
      DUBITO_TRIALS_CAP: '5000',
      DUBITO_COMPUTE_WORKERS: '1',
      // three writers of one user save at once
      DUBITO_COMPUTE_JOBS_PER_USER: '3',
      DUBITO_ALLOWED_ORIGINS: ORIGIN,
      SMTP_URL: '',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let output = '';
  await new Promise<void>((resolve, reject) => {
    const onData = (d: Buffer) => {
      output += d.toString();
      if (output.includes('listening on')) resolve();
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    child.once('exit', (code) => reject(new Error(`server exited (${code}) before listening:\n${output}`)));
  });
  return child;
}

async function signIn(base: string): Promise<string> {
  const r = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: ORIGIN },
    body: JSON.stringify({ email: 'writer@lab.test', password: PASSWORD }),
  });
  expect(r.status).toBe(200);
  return r.headers.get('set-cookie')!.split(';')[0];
}

function call(base: string, cookie: string, method: string, path: string, body?: unknown) {
  return fetch(`${base}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: ORIGIN, cookie },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

describe('durability', () => {
  it('keeps every acknowledged version across a SIGKILL', async () => {
    // An account to write with, created before the server process starts.
    const setup = await createApp({ dbFile, dataDir: dir, log: () => {} });
    await setup.services.accounts.create(null, { email: 'writer@lab.test', name: 'Writer', role: 'metrologist', password: PASSWORD });
    await setup.close();

    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    const first = await startServer(port);
    const cookie = await signIn(base);
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) {
      const r = await call(base, cookie, 'POST', '/api/budgets', { document: sampleDocument(`Burst ${i} v1`), note: '' });
      expect(r.status).toBe(201);
      ids.push(((await r.json()) as { id: number }).id);
    }

    // Three writers save in a loop; the process is killed while saves are in flight.
    const acknowledged: { id: number; version: number; title: string }[] = ids.map((id, i) => ({ id, version: 1, title: `Burst ${i} v1` }));
    const target = 30;
    let killed = false;
    const exited = new Promise<void>((r) => first.once('exit', () => r()));
    const writer = async (id: number, i: number) => {
      let base_ = 1;
      while (!killed) {
        const title = `Burst ${i} v${base_ + 1}`;
        let res: Response;
        try {
          res = await call(base, cookie, 'PUT', `/api/budgets/${id}`, { baseVersion: base_, document: sampleDocument(title), note: title });
        } catch {
          return; // connection cut by the kill
        }
        if (res.status !== 200) return;
        let body: { version: number };
        try {
          body = (await res.json()) as { version: number };
        } catch {
          return; // the kill cut the answer: the client never learnt the version, so it was not acknowledged
        }
        acknowledged.push({ id, version: body.version, title });
        base_ = body.version;
        if (acknowledged.length >= target && !killed) {
          killed = true;
          first.kill('SIGKILL');
        }
      }
    };
    await Promise.all(ids.map((id, i) => writer(id, i)));
    await exited;
    expect(first.signalCode).toBe('SIGKILL');
    expect(acknowledged.length).toBeGreaterThanOrEqual(target);

    const second = await startServer(port);
    const cookie2 = await signIn(base);
    for (const a of acknowledged) {
      const r = await call(base, cookie2, 'GET', `/api/budgets/${a.id}/versions/${a.version}`);
      expect(r.status, `budget ${a.id} version ${a.version}`).toBe(200);
      const v = (await r.json()) as { document: { title: string }; result: { gum: { estimate: number } }; documentSha256: string };
      expect(v.document.title).toBe(a.title);
      expect(v.result.gum.estimate).toBeGreaterThan(0);
      expect(v.documentSha256).toBe(documentSha256(v.document));
    }
    for (const id of ids) {
      const b = (await (await call(base, cookie2, 'GET', `/api/budgets/${id}`)).json()) as { currentVersion: number };
      const versions = (await (await call(base, cookie2, 'GET', `/api/budgets/${id}/versions`)).json()) as { number: number }[];
      expect(versions.map((v) => v.number)).toEqual(Array.from({ length: b.currentVersion }, (_, k) => k + 1));
      const acked = acknowledged.filter((a) => a.id === id).map((a) => a.version);
      expect(b.currentVersion).toBeGreaterThanOrEqual(Math.max(...acked));
    }
    const stopped = new Promise<void>((r) => second.once('exit', () => r()));
    second.kill('SIGTERM');
    await stopped;

    const db = new Database(dbFile, { readonly: true });
    try {
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
      const orphan = db.prepare("SELECT count(*) AS n FROM budget_versions WHERE result IS NULL OR result = ''").get() as { n: number };
      expect(orphan.n).toBe(0);
    } finally {
      db.close();
    }
  });
});
