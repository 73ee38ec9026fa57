import { describe, expect, it } from 'vitest';
import { parseObservations } from '../../server/uploads/observations';
import { ValidationError } from '../../server/http/errors';

/* The CSV upload reads its cells with the same reader as the editor's paste box. */
describe('observations CSV with the shared reader', () => {
  it('reads one column of decimal commas as 20 readings, not 40 integers', () => {
    const text = Array.from({ length: 20 }, (_, i) => `50,0${i % 5}`).join('\r\n');
    const r = parseObservations(text);
    expect(r.values).toHaveLength(20);
    expect(r.values.reduce((a, b) => a + b, 0) / 20).toBeCloseTo(50.02, 12);
    expect(r.errors).toEqual([]);
  });

  it('picks a named column of a semicolon file with decimal commas, reporting rows by their line in the file', () => {
    const r = parseObservations('Reading;Temp\n50,02;20,1\n\nn/a;20,2\n50,03;20,3\n', 'Reading');
    expect(r.header).toBe(true);
    expect(r.values).toEqual([50.02, 50.03]);
    expect(r.errors).toEqual([{ row: 4, message: '"n/a" is not a number' }]);
  });

  it('reads comma-separated columns under a comma heading', () => {
    const r = parseObservations('index,reading\n1,5.5\n2,7.25\n', 'reading');
    expect(r.values).toEqual([5.5, 7.25]);
  });

  it('refuses a file that mixes decimal points and decimal commas', () => {
    expect(() => parseObservations('50.02\n50,03\n')).toThrow(ValidationError);
    expect(() => parseObservations('50.02\n50,03\n')).toThrow(/mixes decimal points and decimal commas/);
  });

  it('picks a quoted heading that holds the separator and an escaped quote', () => {
    const comma = parseObservations('"Reading, mm",Temp\n50.02,20.1\n50.03,20.2\n', 'Reading, mm');
    expect(comma.columns).toEqual(['Reading, mm', 'Temp']);
    expect(comma.values).toEqual([50.02, 50.03]);
    const quoted = parseObservations('"the ""first"" reading";Temp\n"50,02";20,1\n\n"n/a";20,2\n50,03;20,3\n', 'the "first" reading');
    expect(quoted.values).toEqual([50.02, 50.03]);
    expect(quoted.errors).toEqual([{ row: 4, message: '"n/a" is not a number' }]);
  });
});
