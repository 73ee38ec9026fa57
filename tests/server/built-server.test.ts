import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ensureBuilt } from '../support/built-once';
import { freePort } from '../../bench/support';
import { tempDir } from './helpers';

const data = tempDir();
let child: ChildProcess | null = null;
afterAll(() => {
  child?.kill('SIGTERM');
  rmSync(data, { recursive: true, force: true });
});

describe('the server built once to JavaScript (npm start)', () => {
  it('starts on plain node, answers /api/health and loads the engine in its built worker threads', { timeout: 120_000 }, async () => {
    const builtStart = ensureBuilt('server', 'start.js');
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
