import { useEffect, useId, useRef, useState, type ButtonHTMLAttributes, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes, type Ref } from 'react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-accent-600 text-white hover:bg-accent-700 disabled:bg-stone-300 disabled:text-stone-600',
  secondary: 'border border-stone-300 bg-white text-stone-800 hover:bg-stone-100 disabled:text-stone-400',
  ghost: 'text-accent-700 hover:bg-accent-50 disabled:text-stone-400',
  danger: 'border border-caution-500 bg-white text-caution-700 hover:bg-caution-50',
};

export function Button({ variant = 'secondary', size = 'md', className = '', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: 'sm' | 'md' }) {
  const pad = size === 'sm' ? 'px-2 py-1 text-xs' : 'px-3 py-1.5 text-sm';
  return (
    <button
      type="button"
      {...rest}
      className={`inline-flex items-center justify-center gap-1.5 rounded-md font-medium transition-colors disabled:cursor-not-allowed ${pad} ${VARIANTS[variant]} ${className}`}
    />
  );
}

/** A labelled field with its hint and validation message (announced to screen readers). */
export function Field({
  label,
  error,
  hint,
  children,
  className = '',
  id,
}: {
  label: ReactNode;
  error?: string | null;
  hint?: ReactNode;
  children: (props: { id: string; 'aria-invalid': boolean; 'aria-describedby'?: string }) => ReactNode;
  className?: string;
  id?: string;
}) {
  const auto = useId();
  const fieldId = id ?? auto;
  const described = [hint ? `${fieldId}-hint` : null, error ? `${fieldId}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={fieldId} className="text-xs font-medium text-stone-700">
        {label}
      </label>
      {children({ id: fieldId, 'aria-invalid': !!error, 'aria-describedby': described })}
      {hint && !error ? (
        <p id={`${fieldId}-hint`} className="text-xs text-stone-600">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${fieldId}-error`} role="alert" className="text-xs font-medium text-caution-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export const inputClass =
  'w-full rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm text-stone-900 placeholder:text-stone-500 aria-[invalid=true]:border-caution-500 aria-[invalid=true]:bg-caution-50 disabled:bg-stone-100 disabled:text-stone-600 read-only:bg-stone-50';

export function TextInput({ className = '', ...rest }: InputHTMLAttributes<HTMLInputElement>) {
  return <input type="text" {...rest} className={`${inputClass} ${className}`} />;
}

export function TextArea({ className = '', ...rest }: TextareaHTMLAttributes<HTMLTextAreaElement> & { ref?: Ref<HTMLTextAreaElement> }) {
  return <textarea {...rest} className={`${inputClass} ${className}`} />;
}

export function Select({ className = '', children, ...rest }: SelectHTMLAttributes<HTMLSelectElement>) {
  return (
    <select {...rest} className={`${inputClass} ${className}`}>
      {children}
    </select>
  );
}

function parseNumberText(text: string): number | undefined {
  const t = text
    .trim()
    .replace(/[\s\u202f\u2009]/g, '')
    .replace(/\u2212/g, '-')
    .replace(/,/g, '.');
  if (t === '') return undefined;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) return NaN;
  return Number(t);
}

/**
 * A number field that keeps what the user types: the value it reports is a
 * number, undefined when empty, or NaN when the text is not a number (the
 * budget's validation then names the field).
 */
export function NumberInput({
  value,
  onValue,
  className = '',
  ...rest
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange'> & { value: number | undefined | null; onValue(v: number | undefined): void }) {
  const [text, setText] = useState(() => (value === undefined || value === null || Number.isNaN(value) ? '' : String(value)));
  const last = useRef<number | undefined | null>(value);
  useEffect(() => {
    if (Object.is(value, last.current)) return;
    last.current = value;
    const current = parseNumberText(text);
    if (!Object.is(current, value) && !(value === null && current === undefined)) {
      // eslint-disable-next-line react-hooks/set-state-in-effect -- the text follows a value changed from outside, and keeps what was typed when it reads as the same number
      setText(value === undefined || value === null || Number.isNaN(value) ? '' : String(value));
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  return (
    <input
      type="text"
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      {...rest}
      value={text}
      onChange={(e) => {
        setText(e.target.value);
        const v = parseNumberText(e.target.value);
        last.current = v;
        onValue(v);
      }}
      className={`${inputClass} num ${className}`}
    />
  );
}

export function Spinner({ label = 'Loading' }: { label?: string }) {
  return (
    <span role="status" className="inline-flex items-center gap-2 text-sm text-stone-600">
      <span aria-hidden className="h-4 w-4 animate-spin rounded-full border-2 border-stone-300 border-t-accent-600" />
      {label}…
    </span>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-stone-300 bg-white px-6 py-10 text-center">
      <p className="text-base font-semibold text-stone-800">{title}</p>
      {children ? <div className="mt-2 text-sm text-stone-600">{children}</div> : null}
    </div>
  );
}

/** `heading` when the note is all the page shows: its title is then the page's level-one heading. */
export function ErrorNote({ title = 'Something went wrong', heading, children }: { title?: string; heading?: boolean; children: ReactNode }) {
  const Title = heading ? 'h1' : 'p';
  return (
    <div role="alert" className="rounded-md border border-caution-500 bg-caution-50 px-3 py-2 text-sm text-caution-700">
      <Title className="font-semibold">{title}</Title>
      <div>{children}</div>
    </div>
  );
}

/** A modal built on <dialog>: focus is trapped and Escape closes it. */
export function Modal({ open, onClose, title, children, wide }: { open: boolean; onClose(): void; title: string; children: ReactNode; wide?: boolean }) {
  const ref = useRef<HTMLDialogElement>(null);
  // one id per dialog: a page may hold several (closed ones stay mounted), and each is named by its own title
  const titleId = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      aria-labelledby={titleId}
      className={`m-auto w-full ${wide ? 'max-w-3xl' : 'max-w-lg'} rounded-lg border border-stone-300 bg-white p-0 text-stone-900 shadow-xl backdrop:bg-stone-900/40`}
    >
      {open ? (
        <div className="flex flex-col gap-4 p-5">
          <h2 id={titleId} className="text-lg font-semibold">
            {title}
          </h2>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}

/** A form's submit button: disabled, and saying what happens, while the request runs. */
export function SubmitButton({ pending, pendingLabel, children, variant = 'primary', size }: { pending: boolean; pendingLabel: string; children: ReactNode; variant?: Variant; size?: 'sm' | 'md' }) {
  return (
    <Button type="submit" variant={variant} size={size} disabled={pending}>
      {pending ? pendingLabel : children}
    </Button>
  );
}

/** Why a form's request failed, announced to screen readers. */
export function FormError({ children }: { children: ReactNode }) {
  return (
    <p role="alert" className="rounded-md border border-caution-500 bg-caution-50 px-3 py-2 text-sm text-caution-700">
      {children}
    </p>
  );
}

/** A modal holding one form: the caller's fields, then Cancel and the submit button. */
export function FormDialog({
  open = true,
  onClose,
  title,
  onSubmit,
  submitLabel,
  pendingLabel,
  pending,
  variant = 'primary',
  children,
}: {
  open?: boolean;
  onClose(): void;
  title: string;
  onSubmit(): void;
  submitLabel: string;
  pendingLabel: string;
  pending: boolean;
  variant?: Variant;
  children: ReactNode;
}) {
  return (
    <Modal open={open} onClose={onClose} title={title}>
      <form
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          onSubmit();
        }}
      >
        {children}
        <div className="flex justify-end gap-2">
          <Button onClick={onClose}>Cancel</Button>
          <SubmitButton variant={variant} pending={pending} pendingLabel={pendingLabel}>
            {submitLabel}
          </SubmitButton>
        </div>
      </form>
    </Modal>
  );
}
