/*
 * When the editor's Save button is enabled. The server computes every saved
 * version itself and refuses a budget it cannot compute, so the page's live
 * result is a preview, not a condition: a draft whose live recompute was
 * stopped after its time limit may still be saved. Every condition must
 * describe the draft on screen: while the live view still shows an earlier
 * draft, Save waits, so the button never turns on and off again for one edit.
 */

export interface SaveConditions {
  /** The draft differs from the stored version. */
  dirty: boolean;
  /** A save is on its way. */
  saving: boolean;
  /** The live view still describes an earlier draft (the page defers it while typing). */
  liveBehind: boolean;
  /** The page has a live result for this draft. */
  hasLiveResult: boolean;
  /** The page stopped the live recompute of this draft after its time limit. */
  liveStopped: boolean;
}

export interface SaveState {
  enabled: boolean;
  /** The button's tooltip: why it is disabled, or what it does. */
  title: string;
  /** Said beside the button when the draft is saved without a live result; null otherwise. */
  note: string | null;
}

/** Whether Save is enabled, with its tooltip and the note beside it. */
export function saveState(c: SaveConditions): SaveState {
  if (c.saving) return { enabled: false, title: 'Saving…', note: null };
  if (!c.dirty) return { enabled: false, title: 'Nothing to save', note: null };
  if (c.liveBehind) return { enabled: false, title: 'Checking the draft…', note: null };
  if (c.hasLiveResult) return { enabled: true, title: 'Save a new version (Ctrl+S)', note: null };
  if (c.liveStopped) {
    return {
      enabled: true,
      title: 'Save a new version (Ctrl+S); the server computes it',
      note: 'Too long to compute in the page: the server computes every saved version and refuses it if it cannot.',
    };
  }
  return { enabled: false, title: 'Fix the problems shown first', note: null };
}
