import { describe, expect, it } from 'vitest';
import { describeIgnoredLine, parseObservationText, readObservationLayout, readObservationNumber } from '../../shared/observations/parse-observations';

const lines = (...l: string[]) => l.join('\n');

describe('readObservationNumber', () => {
  it.each([
    ['50.02', '.', 50.02],
    ['50,02', ',', 50.02],
    ['1 234,5', ',', 1234.5], // SI Brochure 5.4.4: digits grouped in threes by a space
    ['1\u202f234.5', '.', 1234.5], // narrow no-break space as the group separator
    ['1,234.5', '.', 1234.5],
    ['1.234,5', ',', 1234.5],
    ['1,234,567', '.', 1234567],
    ['\u22120,5', ',', -0.5], // U+2212 minus sign
    ['-0.5', '.', -0.5],
    ['+.5', '.', 0.5],
    ['5.002e1', '.', 50.02],
    ['5,002E-1', ',', 0.5002],
    ['0,123 45', ',', 0.12345],
    ['"50,02"', ',', 50.02],
  ] as const)('%s with decimal mark %s is %d', (cell, mark, value) => {
    expect(readObservationNumber(cell, mark)).toBe(value);
  });

  it.each([
    ['1,234', '.'], // one comma group without a decimal point is the other reading's decimal comma
    ['5.002', ','],
    ['n/a', '.'],
    ['50.02 mm', '.'],
    ['1 23', '.'],
    ['1e999', '.'],
    ['', '.'],
    ['-', '.'],
  ] as const)('%s with decimal mark %s is not a number', (cell, mark) => {
    expect(readObservationNumber(cell, mark)).toBeNull();
  });
});

describe('parseObservationText', () => {
  it('reads one value per line with a decimal comma: twenty readings near 50, not forty halves', () => {
    const readings = Array.from({ length: 20 }, (_, i) => `50,0${i % 5}`);
    const r = parseObservationText(readings.join('\n'));
    expect(r.decimalMark).toBe(',');
    expect(r.separator).toBeNull();
    expect(r.values).toHaveLength(20);
    // each of 50.00 … 50.04 four times: mean 50.02
    expect(r.values.reduce((a, b) => a + b, 0) / r.values.length).toBeCloseTo(50.02, 12);
    expect(r.ignored).toEqual([]);
  });

  it('reads decimal points one per line', () => {
    expect(parseObservationText(lines('50.02', '50.03', '50.01')).values).toEqual([50.02, 50.03, 50.01]);
  });

  it('reads semicolon- and tab-separated cells with either decimal mark', () => {
    expect(parseObservationText('50.02;50.03').values).toEqual([50.02, 50.03]);
    expect(parseObservationText('50,02;50,03').values).toEqual([50.02, 50.03]);
    const tabbed = parseObservationText(lines('50,02\t50,03', '50,04\t50,05'));
    expect(tabbed.separator).toBe('\t');
    expect(tabbed.values).toEqual([50.02, 50.03, 50.04, 50.05]);
  });

  it('reads grouped digits: 1 234,5 and 1,234.5 are both 1234.5', () => {
    expect(parseObservationText(lines('1 234,5', '1 235,5')).values).toEqual([1234.5, 1235.5]);
    expect(parseObservationText(lines('1,234.5', '1,235.5')).values).toEqual([1234.5, 1235.5]);
  });

  it('takes one comma in a number with no other separator as a decimal comma, even before three digits', () => {
    expect(parseObservationText(lines('20,003', '20,004')).values).toEqual([20.003, 20.004]);
  });

  it('splits at commas only when that reads more cells: 50.02,50.03 is two values', () => {
    const r = parseObservationText(lines('50.02,50.03', '50.04,50.05'));
    expect(r.separator).toBe(',');
    expect(r.values).toEqual([50.02, 50.03, 50.04, 50.05]);
  });

  it('takes a comma heading with as many commas as every line as column names', () => {
    const layout = readObservationLayout(lines('index,reading', '1,5', '2,7'));
    expect(layout.separator).toBe(',');
    expect(layout.rows.map((r) => r.cells)).toEqual([
      ['index', 'reading'],
      ['1', '5'],
      ['2', '7'],
    ]);
  });

  it('skips blank lines silently and reports every other line it ignored, with its number and why', () => {
    const r = parseObservationText(lines('Reading (mm)', '', '50,02', 'n/a', '   ', '50,04', '\u22120,5e1', '50,03 mm'));
    expect(r.values).toEqual([50.02, 50.04, -5]);
    expect(r.ignored.map(describeIgnoredLine)).toEqual(['line 1: "Reading (mm)" is not a number (read as a heading)', 'line 4: "n/a" is not a number', 'line 8: "50,03 mm" is not a number']);
  });

  it('reports each unreadable cell of a line', () => {
    const r = parseObservationText(lines('50.02;x;50.03', '50.04;;y'));
    expect(r.values).toEqual([50.02, 50.03, 50.04]);
    expect(r.ignored.map(describeIgnoredLine)).toEqual(['line 1: "x" is not a number', 'line 2: "y" is not a number']);
  });

  it('refuses to guess when decimal points and decimal commas are mixed', () => {
    const r = parseObservationText(lines('50.02', '50,03'));
    expect(r.values).toEqual([]);
    expect(r.ambiguity).toMatch(/mixes decimal points and decimal commas/);
    expect(r.ambiguity).toMatch(/line 1/);
  });

  it('gives nothing for empty text', () => {
    const r = parseObservationText('  \n\n');
    expect(r.values).toEqual([]);
    expect(r.ignored).toEqual([]);
    expect(r.ambiguity).toBeNull();
  });
});

describe('quoted cells (RFC 4180 quoting)', () => {
  it('reads a semicolon file of quoted decimal commas under a quoted heading', () => {
    const r = parseObservationText(lines('"Reading";"Temp"', '"50,02";"20,1"', '"50,03";"20,2"'));
    expect([r.separator, r.decimalMark]).toEqual([';', ',']);
    expect(r.values).toEqual([50.02, 20.1, 50.03, 20.2]);
    expect(r.ignored).toEqual([{ line: 1, reason: '"Reading", "Temp" are not numbers (read as a heading)' }]);
  });

  it('reads digit groups and decimal commas in a semicolon file, quoted or not', () => {
    expect(parseObservationText(lines('1 234,5;1 235,5', '1 236,5;"1 237,5"')).values).toEqual([1234.5, 1235.5, 1236.5, 1237.5]);
  });

  it('keeps a separator inside quotes within its cell', () => {
    const layout = readObservationLayout(lines('"Reading, mm",Temp', '50.02,20.1', '50.03,20.2'));
    expect(layout.separator).toBe(',');
    expect(layout.rows.map((r) => r.cells)).toEqual([
      ['Reading, mm', 'Temp'],
      ['50.02', '20.1'],
      ['50.03', '20.2'],
    ]);
  });

  it('a quote left open joins no lines: every later line keeps its number', () => {
    const r = parseObservationText(lines('x;"50,02', '50,03;1', '', '50,04;n/a'));
    expect(r.values).toEqual([50.02, 50.03, 1, 50.04]);
    expect(r.ignored.map((l) => l.line)).toEqual([1, 4]);
  });
});
