import type { DistributionKind } from '../../../../shared/budget/schema';
import { ruleOf } from '../../../../shared/distributions/registry';
import { formatSignificant } from '../../../app/ui/numbers';
import { ReadOnlyField } from '../../../app/ui/read-only';
import { Choice, NumberField } from './FormControls';
import type { DraftDistribution, InputDraft } from './input-draft';

export type DofMode = 'inf' | 'direct' | 'reliability';

/** How the draft gives νᵢ: from the reliability of u, directly, or the kind's default. */
export function dofModeOf(d: DraftDistribution): DofMode {
  return d.relativeUncertaintyOfU !== undefined ? 'reliability' : d.dof !== undefined ? 'direct' : 'inf';
}

/** Whether the form offers a choice of νᵢ: not for a kind whose ν is its own field, nor for a way that states ν with U. */
export function offersDof(d: DraftDistribution, way: string): boolean {
  const form = ruleOf(d.kind as DistributionKind).form;
  return form.dof !== undefined && !form.ways.find((w) => w.id === way)?.givesDof;
}

/** νᵢ of the input (GUM G.4): the kind's default, a value given directly, or ν = ½·(Δu/u)⁻² from the reliability of u (G.4.2). */
export function DofFields({ draft, mode, onMode }: { draft: InputDraft; mode: DofMode; onMode(m: DofMode): void }) {
  const d = draft.distribution;
  const byDefault = ruleOf(d.kind as DistributionKind).form.dof;
  if (!byDefault) return null;
  if (draft.readOnly) {
    const text =
      d.relativeUncertaintyOfU !== undefined
        ? `${formatSignificant(0.5 / d.relativeUncertaintyOfU ** 2, 3)}, from Δu/u = ${formatSignificant(d.relativeUncertaintyOfU * 100, 3)} % (GUM G.4.2)`
        : d.dof !== undefined
          ? `${d.dof}, given`
          : byDefault.text;
    return <ReadOnlyField label="Degrees of freedom νᵢ">{text}</ReadOnlyField>;
  }
  const choose = (m: DofMode) => {
    onMode(m);
    if (m === 'inf') draft.setDistribution({ dof: undefined, relativeUncertaintyOfU: undefined });
    if (m === 'direct') draft.setDistribution({ relativeUncertaintyOfU: undefined, dof: d.dof ?? byDefault.start });
    if (m === 'reliability') draft.setDistribution({ dof: undefined, relativeUncertaintyOfU: d.relativeUncertaintyOfU ?? 0.1 });
  };
  return (
    <fieldset className="grid gap-3 rounded-md border border-stone-200 p-3 md:grid-cols-3">
      <legend className="px-1 text-xs font-medium text-stone-700">Degrees of freedom νᵢ</legend>
      <Choice
        label="ν from"
        value={mode}
        onChoose={choose}
        options={[
          ['inf', byDefault.option],
          ['direct', 'a value given directly'],
          ['reliability', 'the reliability of u (Δu/u)'],
        ]}
        readOnly={false}
        error={draft.errorAt('distribution.relativeUncertaintyOfU')}
      />
      {mode === 'direct' ? <NumberField draft={draft} name="dof" label="νᵢ" /> : null}
      {mode === 'reliability' ? (
        <NumberField
          draft={draft}
          name="relativeUncertaintyOfU"
          label="Relative uncertainty of u, Δu/u (%)"
          shownTimes={100}
          hint={d.relativeUncertaintyOfU ? `ν = ½·(Δu/u)⁻² = ${formatSignificant(0.5 / d.relativeUncertaintyOfU ** 2, 3)} (GUM G.4.2)` : 'e.g. 10 % gives ν = 50'}
        />
      ) : null}
    </fieldset>
  );
}
