import { useEffect, useState } from 'react';
import { get, useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { quantitySchema, type Distribution, type DistributionKind, type InputQuantity } from '../../../../shared/budget/schema';
import type { Draft } from '../../../../shared/distributions/distribution';
import { KINDS, ruleOf } from '../../../../shared/distributions/registry';
import { Field, TextInput } from '../../../app/ui/controls';
import { ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
import { formatUnit } from '../../../app/ui/units';
import { problemAt, type Problem } from '../live';
import { DofFields, dofModeOf, offersDof, type DofMode } from './DofFields';
import { Choice } from './FormControls';
import type { DraftDistribution, InputDraft, InputFormValues } from './input-draft';
import { KindFields, ObservationsForm } from './KindFields';
import { convertKind, KIND_LABELS } from './kinds';
import { StatedFields } from './StatedFields';

const KIND_CHOICES = KINDS.map((k) => [k, KIND_LABELS[k]] as const);

/**
 * The form of one input quantity. The page holds the input and recomputes on
 * every change; react-hook-form validates it with the budget schema, so a
 * field's message is the engine's. The distribution's fields come from its
 * kind's rule (`form`), and changing the kind converts through u (`convertKind`).
 */
export function InputForm({
  input,
  index,
  problems,
  onChange,
  readOnly = false,
  canUpload,
}: {
  input: InputQuantity;
  index: number;
  problems: Problem[];
  onChange(next: InputQuantity): void;
  readOnly?: boolean;
  canUpload: boolean;
}) {
  const base = `inputs[${index}]`;
  const form = useForm<InputFormValues, unknown, InputQuantity>({
    values: input,
    resolver: zodResolver(quantitySchema),
    resetOptions: { keepErrors: true },
  });
  const { errors } = form.formState;
  // every draft is checked whole, as the page checks the budget: a field shows its message however it was reached
  useEffect(() => {
    void form.trigger();
  }, [input, form]);

  const d = input.distribution as DraftDistribution;
  const kind = d.kind as DistributionKind;
  const rule = ruleOf(kind);
  const [wayOfKind, setWayOfKind] = useState(() => ({ kind, way: rule.form.wayOf(d as Draft<DistributionKind>) }));
  const way = wayOfKind.kind === kind ? wayOfKind.way : rule.form.wayOf(d as Draft<DistributionKind>);
  const [dofMode, setDofMode] = useState<DofMode>(() => dofModeOf(d));
  const unit = formatUnit(input.unit);

  const setDistribution = (patch: Record<string, unknown>) => {
    const next: Record<string, unknown> = { ...d, ...patch };
    for (const k of Object.keys(next)) if (next[k] === undefined) delete next[k];
    onChange({ ...input, distribution: next as Distribution });
  };
  const draft: InputDraft = {
    input,
    distribution: d,
    control: form.control,
    setDistribution,
    errorAt: (field) => (get(errors, field) as FieldError | undefined)?.message ?? problemAt(problems, `${base}.${field}`),
    readOnly,
    unit,
    // the uncertainty fields are in their own unit when one is given (12 mK for a value in °C)
    uncertaintyUnit: d.uncertaintyUnit !== undefined ? formatUnit(d.uncertaintyUnit) || d.uncertaintyUnit : unit,
  };

  const chooseWay = (id: string) => {
    const patch = rule.form.ways.find((w) => w.id === id)?.enter?.(d as Draft<DistributionKind>) ?? {};
    setWayOfKind({ kind, way: id });
    setDofMode(dofModeOf({ ...d, ...patch } as DraftDistribution));
    setDistribution(patch);
  };
  const chooseKind = (next: DistributionKind) => {
    const distribution = convertKind(input.distribution, next, input.unit);
    setWayOfKind({ kind: next, way: ruleOf(next).form.ways[0].id });
    setDofMode(dofModeOf(distribution as DraftDistribution));
    onChange({ ...input, distribution });
  };
  const kindFields = <KindFields draft={draft} way={way} onWay={chooseWay} canUpload={canUpload} />;
  const dof = offersDof(d, way) ? <DofFields draft={draft} mode={dofMode} onMode={setDofMode} /> : null;

  if (readOnly) {
    return (
      <div className="flex flex-col gap-3">
        <ReadOnlyList label={`Input ${input.symbol}`} className="md:grid-cols-3">
          <ReadOnlyField label="Symbol" numeric>
            {input.symbol}
          </ReadOnlyField>
          <ReadOnlyField label="Unit" numeric>
            {input.unit ? formatUnit(input.unit) || 'dimensionless' : 'dimensionless'}
          </ReadOnlyField>
          <ReadOnlyField label="Description">{input.description}</ReadOnlyField>
          <Choice label="Distribution" value={kind} onChoose={() => {}} options={KIND_CHOICES} readOnly />
          {kindFields}
          {dof}
          <StatedFields draft={draft} way={way} />
        </ReadOnlyList>
        <ObservationsForm draft={draft} canUpload={canUpload} />
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 md:grid-cols-[1fr_1fr_2fr]">
        <Field label="Symbol" error={draft.errorAt('symbol')}>
          {(fp) => <TextInput {...fp} className="num" value={input.symbol} onChange={(e) => onChange({ ...input, symbol: e.target.value })} />}
        </Field>
        <Field label="Unit" error={draft.errorAt('unit')} hint={input.unit ? `shown as ${formatUnit(input.unit) || 'dimensionless'}` : 'e.g. mm, um, degC, kg/m^3; empty = dimensionless'}>
          {(fp) => <TextInput {...fp} className="num" value={input.unit ?? ''} onChange={(e) => onChange({ ...input, unit: e.target.value || undefined })} />}
        </Field>
        <Field label="Description" error={draft.errorAt('description')}>
          {(fp) => (
            <TextInput
              {...fp}
              value={input.description ?? ''}
              placeholder="what this quantity is and where its value comes from"
              onChange={(e) => onChange({ ...input, description: e.target.value || undefined })}
            />
          )}
        </Field>
      </div>
      <div className="grid gap-3 md:grid-cols-3">
        <Choice label="Distribution" value={kind} onChoose={chooseKind} options={KIND_CHOICES} readOnly={false} error={draft.errorAt('distribution.kind')} className="md:col-span-3" />
        {kindFields}
      </div>
      <StatedFields draft={draft} way={way} />
      {dof}
      {problems
        .filter((pr) => !pr.field.startsWith(`${base}.`) || !/\.(symbol|unit|description|distribution(\.\w+)+)$/.test(pr.field))
        .map((pr, i) => (
          <p key={i} role="alert" className="text-xs font-medium text-caution-700">
            {pr.message}
          </p>
        ))}
    </div>
  );
}
