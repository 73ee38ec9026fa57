import type { BudgetResult, Contribution } from '../../../shared/budget/result';
import type { Distribution, InputQuantity } from '../../../shared/budget/schema';
import { normalCoverageFactor } from '../../../shared/distributions/normal';
import { dof, probability, share, significantFigure } from '../../../shared/presentation/figures';
import { formatUnit } from '../../app/ui/units';

/** How one number was obtained: the formula, the values substituted, the clause it follows. */
export interface Explanation {
  title: string;
  steps: { formula: string; substituted?: string; clause: string; note?: string }[];
}

export type Selection = { type: 'result'; item: 'y' | 'uc' | 'nu' | 'k' | 'U' } | { type: 'input'; symbol: string };

// the steps of a derivation keep four significant digits, so a reader can redo the arithmetic
const f = (x: number, sig = 4) => significantFigure(x, sig).text;
const formatDof = (nu: number | null) => dof(nu).text;
const withUnit = (x: string, unit?: string) => {
  const u = formatUnit(unit);
  return u ? `${x} ${u}` : x;
};

function standardUncertaintyStep(d: Distribution, c: Contribution, unit?: string): Explanation['steps'][number] {
  const u = withUnit(f(c.standardUncertainty), unit);
  switch (d.kind) {
    case 'normal':
      return d.u !== undefined
        ? { formula: 'u(xᵢ) as stated', substituted: `u(xᵢ) = ${u}`, clause: 'GUM 4.3.1' }
        : { formula: 'u(xᵢ) = U / k', substituted: `u(xᵢ) = ${f(d.U ?? NaN)} / ${f(normalCoverageFactor(d) ?? NaN)} = ${u}`, clause: 'GUM 4.3.3' };
    case 'rectangular': {
      const a = d.halfWidth ?? ((d.upper ?? 0) - (d.lower ?? 0)) / 2;
      const how = d.halfWidth === undefined ? `a = (a₊ − a₋)/2 = ${f(a)}; ` : '';
      return { formula: 'u(xᵢ) = a / √3', substituted: `${how}u(xᵢ) = ${f(a)} / √3 = ${u}`, clause: 'GUM 4.3.7' };
    }
    case 'triangular':
      return { formula: 'u(xᵢ) = a / √6', substituted: `u(xᵢ) = ${f(d.halfWidth)} / √6 = ${u}`, clause: 'GUM 4.3.9' };
    case 'arcsine':
      return { formula: 'u(xᵢ) = a / √2', substituted: `u(xᵢ) = ${f(d.halfWidth)} / √2 = ${u}`, clause: 'JCGM 101:2008 6.4.6' };
    case 'trapezoidal':
      return {
        formula: 'u(xᵢ) = a · √((1 + β²) / 6)',
        substituted: `u(xᵢ) = ${f(d.halfWidth)} · √((1 + ${f(d.beta)}²) / 6) = ${u}`,
        clause: 'GUM 4.3.9, JCGM 101:2008 6.4.4',
      };
    case 'curvilinear-trapezoidal':
      return {
        formula: 'u(xᵢ) = √(a²/3 + d²/9)',
        substituted: `u(xᵢ) = √(${f(d.halfWidth)}²/3 + ${f(d.halfWidthUncertainty)}²/9) = ${u}`,
        clause: 'JCGM 101:2008 6.4.3',
      };
    case 'student-t':
      return { formula: 'u(xᵢ) = s (scale of the t-distribution)', substituted: `u(xᵢ) = ${u}`, clause: 'JCGM 101:2008 6.4.9' };
    case 'observations': {
      const n = d.values.length;
      if (d.pooledSd !== undefined) {
        return { formula: 'u(xᵢ) = s_p / √n', substituted: `u(xᵢ) = ${f(d.pooledSd)} / √${n} = ${u}`, clause: 'GUM 4.2.4' };
      }
      return { formula: 'u(xᵢ) = s(q) / √n', substituted: `u(xᵢ) = ${f(c.standardUncertainty * Math.sqrt(n))} / √${n} = ${u}`, clause: 'GUM 4.2.2, 4.2.3' };
    }
    case 'constant':
      return { formula: 'u(xᵢ) = 0', substituted: 'the value is taken as exact', clause: 'GUM 4.1' };
  }
}

function dofStep(d: Distribution, c: Contribution): Explanation['steps'][number] {
  if (d.relativeUncertaintyOfU !== undefined) {
    return {
      formula: 'νᵢ ≈ ½ · (Δu/u)⁻²',
      substituted: `νᵢ ≈ ½ · ${f(d.relativeUncertaintyOfU, 3)}⁻² = ${formatDof(c.dof)}`,
      clause: 'GUM G.4.2',
    };
  }
  if (d.kind === 'observations' && d.dof === undefined) {
    return d.pooledDof !== undefined
      ? { formula: 'νᵢ = ν of the pooled estimate', substituted: `νᵢ = ${formatDof(c.dof)}`, clause: 'GUM 4.2.4' }
      : { formula: 'νᵢ = n − 1', substituted: `νᵢ = ${d.values.length} − 1 = ${formatDof(c.dof)}`, clause: 'GUM G.3.3' };
  }
  if (d.dof !== undefined) return { formula: 'νᵢ as stated', substituted: `νᵢ = ${formatDof(c.dof)}`, clause: 'GUM G.4.1' };
  return { formula: 'νᵢ = ∞', substituted: 'u(xᵢ) is taken as exactly known', clause: 'GUM G.4.2', note: 'Give ν or the reliability of u to change this.' };
}

export function explainInput(result: BudgetResult, input: InputQuantity, measurandUnit?: string): Explanation | null {
  const c = result.gum.contributions.find((x) => x.symbol === input.symbol);
  if (!c) return null;
  const yUnit = measurandUnit;
  return {
    title: `Contribution of ${input.symbol}`,
    steps: [
      standardUncertaintyStep(input.distribution, c, input.unit),
      {
        formula: 'cᵢ = ∂f/∂xᵢ at the estimates',
        substituted: `cᵢ = ${f(c.sensitivity)} (${c.sensitivityMethod === 'symbolic' ? 'symbolic derivative' : 'numerical derivative'})`,
        clause: 'GUM 5.1.3',
      },
      {
        formula: 'uᵢ(y) = |cᵢ| · u(xᵢ)',
        substituted: `uᵢ(y) = ${f(Math.abs(c.sensitivity))} · ${f(c.standardUncertainty)} = ${withUnit(f(c.contribution), yUnit)}`,
        clause: 'GUM 5.1.3, eq. (11)',
      },
      {
        formula: 'share = uᵢ²(y) / Σ uⱼ²(y)',
        substituted: `share = ${f(c.contribution, 3)}² / ${f(Math.sqrt(result.gum.contributions.reduce((s, x) => s + x.contribution ** 2, 0)), 3)}² = ${share(c.varianceShare).text}`,
        clause: 'GUM 5.1.2',
      },
      dofStep(input.distribution, c),
    ],
  };
}

export function explainResult(result: BudgetResult, item: 'y' | 'uc' | 'nu' | 'k' | 'U', model: string, correlated: boolean): Explanation {
  const g = result.gum;
  const unit = result.measurand.unit;
  const contributions = g.contributions.filter((c) => c.contribution > 0);
  switch (item) {
    case 'y':
      return {
        title: 'Estimate y',
        steps: [
          {
            formula: 'y = f(x₁, …, x_N) at the input estimates',
            substituted: `${model.trim().split(/\r?\n/).filter((l) => l.trim() && !l.trim().startsWith('#')).pop() ?? ''}  →  y = ${withUnit(f(g.estimate, 8), unit)}`,
            clause: 'GUM 4.1.4',
          },
        ],
      };
    case 'uc':
      return {
        title: 'Combined standard uncertainty u_c(y)',
        steps: [
          correlated
            ? {
                formula: 'u_c²(y) = Σ cᵢ²u²(xᵢ) + 2 Σᵢ Σⱼ₍ⱼ>ᵢ₎ cᵢcⱼ u(xᵢ)u(xⱼ) r(xᵢ,xⱼ)',
                substituted: `u_c = ${withUnit(f(g.standardUncertainty), unit)}`,
                clause: 'GUM 5.2.2',
              }
            : {
                formula: 'u_c²(y) = Σ cᵢ² u²(xᵢ) = Σ uᵢ²(y)',
                substituted: `u_c = √(${contributions.map((c) => `${f(c.contribution, 3)}²`).join(' + ') || '0'}) = ${withUnit(f(g.standardUncertainty), unit)}`,
                clause: 'GUM 5.1.2',
              },
          ...(g.standardUncertaintySecondOrder !== null
            ? [
                {
                  formula: 'with the second-order terms ½ΣΣ(∂²f/∂xᵢ∂xⱼ)² u²(xᵢ)u²(xⱼ) + …',
                  substituted: `u_c = ${withUnit(f(g.standardUncertaintySecondOrder), unit)}`,
                  clause: 'GUM 5.1.2, note',
                },
              ]
            : []),
        ],
      };
    case 'nu':
      return {
        title: 'Effective degrees of freedom ν_eff',
        steps: [
          {
            formula: 'ν_eff = u_c⁴(y) / Σ (uᵢ⁴(y) / νᵢ)',
            substituted:
              g.effectiveDof === null
                ? 'every νᵢ is infinite, so ν_eff = ∞'
                : correlated
                  ? `each group of correlated inputs is one term, with its covariances and the smallest ν of the group: ν_eff = ${formatDof(g.effectiveDof)}`
                  : `ν_eff = ${f(g.standardUncertainty, 3)}⁴ / (${contributions
                    .filter((c) => c.dof !== null)
                    .map((c) => `${f(c.contribution, 3)}⁴/${formatDof(c.dof)}`)
                    .join(' + ')}) = ${formatDof(g.effectiveDof)}`,
            clause: 'GUM G.4.1, eq. (G.2b)',
          },
        ],
      };
    case 'k':
      return {
        title: 'Coverage factor k',
        steps: [
          {
            formula: 'k = t_p(ν_eff) at the real ν_eff',
            substituted: `p = ${probability(g.coverageProbability).text}, ν = ${formatDof(g.effectiveDof)}  →  k = ${f(g.coverageFactor)}`,
            clause: 'GUM G.3.4, G.4.1 note, Table G.2',
          },
        ],
      };
    case 'U':
      return {
        title: 'Expanded uncertainty U',
        steps: [
          {
            formula: 'U = k · u_c(y)',
            substituted: `U = ${f(g.coverageFactor)} · ${f(g.standardUncertainty)} = ${withUnit(f(g.expandedUncertainty), unit)}`,
            clause: 'GUM 6.2.1',
          },
          { formula: 'report U with at most two significant digits, y to the same place', clause: 'GUM 7.2.6' },
        ],
      };
  }
}
