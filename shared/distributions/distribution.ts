import type { DistributionKind, DistributionOf, StatedAs } from '../budget/schema';
import type { UniformGenerator } from '../random/uniform-generator';

/** The GUM treatment of an input quantity: estimate x, standard uncertainty u(x), degrees of freedom ν (Infinity for ∞). */
export interface GumTreatment {
  estimate: number;
  standardUncertainty: number;
  dof: number;
}

/** Draws from the probability distribution assigned to an input (JCGM 101:2008 6.4). */
export interface Sampler {
  /** Fills out[0..n) with n independent draws. */
  fill(rng: UniformGenerator, out: Float64Array, n: number): void;
  /**
   * ν of the scaled and shifted t-distribution drawn (JCGM 101:2008 6.4.9);
   * absent for other distributions. The draws have a variance only for ν > 2
   * and an expectation only for ν > 1.
   */
  tDof?: number;
}

/**
 * Writes the numbers of a statement as entered (`statedValueOf` supplies it):
 * `uncertainty` in the uncertainty's own unit, followed by "of the value" when
 * that unit is relative; `value` in the value's unit.
 */
export interface StatementWriter {
  uncertainty(n: number): string;
  /** In the uncertainty's unit, without "of the value". */
  inUncertaintyUnit(n: number): string;
  value(n: number): string;
  /** A number as entered, with a true minus. */
  number(n: number): string;
  /** Four significant digits, for a divisor computed from the statement. */
  fourDigits(x: number): string;
  probability(p: number): string;
  /** The observation's standard deviation as computed, in the value's unit. */
  computed(x: number): string;
}

/** How an input of one kind was stated: the figure as entered and the divisor that makes it u (GUM 4.3). */
interface KindStatement {
  text: string;
  /** The stated figure before division (U, a, r, s, u), null for limits and constants. */
  amount: number | null;
  divisor: number | null;
  divisorText: string | null;
  coverageProbability?: number | null;
  statedDof?: number | null;
}

/** Writes the figures of an explanation step: a number to four significant digits, and the input's u(xᵢ) and νᵢ as computed. */
export interface ExplanationWriter {
  figure(x: number, sig?: number): string;
  /** u(xᵢ) written with its unit. */
  u: string;
  /** u(xᵢ) as a number. */
  standardUncertainty: number;
  /** νᵢ written (∞ for infinite). */
  nu: string;
}

/** One step of "how it was obtained": the formula, the numbers substituted, the clause it follows. */
export interface ExplanationStep {
  formula: string;
  substituted?: string;
  clause: string;
  note?: string;
}

/** The role of a form field's unit: the value's unit, the uncertainty's unit (`uncertaintyUnit` when given), or none. */
export type UnitRole = 'value' | 'uncertainty' | 'dimensionless';

/** One field of the input form of a kind, a field of the budget file. */
export interface KindFormField<K extends DistributionKind> {
  /** The field's name in the budget file (`distribution.<name>`). */
  name: Extract<keyof DistributionOf<K>, string>;
  label: string;
  unit: UnitRole;
  required: boolean;
  /** A fixed hint, or one computed from the draft (undefined: none). */
  hint?: string | ((spec: Draft<K>) => string | undefined);
  /** The hint says how to enter the field, so a reader of a locked budget does not see it. */
  hintWhileEditing?: true;
  /** The form shows and takes the field times this factor: a resolution r for the half-width a = r/2. */
  shownTimes?: number;
  /** A list of observations, entered through the observations helper rather than a number box. */
  list?: true;
}

/** A draft of a kind as the form holds it: any field may be missing or NaN while it is typed. */
export type Draft<K extends DistributionKind> = Partial<DistributionOf<K>> & { kind: K; stated?: { as: StatedAs; source?: string } };

/** One way of giving an input of a kind ("Given as"): its fields and how a draft is restated in it. */
interface KindFormWay<K extends DistributionKind> {
  id: string;
  /** The option's text in the "Given as" chooser. */
  label: string;
  fields: readonly KindFormField<K>[];
  /** Fields to set (undefined removes one) to restate the draft this way, keeping x and u where it can. */
  enter?(spec: Draft<K>): Record<string, unknown>;
  /** The way's own fields give ν (a certificate's U with p and ν), so the form offers no separate choice of ν. */
  givesDof?: true;
  /** The form the budget file records for this way (`stated.as`); it shows as "Stated as", fixed. */
  statedAs?: StatedAs;
}

/** The input form of a kind: its ways of being given (the first is the default) and its choice of ν. */
interface KindForm<K extends DistributionKind> {
  ways: readonly KindFormWay<K>[];
  /** Which way a draft is given in. */
  wayOf(spec: Draft<K>): string;
  /** The default ν as the chooser offers it and as a reader sees it; absent when ν is one of the kind's own fields. */
  dof?: { option: string; text: string; start?: number };
}

/** The default ν of a kind whose u is taken as known well (ν = ∞, GUM G.4.2), as the form's chooser offers it. */
export const KNOWN_WELL_DOF = { option: '∞: u is known well (default)', text: '∞ (u is known well)', start: 50 };

/** The kinds stated as ± a about a value. */
type HalfWidthKind = 'arcsine' | 'triangular' | 'trapezoidal' | 'curvilinear-trapezoidal';

/** The form of a kind given as a half-width ± a about a value, with the kind's own further fields; ν known well. */
export function halfWidthForm<K extends HalfWidthKind>(...further: KindFormField<K>[]): KindForm<K> {
  const field = (name: string, label: string, unit: UnitRole): KindFormField<K> => ({ name: name as KindFormField<K>['name'], label, unit, required: true });
  return {
    ways: [{ id: 'halfWidth', label: 'a half-width ± a around a value', fields: [field('value', 'Value', 'value'), field('halfWidth', 'Half-width a', 'uncertainty'), ...further] }],
    wayOf: () => 'halfWidth',
    dof: KNOWN_WELL_DOF,
  };
}

/**
 * One distribution kind of the budget file, all it means: its names, its GUM
 * treatment and Monte Carlo sampler, how it is stated, explained and entered,
 * and how it is built from an estimate and u. `registry.ts` lists them all.
 */
export interface DistributionRule<K extends DistributionKind> {
  kind: K;
  /** The long name, as offered when a kind is chosen. */
  label: string;
  /** The short name, for lists and the columns of a budget table. */
  shortLabel: string;
  /** x, u and ν before any `dof` / `relativeUncertaintyOfU` override. */
  treat(spec: DistributionOf<K>): GumTreatment;
  sampler(spec: DistributionOf<K>): Sampler;
  /** `dof` is this kind's own ν, not an override of it (so it may come with `relativeUncertaintyOfU`). */
  ownDof?: true;
  /** Refusals that involve several fields of the kind (the budget schema calls it); each names its field and says what to do. */
  check?(spec: DistributionOf<K>, fail: (field: string, message: string) => void): void;
  /** Kurtosis β₂ = μ₄/σ⁴ of the shape drawn, with ν the sampler's own (`drawnDof`, never an override); every shape is symmetric. */
  kurtosis(spec: DistributionOf<K>, drawnDof: number): number;
  /** The fields stated in `uncertaintyUnit` when one is given (values, limits and observations never are). */
  uncertaintyFields: readonly Extract<keyof DistributionOf<K>, string>[];
  /** The statement as entered and its divisor (GUM 4.3), the kind's part of `statedValueOf`. */
  statement(spec: DistributionOf<K>, write: StatementWriter): KindStatement;
  /** The step that gives u(xᵢ): its formula, numbers and clause. */
  explainU(spec: DistributionOf<K>, write: ExplanationWriter): ExplanationStep;
  /** The step that gives ν when no `dof` or `relativeUncertaintyOfU` overrides it; absent: ν = ∞. */
  explainDof?(spec: DistributionOf<K>, write: ExplanationWriter): ExplanationStep;
  form: KindForm<K>;
  /**
   * The inverse of `treat`: a distribution of this kind with estimate x and
   * standard uncertainty u (and ν where the kind carries it), with no overrides.
   */
  fromStandardUncertainty(x: number, u: number, nu: number): DistributionOf<K>;
}
