import type { InputQuantity, StatedAs } from './schema';
import { gumTreatment } from '../distributions/registry';
import { normalCoverageFactor } from '../distributions/normal';
import { experimentalStandardDeviation } from '../distributions/type-a';
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
 * The stated value of an input (GUM 4.3: the divisor of each form: U/k for a
 * certificate (4.3.3), a/√3 for limits ± a (4.3.7), r/(2√3) for a resolution r
 * (F.2.2.1), a/√6 triangular (4.3.9), s/√n for n readings (4.2.3)); where U
 * comes with p instead of k, the divisor is k = t_{(1+p)/2}(ν) or z_{(1+p)/2}
 * (`normalCoverageFactor`). The standard uncertainty is the engine's own
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
    coverageProbability: null as number | null,
    statedDof: null as number | null,
    standardUncertainty,
  };
  const stated = (text: string, amount: number | null, divisor: number | null, divisorText: string | null): StatedValue => ({
    ...base,
    text,
    amount,
    divisor,
    divisorText,
  });
  switch (d.kind) {
    case 'normal': {
      if (d.u !== undefined) return stated(`u = ${withUnit(d.u, amountUnit)}${of}`, d.u, 1, '1');
      const k = normalCoverageFactor(d) as number;
      const U = d.U as number;
      if (d.p !== undefined) {
        const nu = d.dof !== undefined ? `, ν = ${asEntered(d.dof)}` : '';
        const rule = d.dof !== undefined ? 't' : 'normal';
        return {
          ...stated(`U = ${withUnit(U, amountUnit)}${of}, p = ${probability(d.p).text}${nu} (k = ${fourDigits(k)}, ${rule})`, U, k, fourDigits(k)),
          coverageProbability: d.p,
          statedDof: d.dof ?? null,
        };
      }
      const nu = d.dof !== undefined ? `, ν = ${asEntered(d.dof)}` : '';
      return { ...stated(`U = ${withUnit(U, amountUnit)}${of}, k = ${asEntered(k)}${nu}`, U, k, asEntered(k)), statedDof: d.dof ?? null };
    }
    case 'rectangular': {
      if (d.halfWidth === undefined) {
        const lower = d.lower as number;
        const upper = d.upper as number;
        return stated(`from ${withUnit(lower, input.unit)} to ${withUnit(upper, input.unit)}`, null, Math.sqrt(3), '√3');
      }
      if (d.stated?.as === 'resolution') {
        return stated(`r = ${withUnit(2 * d.halfWidth, amountUnit)}${of} (a = r/2)`, 2 * d.halfWidth, 2 * Math.sqrt(3), '2√3');
      }
      return stated(`± ${withUnit(d.halfWidth, amountUnit)}${of}`, d.halfWidth, Math.sqrt(3), '√3');
    }
    case 'triangular':
      return stated(`± ${withUnit(d.halfWidth, amountUnit)}${of}`, d.halfWidth, Math.sqrt(6), '√6');
    case 'arcsine':
      return stated(`± ${withUnit(d.halfWidth, amountUnit)}${of}`, d.halfWidth, Math.SQRT2, '√2');
    case 'trapezoidal': {
      const divisor = Math.sqrt(6 / (1 + d.beta * d.beta));
      return stated(`± ${withUnit(d.halfWidth, amountUnit)}${of}, β = ${asEntered(d.beta)}`, d.halfWidth, divisor, fourDigits(divisor));
    }
    case 'curvilinear-trapezoidal': {
      // u = √(a²/3 + d²/9): the divisor of a depends on d/a, so it is given as a number.
      const divisor = Math.sqrt(1 / (1 / 3 + (d.halfWidthUncertainty / d.halfWidth) ** 2 / 9));
      return stated(
        `± ${withUnit(d.halfWidth, amountUnit)}${of}, limits known to ± ${withUnit(d.halfWidthUncertainty, amountUnit)}`,
        d.halfWidth,
        divisor,
        fourDigits(divisor),
      );
    }
    case 'student-t':
      return { ...stated(`s = ${withUnit(d.scale, amountUnit)}${of}, ν = ${asEntered(d.dof)}`, d.scale, 1, '1'), statedDof: d.dof };
    case 'observations': {
      const n = d.values.length;
      const pooled = d.pooledSd !== undefined;
      const s = pooled ? (d.pooledSd as number) : experimentalStandardDeviation(d.values);
      const text = pooled
        ? `${n} readings, pooled s = ${withUnit(s, amountUnit)}${of} (ν = ${asEntered(d.pooledDof as number)})`
        : `${n} readings, s = ${writeNumeral(significant(s, 3), superscript)}${unitText(input.unit) ? ` ${unitText(input.unit)}` : ''}`;
      return stated(text, s, Math.sqrt(n), `√${n}`);
    }
    case 'constant':
      return stated(`${withUnit(d.value, input.unit)}, exact`, null, null, null);
  }
}
