import { DEFAULTS } from '../../../shared/budget/limits';
import type { BudgetDocument, InputQuantity } from '../../../shared/budget/schema';
import type { StoredDraft } from './draft-storage';
import type { Problem } from './live';

/*
 * What the editor makes of the draft on screen: whether it differs from the
 * stored version, whether a draft kept in the browser is worth offering, the
 * next input to add, and which problems have no field of their own to sit by.
 */

/** The starting document of a new budget: two inputs and a model that adds them, the budget file's default trials and a seed of its own. */
export function newDocument(seedSuffix: string = Math.random().toString(36).slice(2, 8)): BudgetDocument {
  return {
    format: 'dubito-budget/1',
    title: 'New budget',
    measurand: { symbol: 'y', unit: undefined, description: '' },
    model: 'y = x1 + x2',
    inputs: [
      { symbol: 'x1', description: 'first input quantity', distribution: { kind: 'normal', value: 1, u: 0.01 } },
      { symbol: 'x2', description: 'second input quantity', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.01 } },
    ],
    coverageProbability: 0.95,
    monteCarlo: { trials: DEFAULTS.trials, seed: `${DEFAULTS.seed}-${seedSuffix}` },
  };
}

/** The stored form a draft is compared by: the document as JSON, fields in the order the editor keeps them. */
export function documentText(doc: BudgetDocument): string {
  return JSON.stringify(doc);
}

/**
 * Whether the draft has something to save: it differs from the stored version
 * (`stored`, its documentText), or there is no stored version yet (`stored` is
 * empty: a new budget is always unsaved).
 */
export function isUnsaved(doc: BudgetDocument, stored: string): boolean {
  return stored === '' ? true : documentText(doc) !== stored;
}

/**
 * The draft kept in the browser to offer when the editor opens: none over a
 * past version (read-only), none when it is the document on screen already.
 */
export function draftToOffer(kept: StoredDraft | null, onScreen: BudgetDocument, viewingOld: boolean): StoredDraft | null {
  if (viewingOld || !kept) return null;
  return documentText(kept.document) !== documentText(onScreen) ? kept : null;
}

/** The version a kept draft started from when the budget has moved on since; null when it has not (or it was a new budget). */
export function draftStartedBehind(kept: StoredDraft, currentVersion: number | undefined): number | null {
  return kept.baseVersion && currentVersion !== undefined && kept.baseVersion < currentVersion ? kept.baseVersion : null;
}

/** A new input quantity: x<n> after the last, skipping symbols in use, normal with u = 1 around 0. */
export function newInput(inputs: readonly InputQuantity[]): InputQuantity {
  const used = new Set(inputs.map((q) => q.symbol));
  let n = inputs.length + 1;
  while (used.has(`x${n}`)) n++;
  return { symbol: `x${n}`, distribution: { kind: 'normal', value: 0, u: 1 } };
}

/** The problem of the model text, shown in the model editor. */
export function modelProblem(problems: readonly Problem[]): Problem | null {
  return problems.find((p) => p.field === 'model') ?? null;
}

/** Problems with no field of their own on the page (the whole budget, the Monte Carlo settings, the list of inputs, the title…): listed above the budget table. */
export function generalProblems(problems: readonly Problem[]): Problem[] {
  return problems.filter((p) => !p.field || p.field === 'monteCarlo' || p.field.startsWith('coverageProbability') || p.field === 'inputs' || p.field === 'title');
}
