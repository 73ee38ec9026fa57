/**
 * The change note kept with a version: the server's save, create and import bodies take it
 * with `versionNoteField`, and the save dialog refuses a longer note before sending it.
 */
import { z } from 'zod';

/** The longest change note the server keeps with a version. */
export const VERSION_NOTE_MAX_LENGTH = 2000;

/** A note as a body carries it. */
export const versionNoteField = z.string({ error: 'must be text' }).max(VERSION_NOTE_MAX_LENGTH, { message: `must not exceed ${VERSION_NOTE_MAX_LENGTH} characters` });
