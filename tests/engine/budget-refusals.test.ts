import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { parseBudgetFile, serializeBudget, validateBudget } from '../../shared/budget/budget-file';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';

const base = () => JSON.parse(JSON.stringify(budget('Y = a + b', { a: N(1, 0.1), b: N(2, 0.1) })));

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the test bends the raw JSON into shapes the schema refuses
function refusalOf(mutate: (doc: any) => void, compute = false): BudgetError {
  const doc = base();
  mutate(doc);
  try {
    const valid = validateBudget(doc);
    if (compute) computeBudget(valid, { trials: 1000 });
  } catch (e) {
    if (e instanceof BudgetError) return e;
    throw e;
  }
  throw new Error('accepted');
}

// The rules every budget must satisfy (budget file v1): each refusal names its field.
describe('budget refusals', () => {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- the test bends the raw JSON into shapes the schema refuses
  const fieldCases: [string, (d: any) => void, string, string][] = [
    ['u ≤ 0', (d) => (d.inputs[0].distribution.u = 0), 'inputs[0].distribution.u', 'greater than 0'],
    ['u and U together', (d) => Object.assign(d.inputs[0].distribution, { U: 0.2, k: 2 }), 'inputs[0].distribution.u', 'not both'],
    ['U without k', (d) => (d.inputs[0].distribution = { kind: 'normal', value: 1, U: 0.2 }), 'inputs[0].distribution.k', 'coverage factor'],
    ['k ≤ 0', (d) => (d.inputs[0].distribution = { kind: 'normal', value: 1, U: 0.2, k: -2 }), 'inputs[0].distribution.k', 'greater than 0'],
    ['lower ≥ upper', (d) => (d.inputs[1].distribution = { kind: 'rectangular', lower: 2, upper: 1 }), 'inputs[1].distribution.upper', 'greater than lower'],
    ['halfWidth ≤ 0', (d) => (d.inputs[1].distribution = { kind: 'triangular', value: 2, halfWidth: 0 }), 'inputs[1].distribution.halfWidth', 'greater than 0'],
    ['beta > 1', (d) => (d.inputs[1].distribution = { kind: 'trapezoidal', value: 2, halfWidth: 1, beta: 1.5 }), 'inputs[1].distribution.beta', 'between 0 and 1'],
    [
      'd > a',
      (d) => (d.inputs[1].distribution = { kind: 'curvilinear-trapezoidal', value: 2, halfWidth: 1, halfWidthUncertainty: 2 }),
      'inputs[1].distribution.halfWidthUncertainty',
      'must not exceed',
    ],
    ['scale ≤ 0', (d) => (d.inputs[1].distribution = { kind: 'student-t', value: 2, scale: -1, dof: 3 }), 'inputs[1].distribution.scale', 'greater than 0'],
    ['dof ≤ 0', (d) => (d.inputs[0].distribution.dof = 0), 'inputs[0].distribution.dof', 'greater than 0'],
    // JCGM 100:2008 G.4.2: ν = ½·(Δu/u)⁻²; 10 typed for 10 % gave ν = 0.005 and k = ∞
    ['relativeUncertaintyOfU typed as a percentage', (d) => (d.inputs[0].distribution.relativeUncertaintyOfU = 10), 'inputs[0].distribution.relativeUncertaintyOfU', 'write 0.10 for 10 %'],
    // Δu/u = 0.8 gives ν = 0.78 < 1
    ['relativeUncertaintyOfU giving ν < 1', (d) => (d.inputs[0].distribution.relativeUncertaintyOfU = 0.8), 'inputs[0].distribution.relativeUncertaintyOfU', 'below 1 degree of freedom'],
    ['dof below 1', (d) => (d.inputs[0].distribution.dof = 0.5), 'inputs[0].distribution.dof', 'at least 1'],
    ['student-t dof below 1', (d) => (d.inputs[1].distribution = { kind: 'student-t', value: 2, scale: 1, dof: 0.9 }), 'inputs[1].distribution.dof', 'at least 1'],
    ['pooledDof below 1', (d) => (d.inputs[1].distribution = { kind: 'observations', values: [1, 2], pooledSd: 0.1, pooledDof: 0.5 }), 'inputs[1].distribution.pooledDof', 'at least 1'],
    ['dof and relativeUncertaintyOfU', (d) => Object.assign(d.inputs[0].distribution, { dof: 3, relativeUncertaintyOfU: 0.1 }), 'inputs[0].distribution.relativeUncertaintyOfU', 'not both'],
    ['one observation', (d) => (d.inputs[1].distribution = { kind: 'observations', values: [1] }), 'inputs[1].distribution.values', 'at least 2'],
    ['non-numeric observation', (d) => (d.inputs[1].distribution = { kind: 'observations', values: [1, 'x'] }), 'inputs[1].distribution.values[1]', 'number'],
    ['pooledSd without pooledDof', (d) => (d.inputs[1].distribution = { kind: 'observations', values: [1, 2], pooledSd: 0.1 }), 'inputs[1].distribution.pooledDof', 'go together'],
    ['unknown kind', (d) => (d.inputs[1].distribution = { kind: 'lognormal', value: 1 }), 'inputs[1].distribution.kind', 'kind must be one of'],
    ['wrong format', (d) => (d.format = 'other/2'), 'format', 'dubito-budget/1'],
    ['bad symbol', (d) => (d.inputs[0].symbol = '1a'), 'inputs[0].symbol', 'must start with a letter'],
    ['no inputs', (d) => (d.inputs = []), 'inputs', 'at least one input'],
    ['p outside (0,1)', (d) => (d.coverageProbability = 1.2), 'coverageProbability', 'strictly between'],
    ['trials above 5×10⁷', (d) => (d.monteCarlo = { trials: 60_000_000 }), 'monteCarlo.trials', 'must not exceed'],
    ['r outside [−1, 1]', (d) => (d.correlations = [{ between: ['a', 'b'], r: 1.5 }]), 'correlations[0].r', 'between -1 and 1'],
  ];
  it.each(fieldCases)('%s', (_name, mutate, field, message) => {
    const e = refusalOf(mutate);
    expect(e.field).toBe(field);
    expect(e.message).toContain(message);
    expect(e.message.startsWith(field)).toBe(true);
  });

  it('refuses more than 500 inputs', () => {
    const e = refusalOf((d) => {
      d.inputs = Array.from({ length: 501 }, (_, i) => ({ symbol: `x${i}`, distribution: { kind: 'normal', value: 0, u: 1 } }));
    });
    expect(e.field).toBe('inputs');
    expect(e.message).toContain('500');
  });

  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- the test bends the raw JSON into shapes the schema refuses
  const computeCases: [string, (d: any) => void, string, string][] = [
    ['duplicate symbol', (d) => (d.inputs[1].symbol = 'a'), 'inputs[1].symbol', 'already used'],
    ['reserved symbol', (d) => (d.inputs[1].symbol = 'e'), 'inputs[1].symbol', 'reserved'],
    ['constant clashing with an input', (d) => (d.constants = [{ symbol: 'b', value: 1 }]), 'constants[0].symbol', 'already used'],
    ['measurand clashing with an input', (d) => ((d.measurand.symbol = 'a'), (d.model = 'a = a + b')), 'measurand.symbol', 'already used'],
    ['non-finite at the estimates', (d) => (d.model = 'Y = log(a - 1) + b'), 'model', 'not a finite number'],
    ['correlation with an unknown symbol', (d) => (d.correlations = [{ between: ['a', 'z'], r: 0.5 }]), 'correlations[0].between', '"z" is not an input'],
    ['correlation of an input with itself', (d) => (d.correlations = [{ between: ['a', 'a'], r: 0.5 }]), 'correlations[0].between', 'itself'],
    [
      'correlation of a non-normal input',
      (d) => ((d.inputs[1].distribution = { kind: 'rectangular', value: 2, halfWidth: 1 }), (d.correlations = [{ between: ['a', 'b'], r: 0.5 }])),
      'correlations[0].between',
      'only inputs with a normal distribution',
    ],
  ];
  it.each(computeCases)('%s', (_name, mutate, field, message) => {
    const e = refusalOf(mutate, true);
    expect(e.field).toBe(field);
    expect(e.message).toContain(message);
  });

  it('refuses a correlation matrix that is not positive semi-definite, naming the conflicting pairs', () => {
    const doc = validateBudget({
      ...base(),
      model: 'Y = a + b + c',
      inputs: ['a', 'b', 'c'].map((symbol) => ({ symbol, distribution: { kind: 'normal', value: 1, u: 0.1 } })),
      // r(a,b) = r(b,c) = 0.9 force a and c to be strongly positively correlated; −0.9 contradicts them
      correlations: [
        { between: ['a', 'b'], r: 0.9 },
        { between: ['b', 'c'], r: 0.9 },
        { between: ['a', 'c'], r: -0.9 },
      ],
    });
    const e = (() => {
      try {
        computeBudget(doc, { monteCarlo: false });
      } catch (err) {
        return err as BudgetError;
      }
      throw new Error('accepted');
    })();
    expect(e.code).toBe('correlation');
    expect(e.message).toContain('not positive semi-definite');
    expect(e.message).toContain('r(a, c)');
  });

  it('refuses a file that is not JSON', () => {
    expect(() => parseBudgetFile('{ not json')).toThrow(/not a JSON document/);
  });

  it('keeps unknown fields through import and export', () => {
    const doc = { ...base(), labReference: 'CAL-17', inputs: [{ ...base().inputs[0], certificate: 'C-9' }, base().inputs[1]] };
    const again = JSON.parse(serializeBudget(parseBudgetFile(JSON.stringify(doc))));
    expect(again.labReference).toBe('CAL-17');
    expect(again.inputs[0].certificate).toBe('C-9');
    expect(again).toEqual(doc);
  });
});

describe('Monte Carlo trial limits', () => {
  it('refuses fewer trials than 100/(1 − p) (JCGM 101:2008 7.9.2: J = 100/(1 − p), 2000 at p = 95 %)', () => {
    const doc = validateBudget(base());
    expect(() => computeBudget(doc, { trials: 1999 })).toThrow('monteCarlo.trials: at least 2000 trials');
    expect(computeBudget(doc, { trials: 2000 }).monteCarlo?.trials).toBe(2000);
  });
});
