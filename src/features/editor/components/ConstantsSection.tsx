import { useMemo, useState } from 'react';
import { PHYSICAL_CONSTANTS, type PhysicalConstant } from '../../../../shared/constants/physical-constants';
import type { BudgetConstant } from '../../../../shared/budget/schema';
import { Button, Field, Modal, NumberInput, TextInput } from '../../../app/ui/controls';
import { formatSignificant } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { givenNumber } from '../../../app/ui/read-only';
import { useToast } from '../../../app/ui/toasts';
import { formatUnit } from '../../../app/ui/units';
import { problemAt, type Problem } from '../live';
import { restoreAt, useLatest } from '../undo-removal';

export function ConstantsSection({
  constants,
  onChange,
  onPick,
  problems,
  readOnly,
}: {
  constants: BudgetConstant[];
  onChange(next: BudgetConstant[]): void;
  onPick(c: PhysicalConstant, asInput: boolean): void;
  problems: Problem[];
  readOnly?: boolean;
}) {
  const [open, setOpen] = useState(false);
  const [q, setQ] = useState('');
  const list = useMemo(() => {
    const t = q.trim().toLowerCase();
    return PHYSICAL_CONSTANTS.filter((c) => !t || c.name.toLowerCase().includes(t) || c.symbol.toLowerCase().includes(t));
  }, [q]);
  const set = (i: number, c: BudgetConstant) => onChange(constants.map((x, j) => (j === i ? c : x)));
  const toast = useToast();
  const latest = useLatest(constants);
  const remove = (i: number) => {
    const c = constants[i];
    onChange(constants.filter((_, j) => j !== i));
    toast(`Removed constant ${c.symbol || ''}.`, 'info', { label: 'Undo', run: () => onChange(restoreAt(latest.current, c, i)) });
  };
  if (readOnly) {
    return constants.length === 0 ? (
      <p className="text-sm text-stone-600">No constants.</p>
    ) : (
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Constants of the model</caption>
        <thead className="text-xs text-stone-600">
          <tr>
            <th scope="col" className="py-1 pr-3 font-medium">
              Symbol
            </th>
            <th scope="col" className="py-1 pr-3 text-right font-medium">
              Value
            </th>
            <th scope="col" className="py-1 pr-3 font-medium">
              Unit
            </th>
            <th scope="col" className="py-1 font-medium">
              Description
            </th>
          </tr>
        </thead>
        <tbody>
          {constants.map((c, i) => (
            <tr key={i} className="border-t border-stone-200">
              <th scope="row" className="py-1 pr-3 font-semibold">
                <Sym s={c.symbol} />
              </th>
              <td className="num py-1 pr-3 text-right">{givenNumber(c.value)}</td>
              <td className="num py-1 pr-3">{formatUnit(c.unit)}</td>
              <td className="py-1 text-stone-700">{c.description}</td>
            </tr>
          ))}
        </tbody>
      </table>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      {constants.length === 0 ? <p className="text-sm text-stone-600">No constants. Constants are exact numbers the model uses, such as a nominal value or a physical constant.</p> : null}
      <ul className="flex flex-col gap-2">
        {constants.map((c, i) => (
          <li key={i} className="grid grid-cols-[minmax(0,1fr)_minmax(0,1.3fr)_minmax(0,1fr)_minmax(0,2fr)_auto] items-start gap-2">
            <Field label="Symbol" error={problemAt(problems, `constants[${i}].symbol`)}>
              {(p) => <TextInput {...p} className="num" value={c.symbol} onChange={(e) => set(i, { ...c, symbol: e.target.value })} />}
            </Field>
            <Field label="Value" error={problemAt(problems, `constants[${i}].value`)}>
              {(p) => <NumberInput {...p} value={c.value} onValue={(v) => set(i, { ...c, value: v as number })} />}
            </Field>
            <Field label="Unit" error={problemAt(problems, `constants[${i}].unit`)}>
              {(p) => <TextInput {...p} className="num" value={c.unit ?? ''} onChange={(e) => set(i, { ...c, unit: e.target.value || undefined })} />}
            </Field>
            <Field label="Description">{(p) => <TextInput {...p} value={c.description ?? ''} onChange={(e) => set(i, { ...c, description: e.target.value || undefined })} />}</Field>
            <Button size="sm" variant="ghost" className="mt-5" onClick={() => remove(i)} aria-label={`Remove constant ${c.symbol}`}>
              Remove
            </Button>
          </li>
        ))}
      </ul>
      <div className="flex gap-2">
        <Button onClick={() => onChange([...constants, { symbol: `c${constants.length + 1}`, value: 1 }])}>+ Add constant</Button>
        <Button onClick={() => setOpen(true)}>Pick a physical constant…</Button>
      </div>
      <Modal open={open} onClose={() => setOpen(false)} title="Physical constants" wide>
        <Field label="Search by name or symbol">{(p) => <TextInput {...p} type="search" value={q} onChange={(e) => setQ(e.target.value)} autoFocus />}</Field>
        <div className="max-h-[60vh] overflow-y-auto rounded-md border border-stone-200">
          <table className="w-full text-left text-sm">
            <thead className="sticky top-0 bg-stone-50 text-xs text-stone-700">
              <tr>
                <th className="px-2 py-1.5">Quantity</th>
                <th className="px-2 py-1.5">Value</th>
                <th className="px-2 py-1.5">u</th>
                <th className="px-2 py-1.5">Source</th>
                <th className="px-2 py-1.5">
                  <span className="sr-only">Add</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {list.map((c) => (
                <tr key={c.id} className="border-t border-stone-100">
                  <td className="px-2 py-1.5">
                    <span className="num font-semibold">{c.symbol}</span> <span className="text-stone-700">{c.name}</span>
                  </td>
                  <td className="num px-2 py-1.5">
                    {formatSignificant(c.value, 10)} {formatUnit(c.unit)}
                  </td>
                  <td className="num px-2 py-1.5">{c.standardUncertainty ? formatSignificant(c.standardUncertainty, 2) : 'exact'}</td>
                  <td className="px-2 py-1.5 text-xs text-stone-600">{c.source}</td>
                  <td className="px-2 py-1.5 text-right">
                    <div className="flex justify-end gap-1">
                      <Button
                        size="sm"
                        onClick={() => {
                          onPick(c, false);
                          setOpen(false);
                        }}
                      >
                        Add as constant
                      </Button>
                      {c.standardUncertainty > 0 ? (
                        <Button
                          size="sm"
                          onClick={() => {
                            onPick(c, true);
                            setOpen(false);
                          }}
                        >
                          Add as input with u
                        </Button>
                      ) : null}
                    </div>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div className="flex justify-end">
          <Button onClick={() => setOpen(false)}>Close</Button>
        </div>
      </Modal>
    </div>
  );
}
