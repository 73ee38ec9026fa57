import type { FieldPath } from 'react-hook-form';
import { useController } from 'react-hook-form';
import { roundSignificant } from '../../../../shared/format/significant-digits';
import { Field, NumberInput, Select } from '../../../app/ui/controls';
import { givenNumber, ReadOnlyField } from '../../../app/ui/read-only';
import type { InputDraft, InputFormValues } from './input-draft';

/**
 * One number of the distribution, registered with the form so the budget
 * schema's message shows beside it (and aria-invalid marks it). The value is
 * the page's, so the live result follows every keystroke; `shownTimes` shows
 * and takes a multiple of the stored field (a resolution r for a = r/2);
 * a field the kind needs is marked aria-required.
 */
export function NumberField({
  draft,
  name,
  label,
  hint,
  shownTimes = 1,
  required = false,
}: {
  draft: InputDraft;
  name: string;
  label: string;
  hint?: string;
  shownTimes?: number;
  required?: boolean;
}) {
  const path = `distribution.${name}`;
  const { fieldState } = useController({ control: draft.control, name: path as FieldPath<InputFormValues> });
  const stored = draft.distribution[name] as number | undefined;
  const shown = stored === undefined || shownTimes === 1 ? stored : roundSignificant(stored * shownTimes, 12);
  if (draft.readOnly) {
    return (
      <ReadOnlyField label={label} numeric note={hint}>
        {givenNumber(shown)}
      </ReadOnlyField>
    );
  }
  return (
    <Field label={label} error={fieldState.error?.message ?? draft.errorAt(path)} hint={hint}>
      {(fp) => <NumberInput {...fp} aria-required={required} value={shown} onValue={(v) => draft.setDistribution({ [name]: v === undefined || shownTimes === 1 ? v : v / shownTimes })} />}
    </Field>
  );
}

/** One chooser shape for every "how is this given" select on the form; read-only, the chosen option's words. */
export function Choice<M extends string>({
  label,
  value,
  onChoose,
  options,
  readOnly,
  error,
  className,
}: {
  label: string;
  value: M;
  onChoose(m: M): void;
  options: readonly (readonly [M, string])[];
  readOnly: boolean;
  error?: string | null;
  className?: string;
}) {
  if (readOnly) {
    return (
      <ReadOnlyField label={label} className={className}>
        {options.find(([v]) => v === value)?.[1]}
      </ReadOnlyField>
    );
  }
  return (
    <Field label={label} error={error} className={className}>
      {(fp) => (
        <Select {...fp} value={value} onChange={(e) => onChoose(e.target.value as M)}>
          {options.map(([v, text]) => (
            <option key={v} value={v}>
              {text}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
}
