import { describe, expect, it } from 'vitest';
import { computeBudget } from '../../shared/compute/compute-budget';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseBudgetFile } from '../../shared/budget/budget-file';

/*
 * JCGM 101:2008 9.3, calibration of a 100 g weight against a reference.
 * Check values from JCGM 101:2008 Table 10 and 9.3.2 (from memory):
 * GUF δm = 1.2340 mg, u = 0.0539 mg; GUF with higher-order terms u = 0.0750 mg;
 * MCM (10⁶ trials) u = 0.0754 mg, probabilistically symmetric 95 % interval
 * [1.0844, 1.3835] mg; the GUF is not validated at n_dig = 2.
 */
// The budget of the example, shared with the benchmark.
const massCalibration = parseBudgetFile(readFileSync(join(__dirname, '..', 'reference-budgets', 'jcgm101-9.3-mass-calibration.json'), 'utf8'));

describe('JCGM 101:2008 9.3 mass calibration', () => {
  const result = computeBudget(massCalibration);

  it('GUF: δm = 1.2340 mg, u = 0.0539 mg, second order 0.0750 mg (Table 10)', () => {
    expect(result.gum.estimate).toBeCloseTo(1.234, 4);
    expect(result.gum.standardUncertainty).toBeCloseTo(0.0539, 4);
    expect(result.gum.standardUncertaintySecondOrder).toBeCloseTo(0.075, 4);
    expect(result.warnings.some((w) => w.code === 'second-order-significant' && w.message.includes('Second-order'))).toBe(true);
  });

  it('MCM at 10⁶ trials: u ≈ 0.0754 mg, symmetric 95 % interval ≈ [1.0844, 1.3835] mg (Table 10)', () => {
    const mc = result.monteCarlo!;
    expect(mc.trials).toBe(1_000_000);
    expect(mc.estimate).toBeCloseTo(1.234, 3);
    expect(mc.standardUncertainty).toBeGreaterThan(0.075);
    expect(mc.standardUncertainty).toBeLessThan(0.076);
    expect(Math.abs(mc.interval[0] - 1.0844)).toBeLessThan(0.001);
    expect(Math.abs(mc.interval[1] - 1.3835)).toBeLessThan(0.001);
    // the shortest interval is no longer than the symmetric one (JCGM 101:2008 7.7.2)
    expect(mc.shortestInterval[1] - mc.shortestInterval[0]).toBeLessThanOrEqual(mc.interval[1] - mc.interval[0]);
  });

  it('does not validate the GUF at n_dig = 2: δ = 0.0005 mg, d ≈ 0.044 mg (9.3.2.5)', () => {
    const v = result.validation!;
    expect(v.tolerance).toBeCloseTo(0.0005, 10);
    expect(v.dLow).toBeGreaterThan(0.04);
    expect(v.dHigh).toBeGreaterThan(0.04);
    expect(v.passed).toBe(false);
  });

  it('is reproducible: the same seed gives the same numbers', () => {
    const again = computeBudget(massCalibration, { trials: 20000 });
    const twice = computeBudget(massCalibration, { trials: 20000 });
    expect(again.monteCarlo).toEqual(twice.monteCarlo);
    const other = computeBudget(massCalibration, { trials: 20000, seed: 'another seed' });
    expect(other.monteCarlo!.estimate).not.toBe(again.monteCarlo!.estimate);
  });
});
