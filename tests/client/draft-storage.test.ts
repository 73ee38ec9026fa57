import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { newDocument } from '../../src/features/editor/draft';
import { clearDraft, loadDraft, storeDraft, type StoredDraft } from '../../src/features/editor/draft-storage';

/** The browser's storage as far as the drafts use it, held in a Map. */
class MemoryStorage {
  readonly items = new Map<string, string>();
  full = false;
  getItem(k: string) {
    return this.items.get(k) ?? null;
  }
  setItem(k: string, v: string) {
    if (this.full) throw new DOMException('quota exceeded', 'QuotaExceededError');
    this.items.set(k, v);
  }
  removeItem(k: string) {
    this.items.delete(k);
  }
}

let storage: MemoryStorage;
beforeEach(() => {
  storage = new MemoryStorage();
  vi.stubGlobal('localStorage', storage);
});
afterEach(() => vi.unstubAllGlobals());

const draft = (title: string, baseVersion = 2): StoredDraft => ({ document: { ...newDocument('k0k0k0'), title }, baseVersion, savedAt: 1_700_000_000_000 });

describe('draft storage: unsaved work kept in the browser', () => {
  it('gives back the draft stored for a budget, as stored', () => {
    storeDraft(7, draft('Thermometer at 20 °C'));
    expect(loadDraft(7)).toEqual(draft('Thermometer at 20 °C'));
  });

  it('keeps one draft per budget and one for the new budget, apart', () => {
    storeDraft(7, draft('seven'));
    storeDraft(8, draft('eight'));
    storeDraft(undefined, draft('new', 0));
    expect(loadDraft(7)?.document.title).toBe('seven');
    expect(loadDraft(8)?.document.title).toBe('eight');
    expect(loadDraft(undefined)?.document.title).toBe('new');
  });

  it('replaces a budget’s draft with the later one', () => {
    storeDraft(7, draft('first'));
    storeDraft(7, draft('second'));
    expect(loadDraft(7)?.document.title).toBe('second');
  });

  it('forgets a draft once cleared, and only that one', () => {
    storeDraft(7, draft('seven'));
    storeDraft(8, draft('eight'));
    clearDraft(7);
    expect(loadDraft(7)).toBeNull();
    expect(loadDraft(8)?.document.title).toBe('eight');
  });

  it('has nothing for a budget with no draft', () => {
    expect(loadDraft(42)).toBeNull();
  });

  it('ignores a stored draft it cannot read instead of opening it', () => {
    const corrupt = [
      '{"document": {"title": "cut off',
      'null',
      '42',
      '"text"',
      '[]',
      '{}',
      '{"document": {"title": "x"}, "baseVersion": 1, "savedAt": 1}',
      '{"document": {"inputs": []}, "baseVersion": "1", "savedAt": 1}',
      '{"document": {"inputs": []}, "baseVersion": 1}',
    ];
    for (const text of corrupt) {
      storage.items.set('dubito.draft.7', text);
      expect(loadDraft(7), text).toBeNull();
    }
  });

  it('keeps working when the storage is full or missing: nothing kept, nothing thrown', () => {
    storage.full = true;
    expect(() => storeDraft(7, draft('seven'))).not.toThrow();
    expect(loadDraft(7)).toBeNull();
    vi.stubGlobal('localStorage', undefined);
    expect(() => storeDraft(7, draft('seven'))).not.toThrow();
    expect(loadDraft(7)).toBeNull();
    expect(() => clearDraft(7)).not.toThrow();
  });
});
