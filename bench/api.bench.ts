/*
 * API benchmark on loopback (not a test): reads of GET /api/budgets/:id and
 * PUT saves, printing requests/s and latencies, and the targets with PASS/MISS
 * (never an error exit for a MISS). Reads are measured twice: as many as 50
 * connections get through when each sends its next request on the last answer
 * (the capacity, with autocannon), and at a constant 1 000 requests a second
 * over at most 50 connections, each latency counted from the moment its
 * request was due (bench/constant-rate.ts): the target "≥ 1 000 reads/s at
 * p99 < 50 ms" is judged on the first for the rate, and p99 on both.
 * The server runs in its own process, as `npm start` runs it (server/dist/start.js,
 * built by `npm run build:server` first), on a fresh
 * database in a temporary folder, so the load generator does not share its
 * event loop. Reads are measured in several rounds and the median round is
 * judged, because autocannon and the server share this machine's two cores.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
// @ts-expect-error autocannon ships no type declarations
import autocannon from 'autocannon';
import { createApp } from '../server/app';
import { computeBudget } from '../shared/compute/compute-budget';
import type { BudgetDocument } from '../shared/budget/schema';
import { constantRate, type ConstantRateResult } from './constant-rate';
import { freePort, median, startBuiltServer, verdict } from './support';

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
const rounds = Math.max(1, Number(process.env.BENCH_ROUNDS ?? 3));
const connections = 50;
const targetRate = 1000;
// Saves: as many at once as the server admits (DUBITO_COMPUTE_JOBS_PER_USER 2 each, within DUBITO_COMPUTE_QUEUE 8),
// so the figure is the rate of accepted saves, not of refusals.
const saveUsers = 4;
const savesPerUser = 2;
const saveConnections = saveUsers * savesPerUser;

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

// Data first, in this process; then the server in its own.
const setup = await createApp({ dbFile, dataDir: dir, log: () => {} });
const user = await setup.services.accounts.create(null, { email: 'bench@lab.test', name: 'Bench', role: 'metrologist', password: PASSWORD });
const { id } = await setup.services.budgets.create(user, { document: document('Bench budget'), note: '' });
const saveIds: number[] = [];
const ownerOf = new Map<number, string>();
for (let u = 0; u < saveUsers; u++) {
  const email = `saver${u}@lab.test`;
  const saver = await setup.services.accounts.create(null, { email, name: `Saver ${u}`, role: 'metrologist', password: PASSWORD });
  for (let i = 0; i < savesPerUser; i++) {
    const b = (await setup.services.budgets.create(saver, { document: document(`Save ${u}.${i}`), note: '' })).id;
    saveIds.push(b);
    ownerOf.set(b, email);
  }
}
const trialsCap = setup.config.trialsCap;
const workers = setup.config.computeWorkers;
await setup.close();

/** The engine alone on the saved document, in this process before the server starts: saves/s it allows. */
function engineRate(): { ms: number; perSecond: number } {
  const doc = document('Engine alone') as BudgetDocument;
  for (let i = 0; i < 5; i++) computeBudget(doc, { trialsCap });
  const times: number[] = [];
  for (let i = 0; i < 21; i++) {
    const t0 = performance.now();
    computeBudget(doc, { trialsCap });
    times.push(performance.now() - t0);
  }
  const ms = times.sort((a, b) => a - b)[10];
  return { ms, perSecond: (workers * 1000) / ms };
}
const engine = engineRate();

const port = await freePort();
const base = `http://127.0.0.1:${port}`;
// The built server, as in production; the client build is not needed for the API. Measure the server as it
// runs for hours, not as it starts: startBuiltServer waits until its compute workers have loaded the engine.
const child = await startBuiltServer(ROOT, { DUBITO_DB: dbFile, PORT: String(port), HOST: '127.0.0.1', DUBITO_DEMO: '0', DUBITO_CLIENT_BUILD: '0', DUBITO_ALLOWED_ORIGINS: ORIGIN });

async function signIn(email: string): Promise<string> {
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: ORIGIN },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  return login.headers.get('set-cookie')!.split(';')[0];
}
const cookie = await signIn('bench@lab.test');
const cookies = new Map<string, string>();
for (const email of new Set(ownerOf.values())) cookies.set(email, await signIn(email));

const rate = (r: Result) => r['2xx'] / r.duration;

function report(name: string, r: Result): void {
  const codes = Object.fromEntries(Object.entries(r.statusCodeStats ?? {}).map(([k, v]) => [k, v.count]));
  console.log(
    `${name.padEnd(28)} ${rate(r).toFixed(0).padStart(6)} req/s   p50 ${String(r.latency.p50).padStart(4)} ms   p99 ${String(r.latency.p99).padStart(5)} ms` +
      `   (${r['2xx']} 2xx, ${r.non2xx} other ${JSON.stringify(codes)}, ${r.errors} errors, ${r.timeouts} timeouts)`,
  );
}

console.log(
  `Dubito API benchmark — Node ${process.version}, loopback, ${connections} connections, ${rounds} × ${seconds} s of reads after a 3 s warm-up; ` +
    `${saveConnections} connections of ${saveUsers} users for ${seconds} s of saves\n`,
);
try {
  // Warm-up, then the measured run.
  await autocannon({ url: `${base}/api/budgets/${id}`, connections, duration: 3, headers: { cookie } });
  const reads: Result[] = [];
  for (let i = 0; i < rounds; i++) {
    reads.push((await autocannon({ url: `${base}/api/budgets/${id}`, connections, duration: seconds, headers: { cookie } })) as Result);
    report(`GET /api/budgets/:id  #${i + 1}`, reads[i]);
  }
  const steady: ConstantRateResult[] = [];
  for (let i = 0; i < rounds; i++) {
    steady.push(await constantRate({ url: `${base}/api/budgets/${id}`, rate: targetRate, seconds, connections, headers: { cookie } }));
    const r = steady[i];
    console.log(
      `${`GET at ${targetRate}/s  #${i + 1}`.padEnd(28)} ${r.achieved.toFixed(0).padStart(6)} req/s   p50 ${r.p50.toFixed(1).padStart(4)} ms   p99 ${r.p99.toFixed(1).padStart(5)} ms` +
        `   max ${r.max.toFixed(0)} ms   (${r.ok} 2xx, ${r.other} other, ${r.errors} errors)`,
    );
  }

  // Saves: a request always takes a budget nobody is saving and its latest version, so none is refused as stale.
  const baseVersion = new Map<number, number>(saveIds.map((b) => [b, 1]));
  const idle = [...saveIds];
  const saves = (await autocannon({
    url: base,
    connections: saveConnections,
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
            headers: { cookie: cookies.get(ownerOf.get(b)!)!, origin: ORIGIN, 'content-type': 'application/json' },
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

  const readRate = median(reads.map(rate));
  const capacityP99 = median(reads.map((r) => r.latency.p99));
  const steadyP99 = median(steady.map((r) => r.p99));
  const steadyAnswered = steady.every((r) => r.other === 0 && r.errors === 0);
  const share = rate(saves) / engine.perSecond;
  console.log(
    `\nThe engine alone: ${engine.ms.toFixed(1)} ms a save (median of 21, ${trialsCap.toLocaleString('en')} trials at most) on ${workers} worker thread(s): ${engine.perSecond.toFixed(0)} saves/s`,
  );
  console.log('\nTargets (median of the read rounds)');
  console.log('| target | measured | verdict |');
  console.log('| --- | --- | --- |');
  console.log(`| reads ≥ 1 000 req/s | ${readRate.toFixed(0)} req/s | ${verdict(readRate >= 1000)} |`);
  console.log(`| reads p99 < 50 ms at ${targetRate} req/s (all answered 2xx) | ${steadyP99.toFixed(1)} ms | ${verdict(steadyP99 < 50 && steadyAnswered)} |`);
  console.log(`| reads p99 < 50 ms with ${connections} connections at capacity | ${capacityP99} ms | ${verdict(capacityP99 < 50)} |`);
  // The bench's own criterion: the worker shares two cores with the server's main thread and autocannon, so a
  // save rate near the engine's own rate (three quarters or more) leaves the database with no visible share.
  console.log(`| saves limited by the engine (≥ 0.8 × its own rate) | ${rate(saves).toFixed(0)} / ${engine.perSecond.toFixed(0)} saves/s = ${share.toFixed(2)} | ${verdict(share >= 0.8)} |`);
} finally {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
  rmSync(dir, { recursive: true, force: true });
}
