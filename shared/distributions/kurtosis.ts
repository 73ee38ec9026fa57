import type { Distribution } from '../budget/schema';

/**
 * Kurtosis β₂ = μ₄/σ⁴ of the shape an input is drawn from (JCGM 101:2008 6.4),
 * which the higher-order terms of the law of propagation need for an input that
 * is not Gaussian. Closed forms (handbook moments of each shape):
 * - normal 3; rectangular 9/5; triangular 12/5; arcsine 3/2;
 * - trapezoidal of half-width a and ratio β: the sum of two rectangles of
 *   half-widths a(1+β)/2 and a(1−β)/2 (JCGM 101:2008 6.4.4), so its fourth
 *   cumulant is −(2/15)(a₁⁴ + a₂⁴) against the variance (a₁² + a₂²)/3;
 * - curvilinear trapezoidal (JCGM 101:2008 6.4.3): a rectangle of half-width A
 *   uniform in [a − d, a + d], so β₂ = 9·E[A⁴] / (5·E[A²]²) with
 *   E[A²] = a² + d²/3 and E[A⁴] = a⁴ + 2a²d² + d⁴/5;
 * - t with ν degrees of freedom (`student-t`, `observations`; ν is the one the
 *   sampler draws with, `drawnDof`, never an override): 3 + 6/(ν − 4) for
 *   ν > 4, and Infinity for ν ≤ 4, where the fourth moment does not exist;
 * - constant: u = 0, so it never enters; 3 by convention.
 * Every shape here is symmetric, so the third moment is 0.
 */
export function shapeKurtosis(spec: Distribution, drawnDof: number): number {
  switch (spec.kind) {
    case 'normal':
    case 'constant':
      return 3;
    case 'rectangular':
      return 9 / 5;
    case 'triangular':
      return 12 / 5;
    case 'arcsine':
      return 3 / 2;
    case 'trapezoidal': {
      const a1 = (1 + spec.beta) / 2;
      const a2 = (1 - spec.beta) / 2;
      const variance = (a1 ** 2 + a2 ** 2) / 3;
      return 3 - ((2 / 15) * (a1 ** 4 + a2 ** 4)) / variance ** 2;
    }
    case 'curvilinear-trapezoidal': {
      const a = spec.halfWidth;
      const d = spec.halfWidthUncertainty;
      const a2 = a * a + (d * d) / 3;
      const a4 = a ** 4 + 2 * a * a * d * d + d ** 4 / 5;
      return (9 * a4) / (5 * a2 * a2);
    }
    case 'student-t':
    case 'observations':
      return drawnDof > 4 ? 3 + 6 / (drawnDof - 4) : Infinity;
  }
}
