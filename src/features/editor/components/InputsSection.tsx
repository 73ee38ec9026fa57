import type { Draft } from '../use-draft';
import type { Problem } from '../live';
import { InputsList } from './InputsList';
import { Section } from './Section';

/** The input quantities, each a row that opens to its form (or, read-only, to how it was evaluated). */
export function InputsSection({ draft, problems, readOnly, canUpload, selectedSymbol }: { draft: Draft; problems: Problem[]; readOnly: boolean; canUpload: boolean; selectedSymbol?: string }) {
  return (
    <Section
      id="inputs"
      title={`Input quantities (${draft.doc.inputs.length})`}
      description={readOnly ? 'Open a row to see how the input was evaluated.' : 'Drag the handle, or focus it and press space and the arrow keys, to change the order.'}
    >
      <InputsList
        items={draft.items}
        onItems={draft.setItems}
        problems={problems}
        openKeys={draft.openKeys}
        onToggle={draft.toggleOpen}
        readOnly={readOnly}
        canUpload={canUpload}
        selectedSymbol={selectedSymbol}
        onAdd={draft.addInput}
      />
    </Section>
  );
}
