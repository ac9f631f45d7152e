import { createContext, useCallback, useContext, useEffect, useRef, useState, type ReactNode } from 'react';
import { cx } from '../../lib/cx';
import { CheckIcon, CloseIcon, ErrorIcon, InfoIcon } from './icons';

export type ToastTone = 'success' | 'error' | 'info';

export interface ToastInput {
  title: string;
  description?: string;
  tone?: ToastTone;
}

interface Toast extends Required<Omit<ToastInput, 'description'>> {
  id: number;
  description?: string;
}

type ShowToast = (toast: ToastInput) => void;

const ToastContext = createContext<ShowToast | null>(null);

// Confirmations fade on their own; errors stay until dismissed so nobody misses one.
const AUTO_DISMISS_MS = 6000;

const look: Record<ToastTone, { icon: typeof CheckIcon; classes: string }> = {
  success: { icon: CheckIcon, classes: 'border-moss-700 text-moss-700' },
  error: { icon: ErrorIcon, classes: 'border-danger-700 text-danger-700' },
  info: { icon: InfoIcon, classes: 'border-accent-700 text-accent-700' },
};

export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<Toast[]>([]);
  const nextId = useRef(1);

  const dismiss = useCallback((id: number) => setToasts((all) => all.filter((toast) => toast.id !== id)), []);
  const show = useCallback<ShowToast>((input) => {
    const id = nextId.current++;
    setToasts((all) => [
      ...all,
      { id, title: input.title, description: input.description, tone: input.tone ?? 'success' },
    ]);
  }, []);

  return (
    <ToastContext.Provider value={show}>
      {children}
      <div
        aria-live="polite"
        role="region"
        aria-label="Notifications"
        className="pointer-events-none fixed right-4 bottom-4 z-50 flex w-[min(24rem,calc(100vw-2rem))] flex-col gap-2"
      >
        {toasts.map((toast) => (
          <ToastItem key={toast.id} toast={toast} onDismiss={dismiss} />
        ))}
      </div>
    </ToastContext.Provider>
  );
}

function ToastItem({ toast, onDismiss }: { toast: Toast; onDismiss: (id: number) => void }) {
  useEffect(() => {
    if (toast.tone === 'error') return;
    const timer = setTimeout(() => onDismiss(toast.id), AUTO_DISMISS_MS);
    return () => clearTimeout(timer);
  }, [toast, onDismiss]);

  const { icon: Icon, classes } = look[toast.tone];
  return (
    <div
      className={cx(
        'pointer-events-auto flex items-start gap-3 rounded-md border-l-4 bg-paper-raised px-4 py-3 shadow-toast',
        classes,
      )}
    >
      <Icon className="mt-1 shrink-0" />
      <div className="min-w-0 flex-1">
        <p className="font-medium text-ink-900">{toast.title}</p>
        {toast.description && <p className="mt-0.5 text-sm text-ink-700">{toast.description}</p>}
      </div>
      <button
        type="button"
        onClick={() => onDismiss(toast.id)}
        className="rounded-sm p-1 text-ink-700 hover:bg-ply-100"
        aria-label="Dismiss notification"
      >
        <CloseIcon />
      </button>
    </div>
  );
}

export function useToast(): ShowToast {
  const show = useContext(ToastContext);
  if (!show) throw new Error('useToast needs a ToastProvider above it');
  return show;
}
