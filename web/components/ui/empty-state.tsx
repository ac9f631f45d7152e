import type { ReactNode } from 'react';
import { EmptyShelfIcon } from './icons';

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-center rounded-lg border border-dashed border-ply-300 bg-paper px-6 py-10 text-center">
      <EmptyShelfIcon className="text-4xl text-ply-500" />
      <h2 className="mt-3 text-lg font-semibold text-ink-900">{title}</h2>
      {children && <div className="mt-1 max-w-prose text-base text-ink-700">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}
