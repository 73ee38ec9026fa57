import type { BudgetResult, Contribution } from '../../../shared/budget/result';
import type { Distribution, InputQuantity } from '../../../shared/budget/schema';
import type { ExplanationStep, ExplanationWriter } from '../../../shared/distributions/distribution';
import { ruleFor } from '../../../shared/distributions/registry';
import { dof, probability, share, significantFigure } from '../../../shared/presentation/figures';
import { formatUnit } from '../../app/ui/units';

/** How one number was obtained: the formula, the values substituted, the clause it follows. */
export interface Explanation {
  title: string;
  steps: ExplanationStep[];
}

export type Selection = { type: 'result'; item: 'y' | 'uc' | 'nu' | 'k' | 'U' } | { type: 'input'; symbol: string };

// the steps of a derivation keep four significant digits, so a reader can redo the arithmetic
const f = (x: number, sig = 4) => significantFigure(x, sig).text;
const formatDof = (nu: number | null) => dof(nu).text;
const withUnit = (x: string, unit?: string) => {
  const u = formatUnit(unit);
  return u ? `${x} ${u}` : x;
};

/** The figures of an input's steps as its kind's rule writes them. */
function writerFor(c: Contribution, unit?: string): ExplanationWriter {
  return { figure: f, u: withUnit(f(c.standardUncertainty), unit), standardUncertainty: c.standardUncertainty, nu: formatDof(c.dof) };
}

function dofStep(d: Distribution, write: ExplanationWriter): ExplanationStep {
  if (d.relativeUncertaintyOfU !== undefined) {
    return {
      formula: 'νᵢ ≈ ½ · (Δu/u)⁻²',
      substituted: `νᵢ ≈ ½ · ${f(d.relativeUncertaintyOfU, 3)}⁻² = ${write.nu}`,
      clause: 'GUM G.4.2',
    };
  }
  if (d.dof !== undefined) return { formula: 'νᵢ as stated', substituted: `νᵢ = ${write.nu}`, clause: 'GUM G.4.1' };
  const own = ruleFor(d).explainDof?.(d, write);
  if (own) return own;
  return { formula: 'νᵢ = ∞', substituted: 'u(xᵢ) is taken as exactly known', clause: 'GUM G.4.2', note: 'Give ν or the reliability of u to change this.' };
}

export function explainInput(result: BudgetResult, input: InputQuantity, measurandUnit?: string): Explanation | null {
  const c = result.gum.contributions.find((x) => x.symbol === input.symbol);
  if (!c) return null;
  const yUnit = measurandUnit;
  const d = input.distribution;
  const write = writerFor(c, input.unit);
  return {
    title: `Contribution of ${input.symbol}`,
    steps: [
      ruleFor(d).explainU(d, write),
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
      dofStep(d, write),
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
            substituted: `${
              model
                .trim()
                .split(/\r?\n/)
                .filter((l) => l.trim() && !l.trim().startsWith('#'))
                .pop() ?? ''
            }  →  y = ${withUnit(f(g.estimate, 8), unit)}`,
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
