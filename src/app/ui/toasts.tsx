import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';

type Tone = 'success' | 'error' | 'info';

/** A toast's one action, e.g. Undo after a removal. */
interface ToastAction {
  label: string;
  run(): void;
}

interface Toast {
  id: number;
  tone: Tone;
  text: string;
  action?: ToastAction;
}

type Push = (text: string, tone?: Tone, action?: ToastAction) => void;

const ToastContext = createContext<Push>(() => {});

export function useToast() {
  return useContext(ToastContext);
}

/** How long a toast stays: errors and toasts with an action longer, so there is time to read or act. */
const lifetime = (t: Toast) => (t.action ? 10_000 : t.tone === 'error' ? 8000 : 4500);

function ToastItem({ toast, onDone }: { toast: Toast; onDone(id: number): void }) {
  // a toast the pointer or the keyboard is on stays until it is left
  const [held, setHeld] = useState(false);
  useEffect(() => {
    if (held) return;
    const timer = setTimeout(() => onDone(toast.id), lifetime(toast));
    return () => clearTimeout(timer);
  }, [held, toast, onDone]);
  const t = toast;
  return (
    <div
      role={t.tone === 'error' ? 'alert' : 'status'}
      onMouseEnter={() => setHeld(true)}
      onMouseLeave={() => setHeld(false)}
      onFocus={() => setHeld(true)}
      onBlur={() => setHeld(false)}
      className={`pointer-events-auto flex items-center gap-2 rounded-md border px-3 py-2 text-sm shadow-md ${
        t.tone === 'error' ? 'border-caution-500 bg-caution-50 text-caution-700' : t.tone === 'success' ? 'border-accent-600 bg-white text-accent-700' : 'border-stone-300 bg-white text-stone-800'
      }`}
    >
      <span className="flex-1">
        <span aria-hidden className="mr-1">
          {t.tone === 'error' ? '⚠' : t.tone === 'success' ? '✓' : 'ℹ'}
        </span>
        {t.text}
      </span>
      {t.action ? (
        <button
          type="button"
          className="rounded-md border border-accent-600 bg-white px-2 py-0.5 text-xs font-semibold text-accent-700 hover:bg-accent-50"
          onClick={() => {
            t.action?.run();
            onDone(t.id);
          }}
        >
          {t.action.label}
        </button>
      ) : null}
    </div>
  );
}

export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<Toast[]>([]);
  const push = useCallback<Push>((text, tone = 'success', action) => {
    const id = Date.now() + Math.random();
    setToasts((t) => [...t, { id, tone, text, action }]);
  }, []);
  const drop = useCallback((id: number) => setToasts((t) => t.filter((x) => x.id !== id)), []);
  const value = useMemo(() => push, [push]);
  return (
    <ToastContext.Provider value={value}>
      {children}
      <div aria-live="polite" className="no-print pointer-events-none fixed bottom-4 right-4 z-50 flex w-80 flex-col gap-2">
        {toasts.map((t) => (
          <ToastItem key={t.id} toast={t} onDone={drop} />
        ))}
      </div>
    </ToastContext.Provider>
  );
}
