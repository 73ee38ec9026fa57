import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { readdirSync, rmSync, statSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { tempDir } from './helpers';

const root = join(__dirname, '..', '..');
const builtStart = join(root, 'server', 'dist', 'start.js');

function newestSource(dir: string): number {
  let newest = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    if (e.name === 'dist' || e.name === 'node_modules') continue;
    const path = join(dir, e.name);
    newest = Math.max(newest, e.isDirectory() ? newestSource(path) : statSync(path).mtimeMs);
  }
  return newest;
}

/** Builds server/dist/ (as `npm run build:server` does) when it is missing or older than the server's and the engine's sources. */
function ensureBuiltServer(): void {
  let built = 0;
  try {
    built = statSync(builtStart).mtimeMs;
  } catch {
    // not built yet
  }
  if (built > Math.max(newestSource(join(root, 'server')), newestSource(join(root, 'shared')))) return;
  const r = spawnSync(process.execPath, [join(root, 'server', 'build.mjs')], { cwd: root, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`building the server failed: ${r.stderr}`);
}

/** A port nobody listens on right now. */
async function freePort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
  const { port } = probe.address() as { port: number };
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  return port;
}

const data = tempDir();
let child: ChildProcess | null = null;
afterAll(() => {
  child?.kill('SIGTERM');
  rmSync(data, { recursive: true, force: true });
});

describe('the server built once to JavaScript (npm start)', () => {
  it('starts on plain node, answers /api/health and loads the engine in its built worker threads', { timeout: 120_000 }, async () => {
    ensureBuiltServer();
    const port = await freePort();
    // No NODE_OPTIONS: nothing may bring a TypeScript loader in.
    const { NODE_OPTIONS: _, ...env } = process.env;
    let output = '';
    child = spawn(process.execPath, ['--enable-source-maps', builtStart], {
      cwd: data,
      env: { ...env, PORT: String(port), HOST: '127.0.0.1', DUBITO_DB: join(data, 'dubito.sqlite'), DUBITO_DEMO: '0', DUBITO_CLIENT_BUILD: '0', NODE_ENV: 'test' },
    });
    child.stdout!.on('data', (b: Buffer) => (output += b.toString()));
    child.stderr!.on('data', (b: Buffer) => (output += b.toString()));
    const health = async () => {
      try {
        const res = await fetch(`http://127.0.0.1:${port}/api/health`);
        return { status: res.status, body: await res.json() };
      } catch {
        return null;
      }
    };
    await expect.poll(health, { timeout: 60_000, interval: 200 }).toEqual({ status: 200, body: { ok: true } });
    // The workers run server/dist/task-worker.js and the built engine, not the TypeScript sources.
    await expect.poll(() => output, { timeout: 60_000, interval: 200 }).toContain('compute workers ready');
    expect(output).not.toMatch(/could not start|refusing to start|Error/);
  });
});
