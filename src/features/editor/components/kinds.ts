import type { Distribution, DistributionKind } from '../../../../shared/budget/schema';
import { gumTreatment, ruleOf } from '../../../../shared/distributions/registry';
import { roundSignificant } from '../../../../shared/format/significant-digits';

export { KIND_LABELS, KIND_SHORT } from '../../../../shared/format/distribution-labels';

/** Treatment of a draft distribution of a value in `unit`, or null while it is incomplete or its uncertainty unit does not fit. */
export function tryTreatment(d: Distribution, unit?: string): { estimate: number; standardUncertainty: number; dof: number } | null {
  try {
    const t = gumTreatment(d, unit);
    return Number.isFinite(t.estimate) && Number.isFinite(t.standardUncertainty) ? t : null;
  } catch {
    return null;
  }
}

/**
 * A new distribution of another kind that keeps the estimate and, where it can, the standard uncertainty
 * (u to 6 significant digits, the new kind's figures too), in the value's unit `unit`, built by the new
 * kind's rule (`fromStandardUncertainty`); the uncertainty unit and a resolution form belong to the old
 * kind and are dropped. A draft that cannot be treated yet keeps its value with u = 1.
 */
export function convertKind(d: Distribution, kind: DistributionKind, unit?: string): Distribution {
  const t = tryTreatment(d, unit);
  const value = t?.estimate ?? ('value' in d && typeof d.value === 'number' ? d.value : 0);
  const r = (x: number) => roundSignificant(x, 6);
  const u = r(t && t.standardUncertainty > 0 ? t.standardUncertainty : 1);
  const rule = ruleOf(kind);
  const built: Record<string, unknown> = { ...rule.fromStandardUncertainty(value, u, t?.dof ?? Infinity) };
  for (const name of rule.uncertaintyFields as readonly string[]) {
    if (typeof built[name] === 'number') built[name] = r(built[name] as number);
  }
  // where the figure comes from outlives the kind; a resolution is a rectangular form only
  const stated = d.stated && d.stated.as !== 'resolution' ? { stated: d.stated } : {};
  // a kind whose ν is its own field (student-t) or which has none (an exact value) takes no override of ν
  const takesOverrides = rule.form.dof !== undefined;
  const keep = takesOverrides
    ? {
        ...(d.dof !== undefined ? { dof: d.dof } : {}),
        ...(d.relativeUncertaintyOfU !== undefined ? { relativeUncertaintyOfU: d.relativeUncertaintyOfU } : {}),
      }
    : {};
  return { ...built, ...keep, ...stated } as Distribution;
}
