import type { ComponentType, ReactNode, SVGProps } from 'react';
import { cx } from '../../../lib/cx';

type Tone = 'info' | 'caution';

const tones: Record<Tone, string> = {
  info: 'border-info-700/40 bg-info-100/60 [&>svg]:text-info-700',
  caution: 'border-caution-700/40 bg-caution-100/60 [&>svg]:text-caution-700',
};

/** A line of news about the edit on show (a restored draft, a read-only role), with its actions. */
export function Notice({
  tone = 'info',
  icon: Icon,
  children,
  actions,
}: {
  tone?: Tone;
  icon: ComponentType<SVGProps<SVGSVGElement>>;
  children: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <div
      className={cx(
        'flex flex-wrap items-start gap-x-3 gap-y-2 rounded-md border px-4 py-2.5 text-sm text-ink-900',
        tones[tone],
      )}
    >
      <Icon className="mt-0.5 shrink-0 text-base" />
      <div className="min-w-0 flex-1 basis-64">{children}</div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </div>
  );
}
