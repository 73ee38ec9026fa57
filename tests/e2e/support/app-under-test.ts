import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../..', import.meta.url));
const artifacts = join(root, 'tests', '.artifacts');

/**
 * Builds the client into a temporary folder (never over the developer's dist/;
 * not under tests/.artifacts either: static serving refuses paths with a dot folder).
 */
async function buildClient(): Promise<string> {
  const outDir = join(tmpdir(), `dubito-e2e-client-${process.pid}`);
  const { build } = await import('vite');
  const nodeEnv = process.env.NODE_ENV;
  await build({ root, logLevel: 'error', build: { outDir, emptyOutDir: true } });
  process.env.NODE_ENV = nodeEnv; // vite's build sets it to production, which would make cookies secure-only
  return outDir;
}

export interface AppUnderTest {
  baseUrl: string;
  stop(): Promise<void>;
}

/**
 * The whole product as a lab runs it: the built client and the API on a
 * loopback port, with a fresh SQLite database seeded with the demo lab.
 */
export async function startApp(): Promise<AppUnderTest> {
  const staticDir = await buildClient();
  const dir = mkdtempSync(join(tmpdir(), 'dubito-e2e-'));
  process.env.PORT = '0';
  process.env.HOST = '127.0.0.1';
  process.env.DUBITO_DEMO = '1';
  process.env.DUBITO_COOKIE_SECURE = '0'; // plain http on loopback
  const { serve } = await import('../../../server/main');
  const { handle, server } = await serve({ staticDir, dbFile: join(dir, 'dubito.sqlite') });
  if (!server.listening) await new Promise((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    async stop() {
      await new Promise((resolve) => server.close(resolve));
      await handle.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export function screenshotPath(journey: string, name: string): string {
  const dir = join(artifacts, 'screenshots');
  mkdirSync(dir, { recursive: true });
  return join(dir, `${journey}-${name}.png`);
}
