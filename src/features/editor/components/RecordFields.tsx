import { useEffect, useState } from 'react';
import type { BudgetDocument } from '../../../../shared/budget/schema';
import { Field, TextInput } from '../../../app/ui/controls';
import { ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';

type Record = Pick<BudgetDocument, 'procedure' | 'equipment' | 'environment'>;

const listText = (items: string[] | undefined) => (items ?? []).join(', ');

/**
 * The record of the measurement a report names in its title block (ISO/IEC 17025 7.8):
 * the procedure followed, the identifiers of the equipment used and the environmental conditions.
 */
export function RecordFields({ doc, readOnly, onChange }: { doc: Record; readOnly?: boolean; onChange(patch: Record): void }) {
  // the identifiers are typed as one list; the text is kept while typing so a trailing comma survives
  const [equipment, setEquipment] = useState(() => listText(doc.equipment));
  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the typed list follows the document changed from outside, and keeps a trailing comma while typing
    setEquipment((text) =>
      listText(
        text
          .split(',')
          .map((s) => s.trim())
          .filter(Boolean),
      ) === listText(doc.equipment)
        ? text
        : listText(doc.equipment),
    );
  }, [doc.equipment]);
  if (readOnly) {
    return (
      <ReadOnlyList className="mt-3 border-t border-stone-200 pt-3 md:grid-cols-3">
        <ReadOnlyField label="Procedure">{doc.procedure}</ReadOnlyField>
        <ReadOnlyField label="Equipment used" numeric>
          {listText(doc.equipment)}
        </ReadOnlyField>
        <ReadOnlyField label="Environmental conditions">{doc.environment}</ReadOnlyField>
      </ReadOnlyList>
    );
  }
  return (
    <div className="mt-3 grid gap-3 border-t border-stone-200 pt-3 md:grid-cols-3">
      <Field label="Procedure" hint="the lab's documented procedure, e.g. KF-TMP-006 rev. 1">
        {(p) => <TextInput {...p} value={doc.procedure ?? ''} onChange={(e) => onChange({ procedure: e.target.value || undefined })} />}
      </Field>
      <Field label="Equipment used" hint="identifiers, separated by commas">
        {(p) => (
          <TextInput
            {...p}
            className="num"
            value={equipment}
            onChange={(e) => {
              setEquipment(e.target.value);
              const items = e.target.value
                .split(',')
                .map((s) => s.trim())
                .filter(Boolean);
              onChange({ equipment: items.length ? items : undefined });
            }}
          />
        )}
      </Field>
      <Field label="Environmental conditions" hint="e.g. (20 ± 1) °C, 40 % to 60 % rh">
        {(p) => <TextInput {...p} value={doc.environment ?? ''} onChange={(e) => onChange({ environment: e.target.value || undefined })} />}
      </Field>
    </div>
  );
}
