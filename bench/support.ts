import { spawnSync } from 'node:child_process';

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
