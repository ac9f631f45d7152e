import { isApiError } from '../../lib/api-client';
import { Button } from './button';
import { ErrorIcon } from './icons';

export interface ErrorStateProps {
  title?: string;
  error?: unknown;
  onRetry?: () => void;
  /** The retry button's words, when it does something other than ask again. */
  retryLabel?: string;
}

function messageOf(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}

export function ErrorState({ title = 'This could not be loaded', error, onRetry, retryLabel }: ErrorStateProps) {
  return (
    <div
      role="alert"
      className="flex flex-col items-center rounded-lg border border-danger-700/40 bg-danger-100 px-6 py-8 text-center"
    >
      <ErrorIcon className="text-3xl text-danger-700" />
      <h2 className="mt-2 text-lg font-semibold text-danger-700">{title}</h2>
      <p className="mt-1 max-w-prose text-base text-ink-900">{messageOf(error)}</p>
      {onRetry && (
        <Button variant="secondary" className="mt-4" onClick={onRetry}>
          {retryLabel ?? 'Try again'}
        </Button>
      )}
    </div>
  );
}
