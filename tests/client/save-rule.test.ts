import { describe, expect, it } from 'vitest';
import { saveState } from '../../src/features/editor/save-rule';

const base = { dirty: true, saving: false, liveBehind: false, hasLiveResult: false, liveStopped: false };

describe('saveState: when the editor may save a draft', () => {
  it('saves a changed draft with a live result', () => {
    expect(saveState({ ...base, hasLiveResult: true })).toEqual({ enabled: true, title: 'Save a new version (Ctrl+S)', note: null });
  });

  it('saves a draft whose live recompute was stopped, and says the server computes it', () => {
    const s = saveState({ ...base, liveStopped: true });
    expect(s.enabled).toBe(true);
    expect(s.note).toMatch(/server computes every saved version/);
  });

  it('does not save a draft with problems, an unchanged draft, or while saving', () => {
    expect(saveState(base)).toMatchObject({ enabled: false, title: 'Fix the problems shown first' });
    expect(saveState({ ...base, dirty: false, liveStopped: true })).toMatchObject({ enabled: false, title: 'Nothing to save' });
    expect(saveState({ ...base, saving: true, hasLiveResult: true }).enabled).toBe(false);
  });

  it('waits while the live view still shows an earlier draft, even with a result or a stopped recompute on screen', () => {
    // the result on screen belongs to the draft before the edit: enabling Save on it would turn the button off again once the edit is rendered
    expect(saveState({ ...base, liveBehind: true, hasLiveResult: true })).toEqual({ enabled: false, title: 'Checking the draft…', note: null });
    expect(saveState({ ...base, liveBehind: true, liveStopped: true }).enabled).toBe(false);
    expect(saveState({ ...base, liveBehind: false, hasLiveResult: true }).enabled).toBe(true);
  });
});
