import type { BudgetResult, Contribution, ReportingBasis } from '../budget/result';
import type { BudgetDocument, InputQuantity } from '../budget/schema';
import { readResult } from '../budget/stored-result';
import type { BudgetWarning, WarningCode } from '../budget/warnings';
import { groupNumbersIn } from '../format/digit-groups';
import { budgetKindLabel } from '../format/distribution-labels';
import { symbolMarkup } from '../format/symbols';
import { reportedOf } from '../compute/reported-result';
import { resultStatement } from '../gum/statement';
import { atDecimalPlace, count, coverageFactor, dof, estimate, given, intermediate, interval, placeOf, plainFigure, probability, share, significantFigure, uncertainty, type Figure } from './figures';
import { divisor, statedAs } from './stated';
import { parseUnit, sameDimension } from '../model/units';
import { sensitivityShown, unitText, withUnit, type ShownCoefficient, type UnitText } from './units';
import { verdictView, type VerdictView } from './verdict';

/*
 * Everything a reader sees of a computed budget, built once from the budget
 * document and its stored result. The editor, the Monte Carlo panel, the
 * version comparison, the report page, the PDF and the command line render
 * this model and format nothing themselves: what is signed is what was seen.
 */

/** Plain text for the screen and terminal, and the same with the PDF's raise/lower markup. */
interface Text {
  text: string;
  markup: string;
}

/** The figures that go to the certificate, and how they were obtained. */
interface ReportedFigures {
  basis: ReportingBasis;
  /** How U was obtained, in words that follow "U from": "k = t_p(ν_eff) of the t-distribution (GUM G.4)". */
  basisWords: string;
  estimate: Figure;
  standardUncertainty: Figure;
  effectiveDof: Figure;
  /** Null when the interval is the Monte Carlo one (no k). */
  coverageFactor: Figure | null;
  expandedUncertainty: Figure;
  coverageProbability: Figure;
  interval: Figure;
  /** u_c with the second-order terms of GUM 5.1.2 note, when they were computed. */
  secondOrder: Figure | null;
  /** Why the reported figures are not plain GUM figures, in words; empty when they are. */
  notes: string[];
}

/** A warning as the reader sees it: its code, for deciding where and how it shows, and its words with digits grouped. */
interface WarningView {
  code: WarningCode;
  message: string;
}

/** One row of the budget: from the value as stated to the share of the variance. */
interface BudgetRow {
  symbol: string;
  description: string;
  kind: string;
  unit: UnitText;
  estimate: Figure;
  stated: Figure;
  divisor: Figure;
  standardUncertainty: Figure;
  sensitivity: ShownCoefficient;
  sensitivityMethod: 'symbolic' | 'numeric';
  /** |c_i|·u(x_i) in the measurand's unit. */
  contribution: Figure;
  share: Figure;
  dof: Figure;
  /** The engine's warnings about this input. */
  warnings: WarningView[];
}

/** A term of the ranked contributions, largest first, with the running total of the shares. */
interface RankedTerm {
  symbol: string;
  share: Figure;
  cumulative: Figure;
}

interface BudgetView {
  rows: BudgetRow[];
  ranked: RankedTerm[];
  /** The largest term in words: "u(T) contributes 72 % of the variance u_c²." */
  dominant: Text;
  totals: {
    standardUncertainty: Figure;
    effectiveDof: Figure;
    coverageFactor: Figure;
    expandedUncertainty: Figure;
    coverageProbability: Figure;
  };
  /** How c_i were obtained and u_c combined, with the clauses. */
  method: Text;
}

export interface MonteCarloView {
  trials: Figure;
  seed: string;
  adaptive: boolean;
  /** "1 000 000 trials" or "240 000 trials (adaptive)". */
  heading: string;
  probability: Figure;
  /** Estimate, standard uncertainty, probabilistically symmetric and shortest intervals: GUM beside Monte Carlo, at one decimal place. */
  rows: { label: string; gum: Figure | null; monteCarlo: Figure }[];
  /** For adaptive runs, how stable the figures are (JCGM 101:2008 7.9.4). */
  stability: string | null;
  /** The decimal place of the comparison's figures (10^place), for the axis of a chart beside them. */
  place: number;
}

export interface ResultModel {
  measurand: { symbol: string; unit: UnitText; description: string };
  /** What goes to the certificate; dashes, with the reason in `notes`, when nothing can be reported. */
  reported: ReportedFigures;
  /** The statement for the certificate (JCGM 100:2008 7.2.3, 7.2.6). */
  statement: Text;
  budget: BudgetView;
  monteCarlo: MonteCarloView | null;
  validation: VerdictView | null;
  /** Warnings about no input of the budget table. */
  warnings: WarningView[];
  /** The model as written, and each intermediate quantity's value at the estimates with its unit. */
  model: { text: string; intermediates: { symbol: string; value: Figure }[] };
  /** The constants of the model, one line each: "g_n = 9.806 65 m/s² — standard acceleration of gravity". */
  constants: Text[];
  correlations: { symbols: string[]; matrix: Figure[][] } | null;
  /** The readings of Type A inputs, for the appendix. */
  observations: { symbol: string; unit: UnitText; values: Figure[] }[];
  caution: string;
}

/** The caution every result carries. */
export const CAUTION = 'These results support, and do not replace, the laboratory’s documented procedure and the requirements of ISO/IEC 17025.';

const BASIS_WORDS: Record<ReportingBasis, string> = {
  't-effective-dof': 'k = t_p(ν_eff) of the t-distribution (GUM G.4)',
  'k-fixed': 'k fixed by the laboratory',
  'monte-carlo': 'the Monte Carlo coverage interval (JCGM 101:2008 7.7)',
};

/**
 * The figures that go to the certificate. Where nothing can be reported (`reportedOf` null: the GUM
 * figures do not hold and no Monte Carlo run replaced them) every figure is a dash and the note says why.
 */
function reportedFigures(result: BudgetResult): ReportedFigures {
  const r = reportedOf(result);
  if (!r) {
    const none = plainFigure('—');
    const why = result.gum.unreportable?.message ?? 'The GUM figures do not hold for this model.';
    return {
      basis: 't-effective-dof',
      basisWords: 'nothing: no expanded uncertainty can be stated without the Monte Carlo method',
      estimate: estimate(result.gum.estimate, 0),
      standardUncertainty: none,
      effectiveDof: none,
      coverageFactor: null,
      expandedUncertainty: none,
      coverageProbability: probability(result.gum.coverageProbability),
      interval: none,
      secondOrder: result.gum.standardUncertaintySecondOrder === null ? null : uncertainty(result.gum.standardUncertaintySecondOrder),
      notes: [`${why} Run the Monte Carlo method (JCGM 101:2008).`],
    };
  }
  const place = placeOf(r.expandedUncertainty);
  const notes: string[] = [];
  if (r.replacedGum)
    notes.push(
      `The Monte Carlo coverage interval is reported in place of the GUM figures${r.validationReason ? `: ${r.validationReason.replace(/\.$/, '')}` : ', which the Monte Carlo method did not validate (JCGM 101:2008 8)'}.`,
    );
  if (r.unvalidated) {
    const how =
      r.validationVerdict === 'inconclusive'
        ? 'their comparison with the Monte Carlo method was inconclusive at the number of trials used'
        : r.validationVerdict === 'not-possible'
          ? 'the Monte Carlo method could not validate them'
          : 'the Monte Carlo method did not validate them';
    notes.push(`The GUM figures are reported although ${how}.`);
  }
  return {
    basis: r.basis,
    basisWords: BASIS_WORDS[r.basis],
    estimate: estimate(r.estimate, r.expandedUncertainty),
    // The Monte Carlo basis without a variance (an input drawn from t with ν ≤ 2) has no u to state.
    standardUncertainty: r.standardUncertainty === null ? plainFigure('—') : uncertainty(r.standardUncertainty),
    effectiveDof: dof(result.gum.effectiveDof),
    coverageFactor: r.coverageFactor === null ? null : coverageFactor(r.coverageFactor),
    expandedUncertainty: uncertainty(r.expandedUncertainty),
    coverageProbability: probability(r.coverageProbability),
    interval: interval(r.interval, place ?? 0),
    secondOrder: result.gum.standardUncertaintySecondOrder === null ? null : uncertainty(result.gum.standardUncertaintySecondOrder),
    notes,
  };
}

/** The one place the certificate statement is made, digits grouped with a true minus sign. */
function statementOf(result: BudgetResult, unit: UnitText): Text {
  const text = groupNumbersIn(resultStatement({ symbol: result.measurand.symbol, unit: unit.text || undefined }, result));
  const markup = groupNumbersIn(resultStatement({ symbol: symbolMarkup(result.measurand.symbol), unit: unit.markup || undefined }, result)).replace(/ν_eff/g, 'ν_{eff}');
  return { text, markup };
}

const concerns = (w: BudgetWarning, symbol: string) => w.symbols?.includes(symbol) ?? false;
const warningView = (w: BudgetWarning): WarningView => ({ code: w.code, message: groupNumbersIn(w.message) });

function budgetRow(c: Contribution, q: InputQuantity | undefined, measurandUnit: string | undefined, warnings: BudgetWarning[]): BudgetRow {
  const unit = unitText(c.unit);
  return {
    symbol: c.symbol,
    description: q?.description?.trim() ?? '',
    kind: budgetKindLabel(c.kind, q?.distribution.kind === 'observations' ? q.distribution.values.length : undefined),
    unit,
    estimate: c.standardUncertainty > 0 ? estimate(c.estimate, c.standardUncertainty) : given(c.estimate),
    stated: q ? statedAs(q) : { text: '—', markup: '—', value: null },
    divisor: q ? divisor(q) : { text: '—', markup: '—', value: null },
    standardUncertainty: uncertainty(c.standardUncertainty),
    sensitivity: sensitivityShown(c.sensitivity, measurandUnit, c.unit),
    sensitivityMethod: c.sensitivityMethod,
    contribution: uncertainty(c.contribution),
    share: share(c.varianceShare),
    dof: dof(c.dof),
    warnings: warnings.filter((w) => concerns(w, c.symbol)).map(warningView),
  };
}

/**
 * Symbols in the order of their characters (UTF-16 code units), the order of equal shares in the
 * ranking: `localeCompare` would load the browser's collation tables on its first call, 15–20 ms
 * of the editor's first render whenever two inputs share a variance share (several that contribute nothing).
 */
const bySymbol = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

function budgetView(document: BudgetDocument, result: BudgetResult): BudgetView {
  const g = result.gum;
  const inputs = new Map(document.inputs.map((q) => [q.symbol, q]));
  const rows = g.contributions.map((c) => budgetRow(c, inputs.get(c.symbol), result.measurand.unit, result.warnings));
  const sorted = [...g.contributions].sort((a, b) => b.varianceShare - a.varianceShare || bySymbol(a.symbol, b.symbol));
  let running = 0;
  const ranked = sorted.map((c) => {
    running += c.varianceShare;
    return { symbol: c.symbol, share: share(c.varianceShare), cumulative: share(Math.min(1, running)) };
  });
  const [first, second] = sorted;
  const dominantIn = (uc: string, sym: (s: string) => string) => {
    if (!first || !(first.varianceShare > 0)) return 'No input contributes to the variance.';
    const tail = first.varianceShare < 0.5 && second && second.varianceShare > 0 ? `; with u(${sym(second.symbol)}), ${share(first.varianceShare + second.varianceShare).text}.` : '.';
    return `u(${sym(first.symbol)}) contributes ${share(first.varianceShare).text} of the variance ${uc}²${tail}`;
  };
  const dominant = { text: dominantIn('u_c', (s) => s), markup: dominantIn('u_{c}', symbolMarkup) };
  const correlated = (document.correlations ?? []).length > 0;
  const methods = new Set(g.contributions.map((k) => k.sensitivityMethod));
  const how = methods.has('numeric') ? (methods.has('symbolic') ? 'symbolic where possible, otherwise numerical differentiation' : 'numerical differentiation') : 'symbolic differentiation';
  const combine = (s: 'text' | 'markup') => {
    const i = s === 'markup' ? (x: string) => `_{${x}}` : (x: string) => `_${x}`;
    return (
      `c${i('i')}, the partial derivative of the model with respect to x${i('i')} at the estimates (${how}, GUM 5.1.3); u${i('c')}² = Σ c${i('i')}² u²(x${i('i')})` +
      (correlated ? ` + 2 ΣΣ c${i('i')} c${i('j')} u(x${i('i')}) u(x${i('j')}) r(x${i('i')}, x${i('j')}) (GUM 5.2.2)` : ' (GUM 5.1.2)') +
      `; ν${i('eff')} by the Welch–Satterthwaite formula (GUM G.4.1); share = (c${i('i')} u(x${i('i')}))² / Σ (c${i('j')} u(x${i('j')}))².`
    );
  };
  return {
    rows,
    ranked,
    dominant,
    totals: {
      standardUncertainty: uncertainty(g.standardUncertainty),
      effectiveDof: dof(g.effectiveDof),
      coverageFactor: coverageFactor(g.coverageFactor),
      expandedUncertainty: uncertainty(g.expandedUncertainty),
      coverageProbability: probability(g.coverageProbability),
    },
    method: { text: combine('text'), markup: combine('markup') },
  };
}

function monteCarloView(result: BudgetResult, unit: UnitText): MonteCarloView | null {
  const mc = result.monteCarlo;
  if (!mc) return null;
  const g = result.gum;
  // JCGM 101:2008 7.8: y, u(y) and the interval ends to the decimal place of u(y) at two significant digits;
  // both columns at the finer of the two places so they can be compared digit by digit
  const mcSpread = mc.undefinedMoments ? (mc.interval[1] - mc.interval[0]) / 4 : mc.standardUncertainty;
  const place = Math.min(placeOf(mcSpread) ?? 0, placeOf(g.standardUncertainty) ?? placeOf(mcSpread) ?? 0);
  const p = probability(g.coverageProbability);
  const s = mc.stability;
  const spread = (x: number) => withUnit(significantFigure(x), unit).text;
  return {
    trials: count(mc.trials),
    seed: mc.seed,
    adaptive: mc.adaptive,
    heading: `${count(mc.trials).text} trials${mc.adaptive ? ' (adaptive)' : ''}`,
    probability: p,
    place,
    rows: [
      // Without a variance (an input drawn from t with ν ≤ 2) the average and the standard deviation of the trials are no figures of the output.
      { label: 'Estimate y', gum: atDecimalPlace(g.estimate, place), monteCarlo: mc.undefinedMoments ? plainFigure('undefined') : atDecimalPlace(mc.estimate, place) },
      { label: 'Standard uncertainty u(y)', gum: uncertainty(g.standardUncertainty), monteCarlo: mc.undefinedMoments ? plainFigure('undefined') : uncertainty(mc.standardUncertainty) },
      { label: `Coverage interval, p = ${p.text}`, gum: interval(g.interval, place), monteCarlo: interval(mc.interval, place) },
      { label: 'Shortest coverage interval', gum: null, monteCarlo: interval(mc.shortestInterval, place) },
    ],
    stability: s
      ? `${s.stabilized ? 'Stable' : 'Not stable'}: ${count(s.sequences).text} sequences of ${count(s.sequenceLength).text} trials; twice the standard deviation of the sequence averages ` +
        `(y ${spread(2 * s.spread.estimate)}, u ${spread(2 * s.spread.standardUncertainty)}, ends ${spread(2 * s.spread.low)} and ${spread(2 * s.spread.high)}) ` +
        `${s.stabilized ? 'is within' : 'exceeds'} the tolerance δ = ${spread(s.tolerance)} (JCGM 101:2008 7.9.4).`
      : null,
  };
}

function correlationsView(document: BudgetDocument): ResultModel['correlations'] {
  const pairs = document.correlations ?? [];
  if (!pairs.length) return null;
  const symbols = [...new Set(pairs.flatMap((p) => p.between))];
  const r = (a: string, b: string) => (a === b ? 1 : (pairs.find((p) => (p.between[0] === a && p.between[1] === b) || (p.between[0] === b && p.between[1] === a))?.r ?? 0));
  return { symbols, matrix: symbols.map((a) => symbols.map((b) => given(r(a, b)))) };
}

/**
 * The intermediates come in coherent SI units; each is shown in the unit the budget itself uses for
 * that dimension (the first input's of that dimension, else the measurand's), so t_bath reads in °C beside inputs in °C.
 */
function intermediatesView(document: BudgetDocument, result: BudgetResult): { symbol: string; value: Figure }[] {
  const own = [...document.inputs.map((q) => q.unit), result.measurand.unit ?? document.measurand.unit].filter((u): u is string => !!u);
  const parse = (u: string) => {
    try {
      return parseUnit(u);
    } catch {
      return null;
    }
  };
  return result.gum.intermediates.map((q) => {
    const si = parse(q.unit);
    const match = si ? own.map((u) => ({ u, p: parse(u) })).find((o) => o.p && sameDimension(o.p.dimension, si.dimension)) : undefined;
    if (si && match?.p) return { symbol: q.symbol, value: withUnit(intermediate((q.value * si.factor) / match.p.factor), unitText(match.u)) };
    return { symbol: q.symbol, value: withUnit(intermediate(q.value), unitText(q.unit)) };
  });
}

function constantsView(document: BudgetDocument): Text[] {
  return (document.constants ?? []).map((k) => {
    const v = withUnit(given(k.value), unitText(k.unit));
    const d = k.description ? ` — ${k.description}` : '';
    return { text: `${k.symbol} = ${v.text}${d}`, markup: `${k.symbol} = ${v.markup}${d}` };
  });
}

/** The Monte Carlo comparison and its verdict alone, for a run that has no budget document beside it (a run in the browser). */
export function presentMonteCarlo(result: BudgetResult, measurandUnit?: string): Pick<ResultModel, 'monteCarlo' | 'validation'> & { unit: UnitText } {
  const unit = unitText(result.measurand.unit ?? measurandUnit);
  return {
    unit,
    monteCarlo: monteCarloView(result, unit),
    validation: result.validation ? verdictView(result.validation, unit, result.reported ?? undefined) : null,
  };
}

/** The value of every quantity the model defines, with its unit, by symbol: the intermediates and the measurand. */
export function modelValues(m: ResultModel): Record<string, string> {
  const values: Record<string, string> = Object.fromEntries(m.model.intermediates.map((q) => [q.symbol, q.value.text]));
  values[m.measurand.symbol] = withUnit(m.reported.estimate, m.measurand.unit).text;
  return values;
}

/** Builds what a reader sees of a computed budget: the single source of every figure on screen, paper and terminal. */
export function presentResult(document: BudgetDocument, stored: BudgetResult): ResultModel {
  // a result may come as it was stored, from before warnings had codes
  const result = readResult(stored);
  const { unit, monteCarlo, validation } = presentMonteCarlo(result, document.measurand.unit);
  const budget = budgetView(document, result);
  const symbols = new Set(result.gum.contributions.map((c) => c.symbol));
  return {
    measurand: { symbol: result.measurand.symbol, unit, description: document.measurand.description?.trim() ?? '' },
    reported: reportedFigures(result),
    statement: statementOf(result, unit),
    budget,
    monteCarlo,
    validation,
    warnings: result.warnings.filter((w) => ![...symbols].some((s) => concerns(w, s))).map(warningView),
    model: { text: document.model, intermediates: intermediatesView(document, result) },
    constants: constantsView(document),
    correlations: correlationsView(document),
    observations: document.inputs.flatMap((q) => (q.distribution.kind === 'observations' ? [{ symbol: q.symbol, unit: unitText(q.unit), values: q.distribution.values.map((v) => given(v)) }] : [])),
    caution: CAUTION,
  };
}
