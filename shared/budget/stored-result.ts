import type { BudgetResult } from './result';
import { WARNING_CODES, type BudgetWarning, type WarningCode } from './warnings';

/*
 * The one reader of results as they were stored. Versions are never rewritten,
 * so a result stored before warnings had codes still holds them as words
 * (`warnings: string[]`); it is read here into the shape of today's results.
 */

const KNOWN = new Set<string>(WARNING_CODES);

/** Whether the words of an old warning name the symbol as a whole word (how old warnings named their inputs). */
function names(words: string, symbol: string): boolean {
  return new RegExp(`(^|[^\\w])${symbol.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}([^\\w]|$)`).test(words);
}

/**
 * One stored warning as a `BudgetWarning`: an old one in words becomes
 * `{ code: 'recorded', message }` with the inputs its words name among
 * `symbols`; one with a code it does not know keeps its message as `recorded`.
 */
export function storedWarning(raw: unknown, symbols: readonly string[]): BudgetWarning {
  if (typeof raw === 'string') {
    const named = symbols.filter((s) => names(raw, s));
    return { code: 'recorded', message: raw, ...(named.length ? { symbols: named } : {}) };
  }
  const w = (raw ?? {}) as Partial<BudgetWarning>;
  const message = typeof w.message === 'string' ? w.message : String(raw);
  const code: WarningCode = typeof w.code === 'string' && KNOWN.has(w.code) ? w.code : 'recorded';
  return {
    code,
    message,
    ...(Array.isArray(w.symbols) ? { symbols: w.symbols.filter((s): s is string => typeof s === 'string') } : {}),
    ...(typeof w.field === 'string' ? { field: w.field } : {}),
  };
}

/** A result as stored (parsed JSON) with its warnings read by `storedWarning`; today's results come back equal. */
export function readResult(stored: BudgetResult): BudgetResult {
  const raw: unknown = (stored as { warnings?: unknown }).warnings;
  const list = Array.isArray(raw) ? raw : [];
  if (list.every((w) => typeof w === 'object' && w !== null && KNOWN.has((w as BudgetWarning).code))) return stored;
  const symbols = (stored.gum?.contributions ?? []).map((c) => c.symbol);
  return { ...stored, warnings: list.map((w) => storedWarning(w, symbols)) };
}

/** The stored text of a result, read (see `readResult`). */
export function readStoredResult(text: string): BudgetResult {
  return readResult(JSON.parse(text) as BudgetResult);
}
