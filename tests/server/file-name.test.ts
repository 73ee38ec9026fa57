import { describe, expect, it } from 'vitest';
import { fileStem } from '../../server/budgets/file-name';

// The export and the PDF report name their downloads with this one rule.
describe('fileStem', () => {
  it('keeps letters, digits and dashes, folding accents and spaces', () => {
    expect(fileStem('Résistance 10 kΩ — bain à 23 °C')).toBe('resistance-10-k-bain-a-23-c');
  });

  it('cuts at 80 characters without leaving a dash at the end', () => {
    // 79 letters, a space, then more: the cut falls on the dash the space became
    const title = `${'a'.repeat(79)} tail`;
    expect(fileStem(title)).toBe('a'.repeat(79));
    expect(fileStem('b'.repeat(200))).toHaveLength(80);
  });

  it('names a title with nothing usable "budget"', () => {
    // Greek letters and signs are not ASCII word characters
    expect(fileStem('µ °Ω')).toBe('budget');
  });
});
