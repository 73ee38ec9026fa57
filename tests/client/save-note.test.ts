import { describe, expect, it } from 'vitest';
import { VERSION_NOTE_MAX_LENGTH } from '../../shared/api/version-note';
import { noteProblem, noteToSave } from '../../src/features/editor/save-note';

describe('the change note of the save dialog', () => {
  it('is required after the first version, blank counting as none', () => {
    expect(noteProblem('   ', false)).toMatch(/what changed/);
    expect(noteProblem('', false)).toMatch(/what changed/);
    expect(noteProblem('new certificate for the reference', false)).toBeNull();
  });

  it('is optional for the first version, which then says so', () => {
    expect(noteProblem('', true)).toBeNull();
    expect(noteToSave('  ')).toBe('first version');
    expect(noteToSave('  U from 30 nm to 25 nm ')).toBe('U from 30 nm to 25 nm');
  });

  it('is refused beyond the length the server keeps', () => {
    expect(noteProblem('x'.repeat(VERSION_NOTE_MAX_LENGTH), false)).toBeNull();
    expect(noteProblem('x'.repeat(VERSION_NOTE_MAX_LENGTH + 1), true)).toMatch(/2000 characters or fewer/);
  });
});
