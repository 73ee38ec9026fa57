import { describe, expect, it } from 'vitest';
import type { Distribution } from '../../shared/budget/schema';
import { gumTreatment, samplerFor } from '../../shared/distributions/registry';
import { MonteCarloCancelled, MonteCarloNonFiniteValue, runAdaptiveMonteCarlo, runMonteCarlo, type MonteCarloPlan } from '../../shared/montecarlo/run-monte-carlo';
import { correlatedNormalSampler, NotPositiveSemiDefinite } from '../../shared/montecarlo/correlated-normal';
import { UniformGenerator } from '../../shared/random/uniform-generator';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';
import { sampleCorrelation, sampleMoments } from './moments';

/** Y = X₁ + … + X_N as a compiled block. */
function sumPlan(specs: Distribution[]): MonteCarloPlan {
  return {
    samplers: specs.map(samplerFor),
    evaluateBlock(columns, out, offset, n) {
      for (let t = 0; t < n; t++) {
        let y = 0;
        for (let i = 0; i < columns.length; i++) y += columns[i][t];
        out[offset + t] = y;
      }
    },
  };
}

const fourStandardNormals: Distribution[] = Array.from({ length: 4 }, () => ({ kind: 'normal', value: 0, u: 1 }));

describe('runMonteCarlo', () => {
  it('additive model of four N(0, 1): u ≈ 2, 95 % interval ≈ [−3.92, 3.92] (JCGM 101:2008 9.2.2, from memory)', () => {
    const run = runMonteCarlo(sumPlan(fourStandardNormals), { trials: 1_000_000, seed: 'jcgm-9.2.2', coverageProbability: 0.95 });
    expect(run.trials).toBe(1_000_000);
    // SE(ỹ) = 2/√M = 0.002; SE(u) ≈ 2/√(2M) = 0.0014; SE of the 2.5 % quantile ≈ 0.0054 (common practice); loose 5σ bounds.
    expect(Math.abs(run.estimate)).toBeLessThan(0.01);
    expect(Math.abs(run.standardUncertainty - 2)).toBeLessThan(0.01);
    expect(Math.abs(run.interval[0] + 3.92)).toBeLessThan(0.03);
    expect(Math.abs(run.interval[1] - 3.92)).toBeLessThan(0.03);
    expect(run.shortestInterval[1] - run.shortestInterval[0]).toBeLessThanOrEqual(run.interval[1] - run.interval[0]);
    expect(run.histogram.counts.reduce((a, b) => a + b, 0)).toBe(1_000_000);
    expect(run.values).toHaveLength(1_000_000);
  });

  it('sum of five kinds: u² = Σ u²(x_i) (GUM 5.1.2 for a linear model with unit sensitivities)', () => {
    const specs: Distribution[] = [
      { kind: 'normal', value: 1, u: 0.3 },
      { kind: 'rectangular', lower: -1, upper: 1 },
      { kind: 'triangular', value: 2, halfWidth: 0.6 },
      { kind: 'arcsine', value: 0, halfWidth: 0.5 },
      { kind: 'student-t', value: 0, scale: 0.2, dof: 20 },
    ];
    // The t input contributes scale²·ν/(ν − 2) to the variance of the draws (JCGM 101:2008 6.4.9).
    const variance = specs.reduce((s, d) => s + gumTreatment(d).standardUncertainty ** 2, 0) - 0.04 + 0.04 * (20 / 18);
    const run = runMonteCarlo(sumPlan(specs), { trials: 200_000, seed: 'five', coverageProbability: 0.95 });
    expect(Math.abs(run.estimate - 3)).toBeLessThan(5 * Math.sqrt(variance / 200_000));
    expect(Math.abs(run.standardUncertainty - Math.sqrt(variance))).toBeLessThan(0.01 * Math.sqrt(variance));
  });

  it('is reproducible: same seed same numbers, another seed other numbers', () => {
    const options = { trials: 50_000, coverageProbability: 0.95, blockSize: 4096 };
    const a = runMonteCarlo(sumPlan(fourStandardNormals), { ...options, seed: 'one' });
    const b = runMonteCarlo(sumPlan(fourStandardNormals), { ...options, seed: 'one' });
    const c = runMonteCarlo(sumPlan(fourStandardNormals), { ...options, seed: 'two' });
    expect([b.estimate, b.standardUncertainty, b.interval, b.shortestInterval]).toEqual([a.estimate, a.standardUncertainty, a.interval, a.shortestInterval]);
    expect(c.estimate).not.toBe(a.estimate);
  });

  it('reports progress per block and cancels with MonteCarloCancelled', () => {
    const seen: number[] = [];
    runMonteCarlo(sumPlan(fourStandardNormals), {
      trials: 10_000,
      seed: 's',
      coverageProbability: 0.95,
      blockSize: 3000,
      onProgress: (done) => seen.push(done),
    });
    expect(seen).toEqual([3000, 6000, 9000, 10_000]);
    let calls = 0;
    const cancel = () =>
      runMonteCarlo(sumPlan(fourStandardNormals), {
        trials: 10_000,
        seed: 's',
        coverageProbability: 0.95,
        blockSize: 1000,
        shouldStop: () => ++calls > 3,
      });
    expect(cancel).toThrow(MonteCarloCancelled);
    calls = 0;
    try {
      cancel();
    } catch (e) {
      expect((e as MonteCarloCancelled).done).toBe(3000);
    }
  });

  it('stops with a clear error when the model is not finite, counting the trials', () => {
    const plan: MonteCarloPlan = {
      samplers: [samplerFor({ kind: 'normal', value: 0, u: 1 })],
      evaluateBlock(columns, out, offset, n) {
        for (let t = 0; t < n; t++) out[offset + t] = Math.log(columns[0][t]); // NaN for negative draws
      },
    };
    try {
      runMonteCarlo(plan, { trials: 100_000, seed: 'nan', coverageProbability: 0.95, blockSize: 1000 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(MonteCarloNonFiniteValue);
      const err = e as MonteCarloNonFiniteValue;
      expect(err.evaluated).toBe(1000);
      expect(err.count).toBeGreaterThan(400);
      expect(err.count).toBeLessThan(600);
      expect(err.firstTrial).toBeGreaterThanOrEqual(1);
      expect(err.message).toMatch(/not a finite number/);
    }
  });
});

describe('correlated Gaussian inputs (JCGM 101:2008 6.4.8)', () => {
  it('a pair with r = 0.8: sample correlation ≈ 0.8, means and u as given', () => {
    const n = 200_000;
    const columns = [new Float64Array(n), new Float64Array(n)];
    correlatedNormalSampler({
      means: [10, -5],
      standardUncertainties: [0.5, 2],
      correlation: [
        [1, 0.8],
        [0.8, 1],
      ],
    }).fill(new UniformGenerator('pair'), columns, n);
    // SE of r ≈ (1 − r²)/√n (common practice) = 0.0008.
    expect(Math.abs(sampleCorrelation(columns[0], columns[1]) - 0.8)).toBeLessThan(0.005);
    const m0 = sampleMoments(columns[0]);
    const m1 = sampleMoments(columns[1]);
    expect(Math.abs(m0.mean - 10)).toBeLessThan(5 * m0.meanError);
    expect(Math.abs(m1.variance - 4)).toBeLessThan(5 * m1.varianceError);
  });

  it('in the driver: Y = X₁ − X₂ with r = 0.8 and u = 1 each has u(y) = √(2 − 2·0.8) (GUM 5.2.2)', () => {
    const plan: MonteCarloPlan = {
      samplers: [null, samplerFor({ kind: 'constant', value: 0 }), null],
      correlated: {
        indices: [0, 2],
        means: [1, 1],
        standardUncertainties: [1, 1],
        correlation: [
          [1, 0.8],
          [0.8, 1],
        ],
      },
      evaluateBlock(columns, out, offset, n) {
        for (let t = 0; t < n; t++) out[offset + t] = columns[0][t] + columns[1][t] - columns[2][t];
      },
    };
    const run = runMonteCarlo(plan, { trials: 200_000, seed: 'diff', coverageProbability: 0.95 });
    expect(Math.abs(run.standardUncertainty - Math.sqrt(0.4))).toBeLessThan(0.01);
  });

  it('refuses a correlation matrix that is not positive semi-definite', () => {
    expect(() =>
      correlatedNormalSampler({
        means: [0, 0, 0],
        standardUncertainties: [1, 1, 1],
        correlation: [
          [1, 0.9, 0.9],
          [0.9, 1, -0.9],
          [0.9, -0.9, 1],
        ],
      }),
    ).toThrow(NotPositiveSemiDefinite);
  });
});

describe('runAdaptiveMonteCarlo (JCGM 101:2008 7.9.4)', () => {
  it('stabilizes the four-normal sum at n_dig = 2 in whole sequences of M = 10⁴', () => {
    const run = runAdaptiveMonteCarlo(sumPlan(fourStandardNormals), {
      seed: 'adaptive',
      coverageProbability: 0.95,
      significantDigits: 2,
      maxTrials: 2_000_000,
    });
    const a = run.adaptive!;
    // p = 0.95: ⌈100/(1 − p)⌉ = 2000 < 10⁴, so M = 10⁴ (7.9.4 a).
    expect(a.sequenceLength).toBe(10_000);
    expect(a.stabilized).toBe(true);
    expect(a.sequences).toBeGreaterThanOrEqual(2);
    expect(run.trials).toBe(a.sequences * 10_000);
    expect(a.tolerance).toBeCloseTo(0.05, 12); // u ≈ 2.0 → δ = 0.05
    for (const s of Object.values(a.spread)) expect(2 * s).toBeLessThanOrEqual(a.tolerance);
    expect(Math.abs(run.standardUncertainty - 2)).toBeLessThan(0.05);
    const again = runAdaptiveMonteCarlo(sumPlan(fourStandardNormals), {
      seed: 'adaptive',
      coverageProbability: 0.95,
      significantDigits: 2,
      maxTrials: 2_000_000,
    });
    expect(again.interval).toEqual(run.interval);
  });

  it('M follows ⌈100/(1 − p)⌉ for p = 0.999 and stops at maxTrials, saying so', () => {
    const run = runAdaptiveMonteCarlo(sumPlan(fourStandardNormals), {
      seed: 'cap',
      coverageProbability: 0.999,
      significantDigits: 4,
      maxTrials: 350_000,
    });
    expect(run.adaptive!.sequenceLength).toBe(100_000);
    expect(run.adaptive!.sequences).toBe(3);
    expect(run.trials).toBe(300_000);
    expect(run.adaptive!.stabilized).toBe(false);
  });
});

describe('numerical uncertainty of the coverage interval endpoints (JCGM 101:2008 7.9, 8)', () => {
  it('four N(0, 1) at 10⁶ trials: u(y_low) ≈ √(α(1 − α)/M)/g(y_low) = 0.000156/0.02922 = 0.00534 (α = 0.025, g = φ(1.96)/2)', () => {
    const run = runMonteCarlo(sumPlan(fourStandardNormals), { trials: 1_000_000, seed: 'jcgm-9.2.2', coverageProbability: 0.95 });
    // the order-statistic estimate uses about 2√(Mα) = 312 ranks: its own relative spread is a few per cent
    for (const u of run.endpointUncertainty) expect(Math.abs(u / 0.005342 - 1)).toBeLessThan(0.1);
  });

  it('agrees with the spread of y_low over 30 seeds at 5·10⁴ trials (closed form 0.0239)', () => {
    const lows: number[] = [];
    const estimates: number[] = [];
    for (let i = 0; i < 30; i++) {
      const run = runMonteCarlo(sumPlan(fourStandardNormals), { trials: 50_000, seed: `spread-${i}`, coverageProbability: 0.95 });
      lows.push(run.interval[0]);
      estimates.push(run.endpointUncertainty[0]);
    }
    const mean = lows.reduce((a, b) => a + b, 0) / lows.length;
    const sd = Math.sqrt(lows.reduce((a, x) => a + (x - mean) ** 2, 0) / (lows.length - 1));
    const estimated = estimates.reduce((a, b) => a + b, 0) / estimates.length;
    // √(0.025·0.975/5e4)/0.02922 = 0.0239; a standard deviation from 30 values is good to about ±13 % (common practice: 1/√(2(n − 1)))
    expect(Math.abs(estimated / 0.0239 - 1)).toBeLessThan(0.1);
    expect(Math.abs(sd / estimated - 1)).toBeLessThan(0.4);
  });
});

describe('adaptive runs report their stability in the result (JCGM 101:2008 7.9.4)', () => {
  const r = computeBudget(budget('Y = X1 + X2 + X3 + X4', { X1: N(0, 1), X2: N(0, 1), X3: N(0, 1), X4: N(0, 1) }, { monteCarlo: { trials: 'adaptive', seed: 'adaptive' } }));

  it('h, M, the standard deviations of the sequence averages and δ; stable when every 2s ≤ δ', () => {
    const st = r.monteCarlo!.stability!;
    expect(st.sequenceLength).toBe(10_000); // max(⌈100/0.05⌉, 10⁴) (7.9.4 a)
    expect(st.sequences).toBeGreaterThanOrEqual(2);
    expect(r.monteCarlo!.trials).toBe(st.sequences * st.sequenceLength);
    expect(st.tolerance).toBeCloseTo(0.05, 12); // u ≈ 2.0 → δ = 0.05
    expect(st.stabilized).toBe(true);
    for (const s of Object.values(st.spread)) expect(2 * s).toBeLessThanOrEqual(st.tolerance);
  });

  it("the verdict takes the endpoints' numerical uncertainty from all h·M values: √(α(1 − α)/(hM))/g, g = φ(1.96)/2 (not the rough spread of h sequences)", () => {
    const hM = r.monteCarlo!.trials;
    const expected = Math.sqrt((0.025 * 0.975) / hM) / 0.02922;
    for (const u of r.validation!.endpointUncertainty!) expect(Math.abs(u / expected - 1)).toBeLessThan(0.35);
  });

  it('a fixed run has no stability', () => {
    const fixed = computeBudget(budget('Y = a', { a: N(0, 1) }, { monteCarlo: { trials: 10_000, seed: 'f' } }));
    expect(fixed.monteCarlo!.stability).toBeUndefined();
    expect(fixed.monteCarlo!.adaptive).toBe(false);
  });
});
