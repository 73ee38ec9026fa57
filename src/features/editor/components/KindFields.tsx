import type { DistributionKind } from '../../../../shared/budget/schema';
import type { Draft, KindFormField, UnitRole } from '../../../../shared/distributions/distribution';
import { ruleOf } from '../../../../shared/distributions/registry';
import { Choice, NumberField } from './FormControls';
import type { InputDraft } from './input-draft';
import { ObservationsHelper } from './ObservationsHelper';

/** The fields of a kind's chosen way of being given, as its rule describes them, with the "Given as" chooser when it has several ways. */
export function KindFields({ draft, way, onWay, canUpload }: { draft: InputDraft; way: string; onWay(id: string): void; canUpload: boolean }) {
  const d = draft.distribution;
  const form = ruleOf(d.kind as DistributionKind).form;
  const current = form.ways.find((w) => w.id === way) ?? form.ways[0];
  const suffix: Record<UnitRole, string> = {
    value: draft.unit ? ` (${draft.unit})` : '',
    uncertainty: draft.uncertaintyUnit ? ` (${draft.uncertaintyUnit})` : '',
    dimensionless: '',
  };
  const field = (f: KindFormField<DistributionKind>) => {
    if (f.list) {
      // read-only, the observations are listed below the definition list of the other facts
      return draft.readOnly ? null : (
        <div key={f.name} className="md:col-span-3">
          <ObservationsForm draft={draft} canUpload={canUpload} />
        </div>
      );
    }
    const hint = typeof f.hint === 'function' ? f.hint(d as Draft<DistributionKind>) : f.hintWhileEditing && draft.readOnly ? undefined : f.hint;
    return <NumberField key={f.name} draft={draft} name={f.name} label={`${f.label}${suffix[f.unit]}`} hint={hint} shownTimes={f.shownTimes} required={f.required} />;
  };
  return (
    <>
      {form.ways.length > 1 ? (
        <Choice label="Given as" value={current.id} onChoose={onWay} options={form.ways.map((w) => [w.id, w.label] as const)} readOnly={draft.readOnly} className="md:col-span-3" />
      ) : null}
      {(current.fields as readonly KindFormField<DistributionKind>[]).map(field)}
    </>
  );
}

/** The observations of a Type A input: pasted, uploaded or, read-only, listed. */
export function ObservationsForm({ draft, canUpload }: { draft: InputDraft; canUpload: boolean }) {
  const d = draft.distribution;
  if (d.kind !== 'observations') return null;
  return (
    <ObservationsHelper
      spec={d}
      unit={draft.input.unit}
      readOnly={draft.readOnly}
      canUpload={canUpload}
      error={draft.errorAt('distribution.values')}
      onValues={(values) => draft.setDistribution({ values })}
    />
  );
}
