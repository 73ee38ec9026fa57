import { describe, expect, it } from 'vitest';
import { ComputePool, DEFAULT_ENGINE_MODULE } from '../../server/budgets/compute-pool';
import type { BudgetDocument } from '../../shared/budget/schema';

const pool = (engineModule: string) => new ComputePool({ size: 1, trialsCap: 2_000, timeoutMs: 60_000, engineModule, log: () => {} });

describe('ComputePool.warm', () => {
  it('settles true once the workers have loaded the engine, and they then compute', async () => {
    const p = pool(DEFAULT_ENGINE_MODULE);
    try {
      expect(await p.warm()).toBe(true);
      const doc = {
        format: 'dubito-budget/1',
        title: 'Sum',
        measurand: { symbol: 'y', unit: '1' },
        model: 'y = a + b',
        inputs: [
          { symbol: 'a', unit: '1', distribution: { kind: 'normal', value: 1, u: 0.1 } },
          { symbol: 'b', unit: '1', distribution: { kind: 'normal', value: 2, u: 0.1 } },
        ],
        monteCarlo: false,
      } as unknown as BudgetDocument;
      // u_c = √(0.1² + 0.1²) for a sum of two independent inputs (JCGM 100:2008 5.1.2).
      expect((await p.compute(doc)).gum.standardUncertainty).toBeCloseTo(Math.SQRT2 * 0.1, 12);
    } finally {
      await p.close();
    }
  }, 60_000);

  it('settles false when a worker cannot load the engine', async () => {
    const p = pool(new URL('./no-such-engine.ts', import.meta.url).href);
    try {
      expect(await p.warm()).toBe(false);
    } finally {
      await p.close();
    }
  }, 60_000);
});
