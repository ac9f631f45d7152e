import { useId } from 'react';
import { Card } from '../../../components/ui/card';
import { WarningIcon } from '../../../components/ui/icons';
import { cx } from '../../../lib/cx';
import { CAUTIONS, CAUTIONS_HEADING } from '@shared/cautions';

export function CautionsPanel({ className, headingLevel = 2 }: { className?: string; headingLevel?: 2 | 3 }) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const headingId = useId();
  return (
    <Card className={cx('border-caution-700/40 bg-caution-100/40 px-5 py-4', className)}>
      <section aria-labelledby={headingId}>
        <Heading id={headingId} className="flex items-center gap-2 text-lg font-semibold text-ink-900">
          <WarningIcon className="text-caution-700" />
          {CAUTIONS_HEADING}
        </Heading>
        <ul className="mt-3 space-y-3">
          {CAUTIONS.map((caution) => (
            <li key={caution.title} className="border-l-2 border-caution-700/50 pl-3">
              <p className="font-medium text-ink-900">{caution.title}</p>
              <p className="mt-0.5 text-sm text-ink-700">{caution.body}</p>
            </li>
          ))}
        </ul>
      </section>
    </Card>
  );
}
