import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { serializeBudget, validateBudget } from '../../shared/budget/budget-file';
import type { BudgetResult } from '../../shared/budget/result';
import { DISTRIBUTION_KINDS } from '../../shared/budget/schema';
import { computeBudget, type ComputeOptions } from '../../shared/compute/compute-budget';
import { MODEL_FUNCTIONS } from '../../shared/model/sandbox';
import { propertyRuns } from '../support/property-runs';

/*
 * Whatever budget a user sends, the engine either reports figures that are
 * finite numbers, or refuses with a BudgetError that names its field. Budgets
 * are drawn from a grammar of the model language with hostile pieces mixed in:
 * names of Object.prototype members, Unicode operators, implicit multiplication,
 * deep nesting, numbers at the ends of the double range, operations whose value
 * is not finite, units the unit system refuses, distributions with missing or
 * wrong fields, correlation matrices that are not positive semi-definite.
 */

const SYMBOLS = ['a', 'b', 'c', 'constructor', '__proto__', 'toString', 'valueOf', 'hasOwnProperty'] as const;
const NUMBERS = ['0', '1', '2.5', '0.001', '1e300', '1e-300', '1e308', '5e-324', '123456789012345678901234567890', '.5', '1e', '0x10'];
const OPERATORS = ['+', '-', '*', '/', '^', '−', '×', '·', ' ', '', '%', '!', '==', '&', '.', ',', ':'];
const HOSTILE_FUNCTIONS = ['eval', 'evaluate', 'parse', 'import', 'constructor', 'toString', 'f', 'derivative', 'sum', 'mod', 'log1p'];
const NOT_FINITE = ['log(0)', '1/(a-a)', 'sqrt(-1)', 'a/0', '0^0', '(-1)^0.5', 'exp(1000)', 'asin(2)', 'acos(-2)', 'log(-1)', 'tan(pi/2)', '10^400', '0/0', '(a-a)^(-1)', 'a^1e6'];
const UNITS = [
  undefined,
  '',
  '1',
  'm',
  'mm',
  'um',
  'kg',
  'g',
  'mg',
  's',
  'Hz',
  'rad',
  'm^2',
  'kg/m^3',
  'K',
  'degC',
  'degF',
  '1/degC',
  'ppm/K',
  '%',
  'percent',
  'ppm',
  'ppb',
  'dB',
  'pH',
  '%RH',
  'ppt',
  'dBm',
  'foo',
  'm^x',
  'constructor',
  '__proto__',
  '°C',
  'm s',
  'kg*',
  '',
];

const symbol = fc.oneof({ weight: 10, arbitrary: fc.constantFrom('a', 'b') }, { weight: 1, arbitrary: fc.constantFrom(...SYMBOLS) });
const VALID_UNITS = [undefined, '1', 'm', 'mm', 'um', 'kg', 'g', 's', 'Hz', 'rad', 'm^2', 'K', 'degC', 'degF', '1/degC', 'ppm/K', '%', 'ppm', 'ppb', 'dB'];
const unit = fc.oneof({ weight: 6, arbitrary: fc.constant(undefined) }, { weight: 3, arbitrary: fc.constantFrom(...VALID_UNITS) }, { weight: 1, arbitrary: fc.constantFrom(...UNITS) });

const GOOD_OPERATORS = ['+', '-', '*', '/', '^'];
const w = <T>(weight: number, arbitrary: fc.Arbitrary<T>) => ({ weight, arbitrary });

/** Model expressions: mostly well formed, with every hostile piece now and then. */
const expression: fc.Arbitrary<string> = fc.letrec<{ e: string }>((tie) => ({
  e: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    w(6, symbol),
    w(3, fc.constantFrom(...NUMBERS.slice(0, 4))),
    w(
      6,
      fc.tuple(tie('e'), fc.constantFrom(...GOOD_OPERATORS), tie('e')).map(([l, op, r]) => `${l} ${op} ${r}`),
    ),
    w(
      3,
      fc.tuple(fc.constantFrom(...MODEL_FUNCTIONS.keys()), tie('e'), tie('e')).map(([f, x, y]) => {
        const [min] = MODEL_FUNCTIONS.get(f)!;
        return `${f}(${min === 1 ? x : `${x}, ${y}`})`;
      }),
    ),
    w(
      2,
      tie('e').map((x) => `(${x})`),
    ),
    w(
      1,
      tie('e').map((x) => `-${x}`),
    ),
    w(1, fc.constantFrom(...NUMBERS)),
    w(1, fc.constantFrom('pi', 'e', 'Infinity', 'NaN', 'undefined', 'Math', 'process', 'this', 'i', 'true')),
    w(1, fc.constantFrom(...NOT_FINITE)),
    w(
      1,
      fc.tuple(tie('e'), fc.constantFrom(...OPERATORS), tie('e')).map(([l, op, r]) => `${l} ${op} ${r}`),
    ),
    // Implicit multiplication written without a space: 2a, (a)(b), 2(a)
    w(
      1,
      fc.tuple(fc.constantFrom('2', '(a)', '3.5'), symbol).map(([l, r]) => `${l}${r}`),
    ),
    w(
      1,
      fc.tuple(fc.constantFrom(...MODEL_FUNCTIONS.keys(), ...HOSTILE_FUNCTIONS), fc.array(tie('e'), { minLength: 0, maxLength: 3 })).map(([f, args]) => `${f}(${args.join(', ')})`),
    ),
    // Deep nesting around the 64-level limit of one line, and long sums.
    w(
      1,
      fc.tuple(fc.integer({ min: 30, max: 90 }), symbol).map(([n, s]) => `${'('.repeat(n)}${s}${')'.repeat(n)}`),
    ),
    w(
      1,
      fc.tuple(fc.integer({ min: 2, max: 400 }), symbol).map(([n, s]) => Array(n).fill(s).join(' + ')),
    ),
    w(
      1,
      fc.tuple(tie('e'), tie('e')).map(([x, y]) => `${x}[${y}]`),
    ),
  ),
})).e;

const model = fc
  .tuple(
    fc.oneof({ weight: 8, arbitrary: fc.constant('Y') }, { weight: 1, arbitrary: fc.constantFrom('constructor', 'toString', 'a', 't', '__proto__') }),
    expression,
    fc.option(expression, { nil: undefined }),
    fc.oneof({ weight: 8, arbitrary: fc.constantFrom('\n', '\r\n') }, { weight: 1, arbitrary: fc.constant(';') }),
  )
  .map(([measurand, e, intermediate, sep]) => ({
    measurand,
    text: intermediate === undefined ? `${measurand} = ${e}` : `t = ${intermediate}${sep}${measurand} = ${e.replace(/\ba\b/, 't')}`,
  }));

const number = fc.oneof(fc.constantFrom(0, 1, -1, 0.5, 2, 10, 100, 1e-300, 1e300, -1e300, 5e-324, Number.MAX_VALUE, 1e-12, 20, 273.15), fc.double({ min: -1e6, max: 1e6, noNaN: true }));
const positive = fc.oneof(fc.constantFrom(1e-300, 1e-12, 0.001, 0.1, 1, 2, 1e300, Number.MAX_VALUE), fc.double({ min: 1e-6, max: 1e3, noNaN: true }));
const hostileValue = fc.constantFrom<unknown>(NaN, Infinity, -Infinity, -1, 0, '1', null, [], {}, true, 1.5, 0.75, 3, 1e9);
const field = (good: fc.Arbitrary<unknown>) => fc.oneof({ weight: 15, arbitrary: good }, { weight: 1, arbitrary: hostileValue });
const maybe = (good: fc.Arbitrary<unknown>) => fc.option(field(good), { nil: undefined, freq: 3 });

/** Any fields under any kind: mostly refused by the validator, each refusal naming its field. */
const looseDistribution = fc
  .record({
    kind: fc.oneof({ weight: 9, arbitrary: fc.constantFrom(...DISTRIBUTION_KINDS) }, { weight: 1, arbitrary: fc.constantFrom('gaussian', '__proto__', '', 7) }),
    value: field(number),
    u: maybe(positive),
    U: maybe(positive),
    k: maybe(fc.constantFrom(1, 2, 3)),
    halfWidth: maybe(positive),
    lower: maybe(number),
    upper: maybe(number),
    beta: maybe(fc.constantFrom(0, 0.5, 1)),
    halfWidthUncertainty: maybe(fc.constantFrom(0, 0.001, 0.1)),
    scale: maybe(positive),
    dof: maybe(fc.constantFrom(1, 1.5, 2, 2.5, 3, 4, 9, 50, 1e9)),
    relativeUncertaintyOfU: maybe(fc.constantFrom(0.05, 0.1, 0.5, 0.7)),
    values: maybe(fc.array(number, { minLength: 0, maxLength: 8 })),
    pooledSd: maybe(positive),
    pooledDof: maybe(fc.constantFrom(1, 5, 20)),
  })
  .map((d) => Object.fromEntries(Object.entries(d).filter(([, v]) => v !== undefined)));

const dof = fc.option(fc.constantFrom(1, 1.5, 2, 2.5, 3, 4, 9, 50, 1e9), { nil: undefined, freq: 3 });
const withDof = <T extends object>(d: T, nu: number | undefined) => (nu === undefined ? d : { ...d, dof: nu });

/** A well-formed distribution of each kind, with figures from the ends of the double range now and then. */
const wellFormedDistribution = fc.oneof(
  fc.tuple(number, positive, dof).map(([value, u, nu]) => withDof({ kind: 'normal', value, u }, nu)),
  fc.tuple(number, positive, fc.constantFrom(1, 2, 2.58)).map(([value, U, k]) => ({ kind: 'normal', value, U, k })),
  fc.tuple(number, positive).map(([value, halfWidth]) => ({ kind: 'rectangular', value, halfWidth })),
  fc.tuple(number, positive).map(([lower, width]) => ({ kind: 'rectangular', lower, upper: lower + width })),
  fc.tuple(number, positive).map(([value, halfWidth]) => ({ kind: 'triangular', value, halfWidth })),
  fc.tuple(number, positive).map(([value, halfWidth]) => ({ kind: 'arcsine', value, halfWidth })),
  fc.tuple(number, positive, fc.constantFrom(0, 0.3, 1)).map(([value, halfWidth, beta]) => ({ kind: 'trapezoidal', value, halfWidth, beta })),
  fc.tuple(number, positive, fc.constantFrom(0, 0.1, 1)).map(([value, halfWidth, f]) => ({ kind: 'curvilinear-trapezoidal', value, halfWidth, halfWidthUncertainty: f * halfWidth })),
  fc.tuple(number, positive, fc.constantFrom(1, 1.5, 2, 3, 4.5, 30)).map(([value, scale, nu]) => ({ kind: 'student-t', value, scale, dof: nu })),
  fc.array(number, { minLength: 2, maxLength: 6 }).map((values) => ({ kind: 'observations', values })),
  fc.tuple(fc.array(number, { minLength: 2, maxLength: 4 }), positive).map(([values, pooledSd]) => ({ kind: 'observations', values, pooledSd, pooledDof: 12 })),
  number.map((value) => ({ kind: 'constant', value })),
);

/** A distribution of every kind, mostly well formed, with wrong or missing fields mixed in. */
const distribution = fc.oneof({ weight: 15, arbitrary: wellFormedDistribution }, { weight: 1, arbitrary: looseDistribution });

const input = fc.record({
  symbol: fc.oneof({ weight: 20, arbitrary: fc.constantFrom(...SYMBOLS.slice(2)) }, { weight: 1, arbitrary: fc.constantFrom('a', '1x', '', 'a b') }),
  unit,
  distribution,
});
/** Inputs a and b (which most expressions use), then others; a repeated symbol now and then. */
const inputs = fc
  .tuple(unit, unit, distribution, distribution, fc.uniqueArray(input, { maxLength: 2, selector: (q) => q.symbol }))
  .map(([ua, ub, da, db, more]) => [{ symbol: 'a', unit: ua, distribution: da }, { symbol: 'b', unit: ub, distribution: db }, ...more]);

const correlation = fc.record({
  between: fc.tuple(fc.oneof(symbol, fc.constantFrom('zz')), fc.oneof(symbol, fc.constantFrom('zz'))),
  r: fc.oneof({ weight: 12, arbitrary: fc.constantFrom(-1, -0.9, 0, 0.5, 0.9, 0.99, 1) }, { weight: 1, arbitrary: fc.constantFrom(1.5, NaN) }),
});

const reporting = fc.oneof(
  {
    weight: 12,
    arbitrary: fc.constantFrom<unknown>(
      undefined,
      { basis: 'k-fixed', k: 2 },
      { basis: 'k-fixed', k: 1 },
      { basis: 't-effective-dof', whenNotValidated: 'report-monte-carlo' },
      { basis: 'k-fixed', k: 2, whenNotValidated: 'report-monte-carlo' },
    ),
  },
  { weight: 1, arbitrary: fc.constantFrom<unknown>({ basis: 'k-fixed' }, { k: 2 }, { basis: 'monte-carlo' }) },
);

/** Three inputs pairwise correlated +0.9, +0.9, −0.9: the matrix has a negative eigenvalue (−0.8). */
const notPositiveSemiDefinite = fc.constant([
  { between: ['a', 'b'], r: 0.9 },
  { between: ['b', 'c'], r: 0.9 },
  { between: ['a', 'c'], r: -0.9 },
]);

/** A budget document as a user might send it: the unknown field `labNote` must survive a round trip. */
const document = fc
  .record({
    model,
    inputs,
    // One unit for most inputs, so that sums are mostly of one dimension.
    commonUnit: unit,
    ownUnits: fc.array(fc.boolean(), { minLength: 4, maxLength: 4 }).map((b) => b.map((x, i) => x && i % 3 === 0)),
    measurandUnit: fc.oneof(w(10, fc.constant(undefined)), w(1, unit)),
    constants: fc.option(fc.uniqueArray(fc.record({ symbol: fc.constantFrom('k0', 'k1', 'toString', 'a'), value: number, unit }), { maxLength: 2, selector: (c) => c.symbol }), {
      nil: undefined,
      freq: 1,
    }),
    correlations: fc.option(fc.oneof(notPositiveSemiDefinite, fc.array(correlation, { maxLength: 3 })), { nil: undefined, freq: 3 }),
    coverageProbability: fc.oneof({ weight: 15, arbitrary: fc.constantFrom(undefined, 0.95) }, { weight: 1, arbitrary: fc.constantFrom(0.9, 0.6827, 0.5, 0.99, 0, 1, 1.2) }),
    reporting,
  })
  .map((d) => {
    const doc: Record<string, unknown> = {
      format: 'dubito-budget/1',
      title: 'property budget',
      measurand: { symbol: d.model.measurand, ...(d.measurandUnit === undefined ? {} : { unit: d.measurandUnit }) },
      model: d.model.text,
      inputs: d.inputs.map((q, i) => {
        const u = d.ownUnits[i] ? q.unit : d.commonUnit;
        return u === undefined ? { symbol: q.symbol, distribution: q.distribution } : { ...q, unit: u };
      }),
      monteCarlo: { trials: 2000, seed: 'property' },
      labNote: { reference: 'KF-PROP', tags: ['x'] },
    };
    if (d.constants) doc.constants = d.constants.map((c) => (c.unit === undefined ? { symbol: c.symbol, value: c.value } : c));
    if (d.correlations) doc.correlations = d.correlations;
    if (d.coverageProbability !== undefined) doc.coverageProbability = d.coverageProbability;
    if (d.reporting !== undefined) doc.reporting = d.reporting;
    return doc;
  });

function expectRefusal(e: unknown): void {
  if (!(e instanceof BudgetError)) throw e;
  expect(e.message.length).toBeGreaterThan(0);
  expect(typeof e.field === 'string' && e.field.length > 0, `no field on "${e.message}"`).toBe(true);
}

const finite = (x: unknown) => typeof x === 'number' && Number.isFinite(x);

/** The figures a renderer may put on a certificate are all finite, and the GUM interval holds the estimate. */
function expectReportable(r: BudgetResult): void {
  if (r.reported === null) {
    // Nothing reported: only where the GUM figures do not hold and no Monte Carlo run replaced them.
    expect(r.monteCarlo, 'nothing reported beside a Monte Carlo run').toBeNull();
    expect(r.gum.unreportable, 'nothing reported without the GUM flag').toBeDefined();
    return;
  }
  const rep = r.reported!;
  expect(rep, 'reported').toBeDefined();
  expect(finite(rep.estimate), `estimate ${rep.estimate}`).toBe(true);
  expect(rep.standardUncertainty === null || (finite(rep.standardUncertainty) && rep.standardUncertainty >= 0), `u ${rep.standardUncertainty}`).toBe(true);
  expect(finite(rep.expandedUncertainty) && rep.expandedUncertainty >= 0, `U ${rep.expandedUncertainty}`).toBe(true);
  expect(rep.coverageFactor === null || (finite(rep.coverageFactor) && rep.coverageFactor > 0), `k ${rep.coverageFactor}`).toBe(true);
  expect(finite(rep.coverageProbability) && rep.coverageProbability > 0 && rep.coverageProbability < 1, `p ${rep.coverageProbability}`).toBe(true);
  expect(finite(rep.interval[0]) && finite(rep.interval[1]) && rep.interval[0] <= rep.interval[1], `interval ${rep.interval}`).toBe(true);
  if (rep.basis !== 'monte-carlo') {
    expect(rep.interval[0] <= rep.estimate && rep.estimate <= rep.interval[1], `interval ${rep.interval} about ${rep.estimate}`).toBe(true);
  }
  // A GUM result marked unreportable never reaches U (JCGM 100:2008 5.1.2 note): the Monte Carlo interval is reported instead.
  if (r.gum.unreportable) expect(rep.basis, r.gum.unreportable.message).toBe('monte-carlo');
  // The budget table shows the GUM figures and every contribution, reported or not.
  for (const [name, v] of Object.entries({ y: r.gum.estimate, u: r.gum.standardUncertainty, k: r.gum.coverageFactor, U: r.gum.expandedUncertainty })) {
    expect(finite(v), `GUM ${name} ${v}`).toBe(true);
  }
  for (const c of r.gum.contributions) {
    expect(finite(c.sensitivity) && finite(c.contribution) && finite(c.estimate) && finite(c.standardUncertainty), `contribution of ${c.symbol}`).toBe(true);
  }
  const dof = r.gum.effectiveDof;
  expect(dof === null || (finite(dof) && dof >= 1), `ν_eff ${dof}`).toBe(true);
  for (const c of r.gum.contributions) expect(Number.isNaN(c.varianceShare), `share of ${c.symbol}`).toBe(false);
  if (r.monteCarlo) {
    expect(finite(r.monteCarlo.interval[0]) && finite(r.monteCarlo.interval[1]), `MC interval ${r.monteCarlo.interval}`).toBe(true);
  }
}

/** Computes without the Monte Carlo method, with 2 000 trials and adaptively up to 4 000; each either reports finite figures or refuses. */
function computeOrRefuse(raw: unknown): 'refused' | 'computed' {
  let doc;
  try {
    doc = validateBudget(raw);
  } catch (e) {
    expectRefusal(e);
    return 'refused';
  }
  let computed = false;
  const runs: ComputeOptions[] = [{ monteCarlo: false }, { trials: 2000, trialsCap: 2000, seed: 'property' }, { trials: 'adaptive', trialsCap: 4000, seed: 'property' }];
  for (const options of runs) {
    try {
      expectReportable(computeBudget(doc, options));
      computed = true;
    } catch (e) {
      if (e instanceof BudgetError) expectRefusal(e);
      else throw e;
    }
  }
  return computed ? 'computed' : 'refused';
}

describe('computeBudget on random budgets', () => {
  it('reports finite figures or refuses with a BudgetError naming its field', () => {
    const outcomes = { refused: 0, computed: 0 };
    fc.assert(
      fc.property(document, (doc) => {
        outcomes[computeOrRefuse(doc)]++;
      }),
      propertyRuns(300),
    );
    // The grammar must reach the engine, not only the validator.
    expect(outcomes.computed).toBeGreaterThan(8);
  });

  it('holds for well-formed budgets over a, b, c with any correlation', () => {
    const outcomes = { refused: 0, computed: 0 };
    const inputs = fc.tuple(distribution, distribution, distribution).map((ds) => ds.map((d, i) => ({ symbol: 'abc'[i], distribution: d })));
    fc.assert(
      fc.property(
        fc.oneof(w(3, fc.constantFrom('0', 'a', '1', 'a^2 - 2*b*c', 'a*b*c - b*c', 'exp(b*c)', 'sqrt(abs(a))')), w(2, expression)),
        inputs,
        fc.oneof(
          w(4, fc.constant([])),
          w(1, notPositiveSemiDefinite),
          w(2, fc.array(fc.record({ between: fc.constantFrom(['a', 'b'], ['b', 'c'], ['a', 'c'], ['a', 'a']), r: correlation.map((c) => c.r) }), { maxLength: 3 })),
        ),
        reporting,
        (e, qs, correlations, rep) => {
          outcomes[
            computeOrRefuse({
              format: 'dubito-budget/1',
              title: 'property budget',
              measurand: { symbol: 'Y' },
              model: `Y = a + b * c + ${e}`,
              inputs: qs,
              correlations,
              ...(rep === undefined ? {} : { reporting: rep }),
            })
          ]++;
        },
      ),
      propertyRuns(200),
    );
    expect(outcomes.computed).toBeGreaterThan(30);
  });
});

describe('validateBudget → serializeBudget → validateBudget', () => {
  it('returns every valid document unchanged, unknown fields included', () => {
    let valid = 0;
    fc.assert(
      fc.property(document, fc.dictionary(fc.string({ maxLength: 12 }), fc.jsonValue({ maxDepth: 3 }), { maxKeys: 3 }), (raw, extra) => {
        const withExtra = { ...extra, ...raw };
        let doc;
        try {
          doc = validateBudget(withExtra);
        } catch (e) {
          expectRefusal(e);
          return;
        }
        valid++;
        // What was sent comes back, unknown fields included (JSON writes −0 as 0, hence the comparison of JSON
        // texts), except a key "__proto__" of the budget's own objects, which is dropped (see the example below).
        const text = serializeBudget(doc);
        const withoutProto = (t: string) => JSON.parse(t, (k, v) => (k === '__proto__' ? undefined : v));
        expect(withoutProto(text)).toEqual(withoutProto(JSON.stringify(withExtra)));
        const again = validateBudget(JSON.parse(text));
        expect(serializeBudget(again)).toBe(text);
        expect((again as Record<string, unknown>).labNote).toEqual({ reference: 'KF-PROP', tags: ['x'] });
      }),
      propertyRuns(300),
    );
    expect(valid).toBeGreaterThan(20);
  });

  it('drops a key "__proto__" and never lets it become the prototype of what was validated', () => {
    // JSON.parse makes "__proto__" an own property; copied by assignment it would set the prototype, and an
    // inherited `coverageProbability` or `u` would escape validation.
    const text =
      '{"__proto__":{"coverageProbability":7},"format":"dubito-budget/1","title":"t","measurand":{"symbol":"Y"},"model":"Y = a",' +
      '"inputs":[{"symbol":"a","distribution":{"kind":"normal","value":1,"u":0.1,"__proto__":{"u":-1}}}]}';
    const doc = validateBudget(JSON.parse(text));
    expect(Object.getPrototypeOf(doc)).toBe(Object.prototype);
    expect(doc.coverageProbability).toBeUndefined();
    expect(Object.getPrototypeOf(doc.inputs[0].distribution)).toBe(Object.prototype);
    expect(serializeBudget(doc)).not.toContain('__proto__');
  });
});

describe('figures at the ends of the double range', () => {
  const refusal = (doc: unknown) => {
    try {
      computeBudget(validateBudget(doc), { monteCarlo: false });
    } catch (e) {
      if (e instanceof BudgetError) return e;
      throw e;
    }
    throw new Error('accepted');
  };
  const base = { format: 'dubito-budget/1', title: 'range', measurand: { symbol: 'Y' } };

  it('refuses an input whose u overflows, naming it', () => {
    // Curvilinear trapezoid a = 1e300: u² = a²/3 + d²/9 (JCGM 101:2008 6.4.4) overflows although every field is finite.
    const e = refusal({
      ...base,
      model: 'Y = a + b',
      inputs: [
        { symbol: 'a', distribution: { kind: 'normal', value: 0, u: 1 } },
        { symbol: 'b', distribution: { kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1e300, halfWidthUncertainty: 0 } },
      ],
    });
    expect(e.code).toBe('not_finite');
    expect(e.field).toBe('inputs[1].distribution');
    expect(e.message).toMatch(/standard uncertainty of "b" is not a finite number/);
  });

  it('refuses a combined variance beyond the double range', () => {
    // c_b·u_b = a·u_b = 1e200 · 1e200 = 1e400 > 1.8e308
    const e = refusal({
      ...base,
      model: 'Y = a * b',
      inputs: [
        { symbol: 'a', distribution: { kind: 'normal', value: 1e200, u: 1 } },
        { symbol: 'b', distribution: { kind: 'normal', value: 1, u: 1e200 } },
      ],
    });
    expect(e.code).toBe('not_finite');
    expect(e.field).toBe('model');
  });

  it('gives ν_eff by G.2b when u⁴ of a term exceeds the double range', () => {
    // JCGM 100:2008 eq. G.2b with two equal terms of ν = 4: ν_eff = (2u²)² / (2u⁴/4) = 8, whatever u (u⁴ = 1e400 here).
    const r = computeBudget(
      validateBudget({
        ...base,
        model: 'Y = a + b',
        inputs: [
          { symbol: 'a', distribution: { kind: 'normal', value: 0, u: 1e100, dof: 4 } },
          { symbol: 'b', distribution: { kind: 'normal', value: 0, u: 1e100, dof: 4 } },
        ],
      }),
      { monteCarlo: false },
    );
    expect(r.gum.effectiveDof).toBeCloseTo(8, 10);
    expect(r.gum.standardUncertainty).toBeCloseTo(Math.SQRT2 * 1e100, -90);
  });
});

describe('Monte Carlo figures at the ends of the double range', () => {
  it('refuses a run whose model values are finite but whose u(ỹ) overflows', () => {
    // y = b·c with b ≈ 0.1 and c drawn with u = 1e300: each y_r ≈ 1e299 is finite, Σ y_r² is not (JCGM 101:2008 7.6 eq. 13).
    const doc = validateBudget({
      format: 'dubito-budget/1',
      title: 'range',
      measurand: { symbol: 'Y' },
      model: 'Y = a + b * c',
      inputs: [
        { symbol: 'a', distribution: { kind: 'normal', value: 0, u: 1 } },
        { symbol: 'b', distribution: { kind: 'normal', value: 0, u: 0.1 } },
        { symbol: 'c', distribution: { kind: 'normal', value: 0, U: 1e300, k: 1 } },
      ],
      reporting: { whenNotValidated: 'report-monte-carlo' },
    });
    expect(computeBudget(doc, { monteCarlo: false }).gum.standardUncertainty).toBe(1); // c_c = b = 0 at first order
    let refusal: unknown;
    try {
      computeBudget(doc, { trials: 2000, trialsCap: 2000, seed: 'range' });
    } catch (e) {
      refusal = e;
    }
    expect(refusal).toBeInstanceOf(BudgetError);
    expect((refusal as BudgetError).field).toBe('monteCarlo');
    expect((refusal as BudgetError).code).toBe('not_finite');
  });
});
