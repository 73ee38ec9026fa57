import { describe, expect, it } from 'vitest';
import { groupDigits, groupNumbersIn } from '../../shared/format/digit-groups';
import { budgetKindLabel, KIND_LABELS, KIND_SHORT } from '../../shared/format/distribution-labels';
import { atPlace, significant, writeNumeral } from '../../shared/format/significant-digits';
import { superscript } from '../../shared/format/superscript';
import { ratioPieces, unitPieces, unitSymbol, writeUnit } from '../../shared/format/unit-symbols';
import { count, estimate, significantFigure, uncertainty } from '../../shared/presentation/figures';
import { unitText } from '../../shared/presentation/units';
import * as print from '../../server/reports/typeset';
import * as screenUnits from '../../src/app/ui/units';

const S = '\u202f'; // narrow no-break space
const screen = (unit: string) => writeUnit(unitPieces(unit), superscript);
const markup = (unit: string) => writeUnit(unitPieces(unit), (e) => `^{${e}}`);

describe('unit symbols (SI Brochure 5.4.3, 5.4.6)', () => {
  it('writes the symbols of unit names', () => {
    expect(unitSymbol('um')).toBe('µm');
    expect(unitSymbol('μm')).toBe('µm');
    expect(unitSymbol('degC')).toBe('°C');
    expect(unitSymbol('ohm')).toBe('Ω');
    expect(unitSymbol('uohm')).toBe('µΩ');
    expect(unitSymbol('kohm')).toBe('kΩ');
    expect(unitSymbol('furlong')).toBe('furlong');
  });

  it('cuts expressions into pieces with exponents', () => {
    expect(unitPieces('m^3')).toEqual([{ text: 'm', exponent: '3' }]);
    expect(unitPieces('1/degC')).toEqual([{ text: '°C', exponent: '−1' }]);
    expect(unitPieces('J s')).toEqual([{ text: 'J' }, { text: '·' }, { text: 's' }]);
    expect(unitPieces('1')).toEqual([]);
    expect(unitPieces('')).toEqual([]);
    expect(unitPieces(undefined)).toEqual([]);
  });

  it('joins pieces with superscripts for the screen', () => {
    expect(screen('um')).toBe('µm');
    expect(screen('degC')).toBe('°C');
    expect(screen('kg/m^3')).toBe('kg/m³');
    expect(screen('ohm')).toBe('Ω');
    expect(screen('1/degC')).toBe('°C⁻¹');
    expect(screen('J s')).toBe('J·s');
    expect(screen('W m^-2 K^-4')).toBe('W·m⁻²·K⁻⁴');
    expect(screen('J/(mol K)')).toBe('J/(mol·K)');
    expect(screen('m^(-2)')).toBe('m⁻²');
    expect(screen('m^0.5')).toBe('m⁰.⁵');
  });

  it('joins pieces with raise markup for print', () => {
    expect(markup('m^3')).toBe('m^{3}');
    expect(markup('kg/m^3')).toBe('kg/m^{3}');
    expect(markup('1/degC')).toBe('°C^{−1}');
    expect(markup('m s^-2')).toBe('m·s^{−2}');
  });

  it('writes the unit of a ratio, cancelling and inverting', () => {
    const ratio = (n: string | undefined, d: string | undefined) => writeUnit(ratioPieces(n, d), superscript);
    expect(ratio('mm', 'degC')).toBe('mm/°C');
    expect(ratio('mm', '1/degC')).toBe('mm·°C');
    expect(ratio('mm', 'mm')).toBe('');
    expect(ratio('mm', undefined)).toBe('mm');
    expect(ratio(undefined, 'degC')).toBe('1/°C');
    expect(ratio('mm', 'J s')).toBe('mm/(J·s)');
    expect(ratio('m/s', 'K')).toBe('(m/s)/K');
    expect(ratio('m', '1/(m s)')).toBe('m·(m·s)');
  });
});

describe('digit groups (SI Brochure 5.4.4)', () => {
  it('groups in threes on both sides of the decimal marker with a narrow no-break space', () => {
    expect(groupDigits('12345.6789012')).toBe(`12${S}345.678${S}901${S}2`);
    // four digits on one side of the marker stay together (SI Brochure 5.4.4)
    expect(groupDigits('12345.6789')).toBe(`12${S}345.6789`);
    expect(groupDigits('-12345.678901')).toBe(`−12${S}345.678${S}901`);
    expect(groupDigits('1234.5678')).toBe('1234.5678');
    expect(groupDigits('1e-7')).toBe('1e−7');
    expect(groupNumbersIn('k = 2, U = 12345.5 and x_1')).toBe(`k = 2, U = 12${S}345.5 and x_1`);
    expect(count(200000.4).text).toBe(`200${S}000`);
  });
});

describe('significant digits and the place of the uncertainty (GUM 7.2.6)', () => {
  const sup = (n: ReturnType<typeof significant>) => writeNumeral(n, superscript);
  it('writes significant digits, with a power of ten outside 10⁻³ … 10⁶', () => {
    expect(sup(significant(3.14159))).toBe('3.14');
    expect(sup(significant(1.23e-7, 2))).toBe('1.2×10⁻⁷');
    expect(writeNumeral(significant(1.23e-7, 2), (e) => `^{${e}}`)).toBe('1.2×10^{−7}');
    expect(sup(significant(-Infinity))).toBe('−∞');
    expect(sup(significant(NaN))).toBe('—');
  });

  it('writes a number at a decimal place, zero included', () => {
    expect(sup(atPlace(12.3456, -2))).toBe('12.35');
    expect(sup(atPlace(0, -3))).toBe('0.000');
    expect(sup(atPlace(1.5e-9, -10))).toBe('1.5×10⁻⁹');
  });

  it('rounds an uncertainty to two significant digits and the value to its place', () => {
    expect(uncertainty(0.0996).text).toBe('0.10');
    expect(uncertainty(0.012345).text).toBe('0.012');
    expect(estimate(12345.678901, 0.0012).text).toBe(`12${S}345.6789`);
    expect(estimate(10.000003456, 0.0000025).text).toBe(`10.000${S}003${S}5`);
  });
});

describe('distribution labels', () => {
  it('names every kind, short and long', () => {
    expect(Object.keys(KIND_SHORT).sort()).toEqual(Object.keys(KIND_LABELS).sort());
    expect(KIND_LABELS.rectangular).toBe('Rectangular (uniform)');
    expect(budgetKindLabel('curvilinear-trapezoidal')).toBe('curv. trapezoidal');
    expect(budgetKindLabel('student-t')).toBe('scaled t');
    expect(budgetKindLabel('observations', 10)).toBe('Type A, n = 10');
  });
});

describe('both renderers adapt the same formatting', () => {
  it('screen and print agree once markup is made plain', () => {
    for (const u of ['um', 'degC', 'kg/m^3', 'ohm', '1/degC', 'J s', 'm s^-2']) expect(print.plainText(unitText(u).markup)).toBe(screenUnits.formatUnit(u));
    for (const x of [12345.678901, 1.23e-7, 0, -4.5e9]) {
      expect(print.plainText(significantFigure(x, 4).markup).replace(/ /g, S)).toBe(significantFigure(x, 4).text);
      expect(print.plainText(estimate(x, 3.4e-8).markup).replace(/ /g, S)).toBe(estimate(x, 3.4e-8).text);
    }
  });
});
