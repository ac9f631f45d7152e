import { CheckIcon, ErrorIcon } from './icons';

/** A form's general message: an error not tied to one field, or the server's answer. */
export function FormAlert({ tone = 'error', children }: { tone?: 'error' | 'success'; children: string }) {
  if (tone === 'success') {
    return (
      <div
        role="status"
        className="flex items-start gap-2 rounded-md border border-moss-700 bg-moss-100 px-3 py-2.5 text-sm text-moss-700"
      >
        <CheckIcon className="mt-0.5 shrink-0 text-base" />
        <p>{children}</p>
      </div>
    );
  }
  return (
    <div
      role="alert"
      className="flex items-start gap-2 rounded-md border border-danger-700 bg-danger-100 px-3 py-2.5 text-sm text-danger-700"
    >
      <ErrorIcon className="mt-0.5 shrink-0 text-base" />
      <p>{children}</p>
    </div>
  );
}
