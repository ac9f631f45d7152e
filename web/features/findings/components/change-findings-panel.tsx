import { useId } from 'react';
import type { ChangeFinding } from '@shared/diff';
import { Badge, SeverityBadge } from '../../../components/ui/badge';
import { CheckIcon } from '../../../components/ui/icons';
import { cx } from '../../../lib/cx';

export interface ChangeFindingsPanelProps {
  /** null when either revision is not a valid setup: the checks across the two cannot run. */
  findings: readonly ChangeFinding[] | null;
  /** The heading's level in the page it sits in. */
  level?: 2 | 3;
  className?: string;
}

const SEVERITY_ORDER = { error: 0, warning: 1, info: 2 } as const;

/**
 * "Between these revisions": mistakes that exist only across two revisions, such as a
 * channel's travel that changed under a stored failsafe number. Neither revision's own
 * checks can see them, so they are shown apart from the findings delta.
 */
export function ChangeFindingsPanel({ findings, level = 2, className }: ChangeFindingsPanelProps) {
  const headingId = useId();
  const Heading = level === 2 ? 'h2' : 'h3';
  return (
    <section aria-labelledby={headingId} className={className}>
      <Heading id={headingId} className={cx('mb-2 font-semibold text-ink-900', level === 2 ? 'text-xl' : 'text-base')}>
        Between these revisions
        {findings ? <span className="font-normal text-ink-700"> ({findings.length})</span> : null}
      </Heading>
      {findings === null ? (
        <p className="text-base text-ink-700">
          These checks need both revisions to be valid setups; fix the errors that stop one from being read first.
        </p>
      ) : findings.length === 0 ? (
        <p className="flex items-center gap-2 text-base text-ink-700">
          <Badge tone="moss" icon={CheckIcon}>
            Nothing
          </Badge>
          No mistake shows only between the two revisions.
        </p>
      ) : (
        <ul className="divide-y divide-ply-100 rounded-lg border border-ply-200 bg-paper-raised">
          {[...findings]
            .sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity])
            .map((finding, index) => (
              <li key={`${finding.rule}-${finding.path}-${index}`} className="px-4 py-3">
                <div className="flex flex-wrap items-start gap-x-3 gap-y-1 sm:flex-nowrap">
                  <span className="w-24 shrink-0 pt-0.5">
                    <SeverityBadge severity={finding.severity} />
                  </span>
                  <div className="min-w-0 flex-1">
                    <p className="text-base">{finding.message}</p>
                    {finding.hint && <p className="mt-0.5 text-sm text-ink-700">{finding.hint}</p>}
                    <p className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5 text-sm text-ink-500">
                      {finding.path && <code className="font-mono break-all">{finding.path}</code>}
                      <span className="font-mono">{finding.rule}</span>
                      {finding.club_rule && <span className="font-medium text-ink-700">{finding.club_rule}</span>}
                    </p>
                  </div>
                </div>
              </li>
            ))}
        </ul>
      )}
    </section>
  );
}
