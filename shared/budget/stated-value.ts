import type { InputQuantity, StatedAs } from './schema';
import type { StatementWriter } from '../distributions/distribution';
import { gumTreatment, ruleFor } from '../distributions/registry';
import { uncertaintyScale } from '../distributions/uncertainty-unit';
import { significant, writeNumeral } from '../format/significant-digits';
import { withTrueMinus } from '../format/signs';
import { superscript } from '../format/superscript';
import { unitPieces, writeUnit } from '../format/unit-symbols';
import { probability } from '../presentation/figures';

/**
 * An input as the laboratory stated it, for the budget table, the result card,
 * the report and the command line: the stated figure with its unit as entered,
 * the divisor that turns it into the standard uncertainty, and that u in the
 * value's unit. Every renderer calls `statedValueOf`, so all show the same.
 */
export interface StatedValue {
  /** The form the budget file records (`distribution.stated.as`), null when it records none. */
  as: StatedAs | null;
  /** Where the figure comes from (a certificate number), null when not recorded. */
  source: string | null;
  /** The statement as plain text with the numbers as entered: "U = 12 mK, k = 2", "r = 0.01 mm (a = r/2)", "± 5 ppm of the value". */
  text: string;
  /** The stated figure before division, as entered (U, a, r, s, u), null for limits and constants. */
  amount: number | null;
  /** The unit of `amount` as written in the file: `uncertaintyUnit`, else the value's unit. */
  amountUnit: string | undefined;
  /** Whether `amount` is relative to |value| (`%`, `ppm`, `ppb` for a value with a dimension). */
  relative: boolean;
  /** u = amount (in the value's unit) / divisor; null for a constant. */
  divisor: number | null;
  /** The divisor as a table writes it: "2", "√3", "2√3", "√10", or the number to 4 significant digits. */
  divisorText: string | null;
  /** For U stated with p: the coverage probability and the ν it was read with (null = ∞); k is then the divisor. */
  coverageProbability: number | null;
  /** ν stated with U (`dof`), null when not stated. */
  statedDof: number | null;
  /** u(x) in the unit of the value, after any conversion of `uncertaintyUnit` (GUM 4.3). */
  standardUncertainty: number;
}

const asEntered = (n: number) => withTrueMinus(String(n));
const unitText = (unit: string | undefined) => writeUnit(unitPieces(unit), superscript);
const withUnit = (n: number, unit: string | undefined) => {
  const u = unitText(unit);
  return u ? `${asEntered(n)} ${u}` : asEntered(n);
};
const fourDigits = (x: number) => writeNumeral(significant(x, 4), superscript);

/**
 * The stated value of an input (GUM 4.3): each kind's rule writes its
 * statement and divisor (`statement`: U/k for a certificate (4.3.3), a/√3 for
 * limits ± a (4.3.7), r/(2√3) for a resolution r (F.2.2.1), a/√6 triangular
 * (4.3.9), s/√n for n readings (4.2.3)); this adds the unit as entered and
 * whether it is relative to the value. The standard uncertainty is the engine's own
 * (`gumTreatment`), in the value's unit. Throws the engine's refusal for an
 * input it cannot treat (an uncertainty unit of the wrong kind).
 */
export function statedValueOf(input: InputQuantity): StatedValue {
  const d = input.distribution;
  const standardUncertainty = gumTreatment(d, input.unit).standardUncertainty;
  const amountUnit = d.uncertaintyUnit ?? input.unit;
  // gumTreatment has refused a unit that cannot be converted, so the scale exists here.
  const relative = d.uncertaintyUnit !== undefined && uncertaintyScale(d.uncertaintyUnit, input.unit).relative;
  const of = relative ? ' of the value' : '';
  const base = {
    as: d.stated?.as ?? null,
    source: d.stated?.source ?? null,
    amountUnit,
    relative,
    standardUncertainty,
  };
  const write: StatementWriter = {
    uncertainty: (n) => `${withUnit(n, amountUnit)}${of}`,
    inUncertaintyUnit: (n) => withUnit(n, amountUnit),
    value: (n) => withUnit(n, input.unit),
    number: asEntered,
    fourDigits,
    probability: (p) => probability(p).text,
    computed: (x) => `${writeNumeral(significant(x, 3), superscript)}${unitText(input.unit) ? ` ${unitText(input.unit)}` : ''}`,
  };
  const { coverageProbability, statedDof, ...statement } = ruleFor(d).statement(d, write);
  return { ...base, ...statement, coverageProbability: coverageProbability ?? null, statedDof: statedDof ?? null };
}
