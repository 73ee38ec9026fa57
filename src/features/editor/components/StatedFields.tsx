import type { DistributionKind, StatedAs } from '../../../../shared/budget/schema';
import { statedValueOf } from '../../../../shared/budget/stated-value';
import { ruleOf } from '../../../../shared/distributions/registry';
import { Field, TextInput } from '../../../app/ui/controls';
import { formatSignificant } from '../../../app/ui/numbers';
import { ReadOnlyField } from '../../../app/ui/read-only';
import { Choice } from './FormControls';
import type { InputDraft } from './input-draft';

/** Where the figure comes from, kept as `distribution.stated.as`; a form a way of giving the kind records (a resolution) is chosen under "Given as". */
const STATED_CHOICES = [
  ['', 'not recorded'],
  ['certificate', 'a calibration certificate'],
  ['specification', "a manufacturer's specification"],
  ['tolerance', 'a tolerance'],
  ['observations', 'repeated observations'],
  ['estimate', "the laboratory's own estimate"],
] as const satisfies readonly (readonly [StatedAs | '', string])[];

/** The statement as the engine reads it, with its divisor and u, or null while the draft cannot be treated. */
function asStatedNote(draft: InputDraft): string | null {
  try {
    const s = statedValueOf(draft.input);
    const divisor = s.divisorText && s.coverageProbability === null ? `; divisor ${s.divisorText}` : '';
    return `${s.text}${divisor}; u = ${formatSignificant(s.standardUncertainty, 3)} ${draft.unit}`;
  } catch {
    return null;
  }
}

/**
 * How the figure was stated: its form, its source and the unit of the
 * uncertainty, with the statement as the engine reads it. A kind without an
 * uncertainty (an exact value) has none of these.
 */
export function StatedFields({ draft, way }: { draft: InputDraft; way: string }) {
  const d = draft.distribution;
  const rule = ruleOf(d.kind as DistributionKind);
  if (rule.uncertaintyFields.length === 0) return null;
  const statedAs: StatedAs | '' = d.stated?.as ?? '';
  // a form recorded by a way of giving the kind (a resolution) is fixed here
  const wayForm = rule.form.ways.find((w) => w.statedAs !== undefined && w.statedAs === statedAs);
  const note = asStatedNote(draft);
  if (draft.readOnly) {
    return (
      <>
        <ReadOnlyField label="Stated as">{wayForm ? wayForm.label : STATED_CHOICES.find(([v]) => v === statedAs)?.[1]}</ReadOnlyField>
        <ReadOnlyField label="Source">{d.stated?.source}</ReadOnlyField>
        {d.uncertaintyUnit !== undefined ? (
          <ReadOnlyField label="Uncertainty given in" numeric>
            {draft.uncertaintyUnit}
          </ReadOnlyField>
        ) : null}
        {note ? (
          <ReadOnlyField label="As stated" numeric className="md:col-span-3">
            {note}
          </ReadOnlyField>
        ) : null}
      </>
    );
  }
  // the uncertainty unit applies where the way's fields state an uncertainty, or an uncertainty field is given (a pooled s)
  const current = rule.form.ways.find((w) => w.id === way) ?? rule.form.ways[0];
  const takesUncertaintyUnit = current.fields.some((f) => f.unit === 'uncertainty') || (rule.uncertaintyFields as readonly string[]).some((n) => d[n] !== undefined);
  const setStatedAs = (as: StatedAs | '') => draft.setDistribution(as ? { stated: { ...(d.stated ?? {}), as } } : { stated: undefined });
  return (
    <fieldset className="grid gap-3 rounded-md border border-stone-200 p-3 md:grid-cols-3">
      <legend className="px-1 text-xs font-medium text-stone-700">As stated</legend>
      {wayForm ? (
        <ReadOnlyField label="Stated as">{wayForm.label}</ReadOnlyField>
      ) : (
        <Choice
          label="Stated as"
          value={statedAs}
          onChoose={setStatedAs}
          options={STATED_CHOICES}
          readOnly={false}
          error={draft.errorAt('distribution.stated') ?? draft.errorAt('distribution.stated.as')}
        />
      )}
      <Field label="Source" error={draft.errorAt('distribution.stated.source')} hint={statedAs ? 'e.g. the certificate number' : 'choose how it was stated first'}>
        {(fp) => <TextInput {...fp} value={d.stated?.source ?? ''} disabled={!statedAs} onChange={(e) => draft.setDistribution({ stated: { ...d.stated, source: e.target.value || undefined } })} />}
      </Field>
      {takesUncertaintyUnit ? (
        <Field
          label="Uncertainty given in"
          error={draft.errorAt('distribution.uncertaintyUnit')}
          hint={d.uncertaintyUnit ? `shown as ${draft.uncertaintyUnit}; %, ppm, ppb are relative to the value` : 'empty = the unit of the value; e.g. mK, um, ppm'}
        >
          {(fp) => <TextInput {...fp} className="num" value={d.uncertaintyUnit ?? ''} onChange={(e) => draft.setDistribution({ uncertaintyUnit: e.target.value || undefined })} />}
        </Field>
      ) : null}
      {note ? <p className="num text-xs text-stone-700 md:col-span-3">{note}</p> : null}
    </fieldset>
  );
}
