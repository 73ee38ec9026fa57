import { modelValues, type ResultModel } from '../../../../shared/presentation/result-model';
import { ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
import type { Problem } from '../live';
import { ModelEditor } from './ModelEditor';
import { Section } from './Section';

/** The model equations: the editor with each line's value, or the text as saved. */
export function ModelSection({ model, onModel, result, problem, readOnly }: { model: string; onModel(model: string): void; result: ResultModel | null; problem: Problem | null; readOnly: boolean }) {
  return (
    <Section id="model" title="Model">
      {readOnly ? (
        <ReadOnlyList>
          <ReadOnlyField label="Model equation(s)">
            <pre className="num overflow-x-auto whitespace-pre rounded-md bg-white px-3 py-2 leading-6">{model}</pre>
          </ReadOnlyField>
        </ReadOnlyList>
      ) : (
        <ModelEditor value={model} values={result ? modelValues(result) : undefined} problem={problem} onChange={onModel} />
      )}
    </Section>
  );
}
