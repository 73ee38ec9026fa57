import { describe, expect, it } from 'vitest';
import { NOTE_MAX_LENGTH, noteToSave, saveNoteForm } from '../../src/features/editor/save-note';

describe('the change note of the save dialog', () => {
  it('is required after the first version, blank counting as none', () => {
    const r = saveNoteForm(false).safeParse({ note: '   ' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].message).toMatch(/what changed/);
    expect(saveNoteForm(false).safeParse({ note: 'new certificate for the reference' }).success).toBe(true);
  });

  it('is optional for the first version, which then says so', () => {
    expect(saveNoteForm(true).safeParse({ note: '' }).success).toBe(true);
    expect(noteToSave('  ')).toBe('first version');
    expect(noteToSave('  U from 30 nm to 25 nm ')).toBe('U from 30 nm to 25 nm');
  });

  it('is refused beyond the length the server keeps', () => {
    expect(saveNoteForm(true).safeParse({ note: 'x'.repeat(NOTE_MAX_LENGTH) }).success).toBe(true);
    expect(saveNoteForm(true).safeParse({ note: 'x'.repeat(NOTE_MAX_LENGTH + 1) }).success).toBe(false);
  });
});
