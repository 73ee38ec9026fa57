import type { Distribution } from '../budget/schema';
import { given, plainFigure, uncertainty, type Figure } from './figures';
import { withUnit, type UnitText } from './units';

/*
 * How an input's uncertainty was stated (a certificate's U and k, a limit ±a,
 * n readings) and the divisor that turns that statement into a standard
 * uncertainty, as a budget written by hand shows them.
 */

const join = (parts: Figure[], sep = ', '): Figure => ({
  text: parts.map((p) => p.text).join(sep),
  markup: parts.map((p) => p.markup).join(sep),
  value: null,
});

const labelled = (label: string, f: Figure, unit?: UnitText): Figure => {
  const g = unit ? withUnit(f, unit) : f;
  return { text: `${label}${g.text}`, markup: `${label}${g.markup}`, value: f.value };
};

/** The value of an input's uncertainty as stated in the budget file: "U = 0.010 °C, k = 2", "± 0.008 °C", "4 readings, s = 0.0080 °C" (s, the experimental standard deviation of the readings, GUM 4.2.2). */
export function statedAs(d: Distribution, unit: UnitText, standardUncertainty?: number): Figure {
  const dof = d.dof !== undefined && d.kind !== 'student-t' ? [labelled('ν = ', given(d.dof))] : d.relativeUncertaintyOfU !== undefined ? [labelled('Δu/u = ', given(d.relativeUncertaintyOfU))] : [];
  switch (d.kind) {
    case 'normal':
      return join([...(d.u !== undefined ? [labelled('u = ', given(d.u), unit)] : [labelled('U = ', given(d.U ?? NaN), unit), labelled('k = ', given(d.k ?? NaN))]), ...dof]);
    case 'rectangular':
      return join([
        d.halfWidth !== undefined ? labelled('± ', given(d.halfWidth), unit) : join([labelled('', given(d.lower ?? NaN), unit), labelled('', given(d.upper ?? NaN), unit)], ' to '),
        ...dof,
      ]);
    case 'triangular':
    case 'arcsine':
      return join([labelled('± ', given(d.halfWidth), unit), ...dof]);
    case 'trapezoidal':
      return join([labelled('± ', given(d.halfWidth), unit), labelled('β = ', given(d.beta)), ...dof]);
    case 'curvilinear-trapezoidal':
      return join([labelled('± ', given(d.halfWidth), unit), labelled('limits ± ', given(d.halfWidthUncertainty), unit), ...dof]);
    case 'student-t':
      return join([labelled('s = ', given(d.scale), unit), labelled('ν = ', given(d.dof))]);
    case 'observations':
      return join([
        plainFigure(`${d.values.length} readings`),
        ...(d.pooledSd !== undefined
          ? [labelled('pooled s = ', given(d.pooledSd), unit), labelled('ν = ', given(d.pooledDof ?? NaN))]
          : standardUncertainty !== undefined
            ? [labelled('s = ', uncertainty(standardUncertainty * Math.sqrt(d.values.length)), unit)]
            : []),
      ]);
    case 'constant':
      return plainFigure('exact');
  }
}

/**
 * The divisor between the stated value and u(x_i): k for an expanded uncertainty (GUM 4.3.3),
 * √3, √6, √2 for rectangular, triangular, arcsine limits (GUM 4.3.7, 4.3.9; JCGM 101 6.4.6),
 * √(6/(1 + β²)) for trapezoidal limits (GUM 4.3.9), √n for the mean of n readings (GUM 4.2.3);
 * "1" when u was stated directly, "—" where no single divisor exists.
 */
export function divisor(d: Distribution): Figure {
  switch (d.kind) {
    case 'normal':
      return d.u !== undefined ? plainFigure('1', 1) : given(d.k ?? NaN);
    case 'rectangular':
      return plainFigure('√3', Math.sqrt(3));
    case 'triangular':
      return plainFigure('√6', Math.sqrt(6));
    case 'arcsine':
      return plainFigure('√2', Math.sqrt(2));
    case 'trapezoidal':
      return d.beta === 0 ? plainFigure('√6', Math.sqrt(6)) : plainFigure(`√(6/(1 + ${given(d.beta).text}²))`, Math.sqrt(6 / (1 + d.beta ** 2)));
    case 'student-t':
      return plainFigure('1', 1);
    case 'observations':
      return plainFigure(`√${d.values.length}`, Math.sqrt(d.values.length));
    case 'curvilinear-trapezoidal':
    case 'constant':
      return plainFigure('—');
  }
}
