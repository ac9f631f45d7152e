import { Spinner } from './spinner';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center justify-center gap-2 px-6 py-10 text-base text-ink-700">
      <Spinner className="text-accent-700" />
      <span>{label}</span>
    </div>
  );
}
