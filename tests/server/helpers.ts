import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Server } from 'node:http';
import request from 'supertest';
import { ROLES, type Role } from '../../shared/policy/policy';
import { createApp, type DubitoApp } from '../../server/app';
import type { AppConfig } from '../../server/config';
import type { SessionUser } from '../../server/http/request-user';

/** Tests send their state-changing requests from this origin, which the test app allows. */
export const ORIGIN = 'http://dubito.test';
export const PASSWORD = 'dubito-demo';

export interface TestServer extends DubitoApp {
  dir: string;
  server: Server;
  url: string;
  users: Record<Role, SessionUser>;
  /** A signed-in client for a role (cached) or a fresh anonymous one. */
  as(role: Role | null): Promise<request.Agent>;
  anonymous(): request.Agent;
  stop(): Promise<void>;
}

export function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'dubito-test-'));
}

export async function startTestServer(overrides: Partial<AppConfig> = {}): Promise<TestServer> {
  const dir = tempDir();
  const handle = await createApp({
    dbFile: join(dir, 'dubito.sqlite'),
    dataDir: dir,
    trialsCap: 5_000,
    computeWorkers: 1,
    allowedOrigins: [ORIGIN],
    publicUrl: 'http://dubito.test',
    signIn: { windowMs: 60_000, perAddress: 10_000, freeFailures: 10_000, firstDelayMs: 1_000, maxDelayMs: 60_000 },
    log: () => {},
    ...overrides,
  });
  const users = {} as Record<Role, SessionUser>;
  for (const role of ROLES) {
    users[role] = await handle.services.accounts.create(null, {
      email: `${role}@lab.test`,
      name: `Test ${role}`,
      role,
      password: PASSWORD,
    });
  }
  const server = handle.app.listen(0, '127.0.0.1');
  await new Promise<void>((r) => server.once('listening', () => r()));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const agents = new Map<Role, request.Agent>();
  const anonymous = () => request.agent(server).set('Origin', ORIGIN);
  return {
    ...handle,
    dir,
    server,
    url,
    users,
    anonymous,
    async as(role) {
      if (!role) return anonymous();
      let a = agents.get(role);
      if (!a) {
        a = anonymous();
        await a.post('/api/auth/login').send({ email: users[role].email, password: PASSWORD }).expect(200);
        agents.set(role, a);
      }
      return a;
    },
    async stop() {
      await new Promise<void>((r) => server.close(() => r()));
      await handle.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A small valid budget: y = a + b·c. */
export function sampleDocument(title = 'Length of a test bar', extra: Record<string, unknown> = {}) {
  return {
    format: 'dubito-budget/1',
    title,
    measurand: { symbol: 'y', unit: 'mm', description: 'length at 20 °C' },
    model: 'y = a + b * c',
    inputs: [
      { symbol: 'a', unit: 'mm', distribution: { kind: 'normal', value: 100, u: 0.002 } },
      { symbol: 'b', unit: 'mm', distribution: { kind: 'rectangular', value: 0.01, halfWidth: 0.001 } },
      { symbol: 'c', distribution: { kind: 'normal', value: 1, u: 0.01 } },
    ],
    monteCarlo: { trials: 2000, seed: 'test' },
    ...extra,
  };
}
