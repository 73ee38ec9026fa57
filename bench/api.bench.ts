/*
 * API benchmark on loopback (not a test): reads of GET /api/budgets/:id and
 * PUT saves, 50 connections each, printing requests/s and p99 latency.
 * The server runs in its own process (server/main.ts through tsx) on a fresh
 * database in a temporary folder, so the load generator does not share its
 * event loop.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
// @ts-expect-error autocannon ships no type declarations
import autocannon from 'autocannon';
import { createApp } from '../server/app';

interface Result {
  duration: number;
  '2xx': number;
  non2xx: number;
  errors: number;
  timeouts: number;
  latency: { p50: number; p99: number };
  statusCodeStats?: Record<string, { count: number }>;
}
type Context = Record<string, number>;

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const ORIGIN = 'http://bench.local';
const PASSWORD = 'bench password';
const dir = mkdtempSync(join(tmpdir(), 'dubito-bench-'));
const dbFile = join(dir, 'bench.sqlite');
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = 50;

function document(title: string) {
  return {
    format: 'dubito-budget/1',
    title,
    measurand: { symbol: 'l', unit: 'mm' },
    model: 'l = l_s + d + l_s * alpha * dtheta',
    inputs: [
      { symbol: 'l_s', unit: 'mm', distribution: { kind: 'normal', value: 50, U: 0.00004, k: 2 } },
      { symbol: 'd', unit: 'mm', distribution: { kind: 'observations', values: [0.000215, 0.000218, 0.000212, 0.000216] } },
      { symbol: 'alpha', unit: '1/degC', distribution: { kind: 'rectangular', value: 11.5e-6, halfWidth: 1e-6 } },
      { symbol: 'dtheta', unit: 'degC', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.05 } },
    ],
    monteCarlo: { trials: 1_000_000, seed: 'bench' },
  };
}

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

// Data first, in this process; then the server in its own.
const setup = await createApp({ dbFile, dataDir: dir, log: () => {} });
const user = await setup.services.accounts.create(null, { email: 'bench@lab.test', name: 'Bench', role: 'metrologist', password: PASSWORD });
const { id } = await setup.services.budgets.create(user, { document: document('Bench budget'), note: '' });
const saveIds: number[] = [];
for (let i = 0; i < connections; i++) saveIds.push((await setup.services.budgets.create(user, { document: document(`Save ${i}`), note: '' })).id);
const trialsCap = setup.config.trialsCap;
const workers = setup.config.computeWorkers;
await setup.close();

const port = await freePort();
const base = `http://127.0.0.1:${port}`;
const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
  cwd: ROOT,
  env: { ...process.env, DUBITO_DB: dbFile, PORT: String(port), HOST: '127.0.0.1', DUBITO_DEMO: '0', DUBITO_ALLOWED_ORIGINS: ORIGIN },
  stdio: ['ignore', 'pipe', 'inherit'],
});
await new Promise<void>((resolve, reject) => {
  child.stdout!.on('data', (d: Buffer) => d.toString().includes('listening on') && resolve());
  child.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
});

const login = await fetch(`${base}/api/auth/login`, {
  method: 'POST',
  headers: { 'content-type': 'application/json', origin: ORIGIN },
  body: JSON.stringify({ email: 'bench@lab.test', password: PASSWORD }),
});
const cookie = login.headers.get('set-cookie')!.split(';')[0];

function report(name: string, r: Result): void {
  const ok = r['2xx'];
  const codes = Object.fromEntries(Object.entries(r.statusCodeStats ?? {}).map(([k, v]) => [k, v.count]));
  console.log(
    `${name.padEnd(24)} ${(ok / r.duration).toFixed(0).padStart(6)} req/s   p50 ${String(r.latency.p50).padStart(4)} ms   p99 ${String(r.latency.p99).padStart(5)} ms` +
      `   (${ok} 2xx, ${r.non2xx} other ${JSON.stringify(codes)}, ${r.errors} errors, ${r.timeouts} timeouts)`,
  );
}

try {
  // Warm-up, then the measured run.
  await autocannon({ url: `${base}/api/budgets/${id}`, connections, duration: 1, headers: { cookie } });
  const reads = (await autocannon({ url: `${base}/api/budgets/${id}`, connections, duration: seconds, headers: { cookie } })) as Result;
  report('GET /api/budgets/:id', reads);

  // Saves: a request always takes a budget nobody is saving and its latest version, so none is refused as stale.
  const baseVersion = new Map<number, number>(saveIds.map((b) => [b, 1]));
  const idle = [...saveIds];
  const saves = (await autocannon({
    url: base,
    connections,
    duration: seconds,
    timeout: 60,
    requests: [
      {
        setupRequest: (req: Record<string, unknown>, context: Context) => {
          const b = idle.shift() ?? saveIds[0];
          context.budget = b;
          return {
            ...req,
            method: 'PUT',
            path: `/api/budgets/${b}`,
            headers: { cookie, origin: ORIGIN, 'content-type': 'application/json' },
            body: JSON.stringify({ baseVersion: baseVersion.get(b), document: document(`Save ${b}`), note: 'bench' }),
          };
        },
        onResponse: (status: number, body: string, context: Context) => {
          if (status === 200) baseVersion.set(context.budget, (JSON.parse(body) as { version: number }).version);
          idle.push(context.budget);
        },
      },
    ],
  })) as Result;
  report('PUT /api/budgets/:id', saves);
  console.log(`saves run the engine (${trialsCap.toLocaleString('en')} trials at most) on ${workers} worker thread(s); the rate is the engine's`);
} finally {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
  rmSync(dir, { recursive: true, force: true });
}
