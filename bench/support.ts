import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';

/** The median of the runs of a benchmark. */
export const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/** The word printed beside a figure: its target met or missed. */
export const verdict = (ok: boolean) => (ok ? 'PASS' : 'MISS');

/** A Python that can import numpy ($PYTHON first), or null: the numpy comparisons are then skipped. */
export function findPython(): string | null {
  for (const exe of [process.env.PYTHON, 'python3', '/usr/bin/python3', 'python'].filter(Boolean) as string[]) {
    const probe = spawnSync(exe, ['-c', 'import numpy'], { stdio: 'ignore' });
    if (probe.status === 0) return exe;
  }
  return null;
}

/** A loopback port nobody listens on right now, for a server started in a process of its own (benchmarks and tests). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

/**
 * The built server in a process of its own, as `npm start` runs it, resolved once it
 * listens and its compute workers have loaded the engine (a second or two of CPU).
 */
export async function startBuiltServer(root: string, env: Record<string, string>): Promise<ChildProcess> {
  const { NODE_OPTIONS: _loader, ...inherited } = process.env;
  const child = spawn(process.execPath, ['--enable-source-maps', 'server/dist/start.js'], { cwd: root, env: { ...inherited, ...env }, stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve, reject) => {
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      if (out.includes('listening on') && out.includes('compute workers ready')) resolve();
    });
    child.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
  });
  return child;
}
