import { VERSION_NOTE_MAX_LENGTH } from '../../../shared/api/version-note';

/**
 * What is wrong with the change note of the save dialog, or null: it is
 * required after the first version (it is what the version history says of
 * the change) and optional for the first, whose note is then "first version".
 */
export function noteProblem(note: string, isNew: boolean): string | null {
  if (!isNew && note.trim() === '') return 'Say in a few words what changed; the note goes into the version history.';
  if (note.length > VERSION_NOTE_MAX_LENGTH) return `Keep the note to ${VERSION_NOTE_MAX_LENGTH} characters or fewer.`;
  return null;
}

/** The note sent with the save: trimmed; the first version's, when left empty, says so. */
export function noteToSave(note: string): string {
  return note.trim() || 'first version';
}
