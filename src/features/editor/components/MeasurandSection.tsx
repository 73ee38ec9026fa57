import type { BudgetDocument } from '../../../../shared/budget/schema';
import { Field, NumberInput, TextInput } from '../../../app/ui/controls';
import { givenNumber, ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
import { formatUnit } from '../../../app/ui/units';
import { problemAt, type Problem } from '../live';
import { RecordFields } from './RecordFields';
import { Section } from './Section';

type Edit = (fn: (d: BudgetDocument) => BudgetDocument) => void;

/** The measurand (symbol, unit, description), the coverage probability and the record of the measurement. */
export function MeasurandSection({ doc, setDoc, problems, readOnly }: { doc: BudgetDocument; setDoc: Edit; problems: readonly Problem[]; readOnly: boolean }) {
  const setMeasurand = (patch: Partial<BudgetDocument['measurand']>) => setDoc((d) => ({ ...d, measurand: { ...d.measurand, ...patch } }));
  return (
    <Section id="measurand" title="Measurand" description="The quantity the budget determines.">
      {readOnly ? (
        <ReadOnlyList className="md:grid-cols-[8rem_8rem_1fr_9rem]">
          <ReadOnlyField label="Symbol" numeric>
            {doc.measurand.symbol}
          </ReadOnlyField>
          <ReadOnlyField label="Unit" numeric>
            {formatUnit(doc.measurand.unit) || 'dimensionless'}
          </ReadOnlyField>
          <ReadOnlyField label="Description">{doc.measurand.description}</ReadOnlyField>
          <ReadOnlyField label="Coverage probability p" numeric>
            {givenNumber(doc.coverageProbability ?? 0.95)}
          </ReadOnlyField>
        </ReadOnlyList>
      ) : (
        <div className="grid gap-3 md:grid-cols-[8rem_8rem_1fr_9rem]">
          <Field label="Symbol" error={problemAt(problems, 'measurand.symbol')}>
            {(p) => <TextInput {...p} className="num" value={doc.measurand.symbol} onChange={(e) => setMeasurand({ symbol: e.target.value })} />}
          </Field>
          <Field label="Unit" error={problemAt(problems, 'measurand.unit')} hint={doc.measurand.unit ? `shown as ${formatUnit(doc.measurand.unit) || 'dimensionless'}` : 'e.g. mm'}>
            {(p) => <TextInput {...p} className="num" value={doc.measurand.unit ?? ''} onChange={(e) => setMeasurand({ unit: e.target.value || undefined })} />}
          </Field>
          <Field label="Description" error={problemAt(problems, 'measurand.description')}>
            {(p) => <TextInput {...p} value={doc.measurand.description ?? ''} onChange={(e) => setMeasurand({ description: e.target.value || undefined })} />}
          </Field>
          <Field label="Coverage probability p" error={problemAt(problems, 'coverageProbability')}>
            {(p) => <NumberInput {...p} value={doc.coverageProbability ?? 0.95} onValue={(v) => setDoc((d) => ({ ...d, coverageProbability: v }))} />}
          </Field>
        </div>
      )}
      <RecordFields doc={doc} readOnly={readOnly} onChange={(patch) => setDoc((d) => ({ ...d, ...patch }))} />
    </Section>
  );
}
