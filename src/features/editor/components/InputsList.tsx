import { useRef } from 'react';
import { closestCenter, DndContext, KeyboardSensor, PointerSensor, useSensor, useSensors, type DragEndEvent } from '@dnd-kit/core';
import { arrayMove, SortableContext, sortableKeyboardCoordinates, useSortable, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import type { InputQuantity } from '../../../../shared/budget/schema';
import { Button } from '../../../app/ui/controls';
import { useToast } from '../../../app/ui/toasts';
import { formatUncertainty, formatWithUncertainty } from '../../../app/ui/numbers';
import { Sym, Unit } from '../../../app/ui/quantity';
import { plainMessage, problemsUnder, type Problem } from '../live';
import { restoreAt, useLatest } from '../undo-removal';
import { InputForm } from './InputForm';
import { KIND_SHORT, tryTreatment } from './kinds';

export interface KeyedInput {
  key: string;
  input: InputQuantity;
}

function Row({
  item,
  index,
  open,
  onToggle,
  onChange,
  onRemove,
  problems,
  readOnly,
  canUpload,
  selected,
}: {
  item: KeyedInput;
  index: number;
  open: boolean;
  onToggle(): void;
  onChange(q: InputQuantity): void;
  onRemove(): void;
  problems: Problem[];
  readOnly?: boolean;
  canUpload: boolean;
  selected: boolean;
}) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id: item.key, disabled: readOnly });
  const q = item.input;
  const t = tryTreatment(q.distribution, q.unit);
  const mine = problemsUnder(problems, `inputs[${index}]`);
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={`rounded-md border bg-white ${isDragging ? 'z-10 border-accent-600 shadow-lg' : mine.length ? 'border-caution-500' : selected ? 'border-accent-600' : 'border-stone-200'}`}
      data-input={q.symbol}
    >
      <div className="flex items-center gap-2 px-2 py-1.5">
        {!readOnly ? (
          <button
            ref={setActivatorNodeRef}
            type="button"
            {...attributes}
            {...listeners}
            aria-label={`Move ${q.symbol || 'input'} (position ${index + 1}); press space, then the arrow keys`}
            className="cursor-grab touch-none rounded px-1 py-1 text-stone-500 hover:bg-stone-100 hover:text-stone-800 active:cursor-grabbing"
          >
            <span aria-hidden>⠿</span>
          </button>
        ) : null}
        <button type="button" onClick={onToggle} aria-expanded={open} className="flex min-w-0 flex-1 items-center gap-3 rounded px-1 py-0.5 text-left hover:bg-stone-50">
          <span aria-hidden className="w-3 text-stone-500">
            {open ? '▾' : '▸'}
          </span>
          <Sym s={q.symbol || '?'} className="w-24 shrink-0 truncate font-semibold" />
          <span className="hidden w-32 shrink-0 truncate text-xs text-stone-600 sm:inline">{KIND_SHORT[q.distribution.kind]}</span>
          <span className="min-w-0 flex-1 truncate text-sm text-stone-700">{q.description}</span>
          {t ? (
            <span className="num hidden shrink-0 text-xs text-stone-700 md:inline">
              {formatWithUncertainty(t.estimate, t.standardUncertainty)} <Unit u={q.unit} /> · u {formatUncertainty(t.standardUncertainty)}
            </span>
          ) : null}
          {mine.length ? (
            <span className="shrink-0 rounded-full bg-caution-100 px-2 text-xs font-semibold text-caution-700" title={plainMessage(mine[0])}>
              ⚠ {mine.length}
            </span>
          ) : null}
        </button>
        {!readOnly ? (
          <Button size="sm" variant="ghost" onClick={onRemove} aria-label={`Remove ${q.symbol}`}>
            Remove
          </Button>
        ) : null}
      </div>
      {!open && mine.length ? <p className="px-10 pb-2 text-xs text-caution-700">{plainMessage(mine[0])}</p> : null}
      {open ? (
        <div className="border-t border-stone-200 px-3 py-3">
          <InputForm input={q} index={index} problems={mine} onChange={onChange} readOnly={readOnly} canUpload={canUpload} />
        </div>
      ) : null}
    </li>
  );
}

export function InputsList({
  items,
  onItems,
  problems,
  openKeys,
  onToggle,
  readOnly,
  canUpload,
  selectedSymbol,
  onAdd,
}: {
  items: KeyedInput[];
  onItems(next: KeyedInput[], announce?: string): void;
  problems: Problem[];
  openKeys: Set<string>;
  onToggle(key: string): void;
  readOnly?: boolean;
  canUpload: boolean;
  selectedSymbol?: string;
  onAdd(): void;
}) {
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 4 } }), useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }));
  const onDragEnd = (e: DragEndEvent) => {
    if (!e.over || e.active.id === e.over.id) return;
    const from = items.findIndex((i) => i.key === e.active.id);
    const to = items.findIndex((i) => i.key === e.over!.id);
    onItems(arrayMove(items, from, to));
  };
  // Removing takes effect at once and can be undone from the toast, readings and all.
  const toast = useToast();
  const latest = useLatest(items);
  // focus goes to the row that takes the removed one's place (or back to the restored one), never to the page
  const listRef = useRef<HTMLOListElement>(null);
  const addRef = useRef<HTMLDivElement>(null);
  const focusRow = (index: number) =>
    requestAnimationFrame(() => {
      const toggles = listRef.current?.querySelectorAll<HTMLElement>(':scope > li button[aria-expanded]');
      const target = toggles?.length ? toggles[Math.min(index, toggles.length - 1)] : addRef.current?.querySelector('button');
      target?.focus();
    });
  const remove = (item: KeyedInput, index: number) => {
    const symbol = item.input.symbol || 'the input';
    const d = item.input.distribution;
    const readings = d.kind === 'observations' && Array.isArray(d.values) && d.values.length ? ` with its ${d.values.length} observations` : '';
    onItems(
      items.filter((x) => x.key !== item.key),
      `Removed ${symbol}.`,
    );
    focusRow(index);
    toast(`Removed input ${symbol}${readings}.`, 'info', {
      label: 'Undo',
      run: () => {
        if (latest.current.some((x) => x.key === item.key)) return;
        onItems(restoreAt(latest.current, item, index), `Restored ${symbol}.`);
        focusRow(index);
      },
    });
  };
  const symbolOf = (id: string | number) => items.find((i) => i.key === id)?.input.symbol ?? 'input';
  const pos = (id: string | number | undefined) => items.findIndex((i) => i.key === id) + 1;
  return (
    <div className="flex flex-col gap-2">
      <DndContext
        sensors={sensors}
        collisionDetection={closestCenter}
        onDragEnd={onDragEnd}
        accessibility={{
          announcements: {
            onDragStart: ({ active }) => `Picked up ${symbolOf(active.id)} at position ${pos(active.id)}.`,
            onDragOver: ({ active, over }) => (over ? `${symbolOf(active.id)} is over position ${pos(over.id)}.` : `${symbolOf(active.id)} is no longer over the list.`),
            onDragEnd: ({ active, over }) => (over ? `${symbolOf(active.id)} dropped at position ${pos(over.id)}.` : `${symbolOf(active.id)} dropped.`),
            onDragCancel: ({ active }) => `Moving ${symbolOf(active.id)} was cancelled.`,
          },
          screenReaderInstructions: { draggable: 'To move an input quantity, press space, use the arrow keys, and press space again to drop it; Escape cancels.' },
        }}
      >
        <SortableContext items={items.map((i) => i.key)} strategy={verticalListSortingStrategy}>
          <ol ref={listRef} className="flex flex-col gap-1.5" aria-label="Input quantities">
            {items.map((item, index) => (
              <Row
                key={item.key}
                item={item}
                index={index}
                open={openKeys.has(item.key)}
                onToggle={() => onToggle(item.key)}
                onChange={(input) => onItems(items.map((x) => (x.key === item.key ? { ...x, input } : x)))}
                onRemove={() => remove(item, index)}
                problems={problems}
                readOnly={readOnly}
                canUpload={canUpload}
                selected={selectedSymbol === item.input.symbol}
              />
            ))}
          </ol>
        </SortableContext>
      </DndContext>
      {!readOnly ? (
        <div ref={addRef}>
          <Button onClick={onAdd}>+ Add input quantity</Button>
        </div>
      ) : null}
    </div>
  );
}
