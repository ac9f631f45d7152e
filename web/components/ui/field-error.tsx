import { ErrorIcon } from './icons';

/** The message under a field that the server or the form refused. */
export function FieldError({ id, children }: { id: string; children: string }) {
  return (
    <p id={id} className="mt-1.5 flex items-start gap-1.5 text-sm text-danger-700">
      <ErrorIcon className="mt-1 shrink-0" />
      <span>{children}</span>
    </p>
  );
}
