import type { Distribution, DistributionKind } from '../../../../shared/budget/schema';
import { gumTreatment } from '../../../../shared/distributions/registry';
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
 * A new distribution of another kind that keeps the estimate and, where it can, the standard uncertainty,
 * in the value's unit `unit`; the uncertainty unit and a resolution form belong to the old kind and are dropped.
 */
export function convertKind(d: Distribution, kind: DistributionKind, unit?: string): Distribution {
  const t = tryTreatment(d, unit);
  const value = t?.estimate ?? ('value' in d && typeof d.value === 'number' ? d.value : 0);
  const u = t && t.standardUncertainty > 0 ? t.standardUncertainty : 1;
  // where the figure comes from outlives the kind; a resolution is a rectangular form only
  const stated = d.stated && d.stated.as !== 'resolution' ? { stated: d.stated } : {};
  const keep = {
    ...(d.dof !== undefined && kind !== 'student-t' ? { dof: d.dof } : {}),
    ...(d.relativeUncertaintyOfU !== undefined ? { relativeUncertaintyOfU: d.relativeUncertaintyOfU } : {}),
    ...stated,
  };
  const r = (x: number) => roundSignificant(x, 6);
  switch (kind) {
    case 'normal':
      return { kind, value, u: r(u), ...keep };
    case 'rectangular':
      return { kind, value, halfWidth: r(u * Math.sqrt(3)), ...keep };
    case 'triangular':
      return { kind, value, halfWidth: r(u * Math.sqrt(6)), ...keep };
    case 'arcsine':
      return { kind, value, halfWidth: r(u * Math.SQRT2), ...keep };
    case 'trapezoidal':
      return { kind, value, halfWidth: r(u * Math.sqrt(6 / 1.25)), beta: 0.5, ...keep };
    case 'curvilinear-trapezoidal':
      return { kind, value, halfWidth: r(u * Math.sqrt(3)), halfWidthUncertainty: 0, ...keep };
    case 'student-t':
      return { kind, value, scale: r(u), dof: t && Number.isFinite(t.dof) ? t.dof : 10, ...stated };
    case 'observations':
      return { kind, values: d.kind === 'observations' ? d.values : [value, value], ...keep };
    case 'constant':
      return { kind, value, ...stated };
  }
}
