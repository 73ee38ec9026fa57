import { z } from 'zod';

/** The longest change note the server keeps with a version. */
export const NOTE_MAX_LENGTH = 2000;

/**
 * The change note of the save dialog: required after the first version (it is
 * what the version history says of the change), optional for the first,
 * whose note is then "first version".
 */
export function saveNoteForm(isNew: boolean) {
  return z.object({
    note: z
      .string()
      .max(NOTE_MAX_LENGTH, { message: `Keep the note under ${NOTE_MAX_LENGTH} characters.` })
      .refine((n) => isNew || n.trim() !== '', { message: 'Say in a few words what changed; the note goes into the version history.' }),
  });
}
export type SaveNoteForm = z.infer<ReturnType<typeof saveNoteForm>>;

/** The note sent with the save: trimmed; the first version's, when left empty, says so. */
export function noteToSave(note: string): string {
  return note.trim() || 'first version';
}
