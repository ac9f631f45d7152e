import { Link } from 'react-router-dom';
import type { Finding, Severity } from '@shared/findings';
import { Badge, SeverityBadge } from '../../../components/ui/badge';
import { CheckIcon } from '../../../components/ui/icons';
import { cx } from '../../../lib/cx';

const SEVERITY_ORDER: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Errors first, then warnings, then notes; within each, in the order of the text. */
export function orderFindings(findings: readonly Finding[]): Finding[] {
  return [...findings].sort(
    (a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] || a.line - b.line || a.column - b.column,
  );
}

/** Where a finding opens in the editor: its line, read by the Edit screen from `?line=`. */
export const findingEditPath = (modelId: string, finding: Pick<Finding, 'line'>) =>
  `/models/${encodeURIComponent(modelId)}/edit?line=${finding.line}`;

export interface FindingsListProps {
  findings: readonly Finding[];
  /** When given, each finding links to its line in this model's editor. */
  modelId?: string;
  /** Said when the list is empty. */
  emptyText?: string;
  className?: string;
}

export function FindingsList({
  findings,
  modelId,
  emptyText = 'The checks found nothing to change.',
  className,
}: FindingsListProps) {
  if (findings.length === 0) {
    return (
      <p className={cx('flex items-center gap-2 text-base text-ink-700', className)}>
        <Badge tone="moss" icon={CheckIcon}>
          No findings
        </Badge>
        {emptyText}
      </p>
    );
  }
  return (
    <ul className={cx('divide-y divide-ply-100 rounded-lg border border-ply-200 bg-paper-raised', className)}>
      {orderFindings(findings).map((finding, index) => (
        <li key={`${finding.rule}-${finding.path}-${finding.line}-${finding.column}-${index}`}>
          {modelId ? (
            <Link
              to={findingEditPath(modelId, finding)}
              className="block px-4 py-3 text-ink-900 no-underline hover:bg-paper hover:text-ink-900"
            >
              <FindingBody finding={finding} linked />
            </Link>
          ) : (
            <div className="px-4 py-3">
              <FindingBody finding={finding} />
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}

function FindingBody({ finding, linked = false }: { finding: Finding; linked?: boolean }) {
  return (
    <div className="flex flex-wrap items-start gap-x-3 gap-y-1 sm:flex-nowrap">
      <span className="w-24 shrink-0 pt-0.5">
        <SeverityBadge severity={finding.severity} />
      </span>
      <div className="min-w-0 flex-1">
        <p className="text-base">{finding.message}</p>
        {finding.hint && <p className="mt-0.5 text-sm text-ink-700">{finding.hint}</p>}
        <p className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5 text-sm text-ink-500">
          {finding.path && <code className="font-mono break-all">{finding.path}</code>}
          <span className={cx('font-mono whitespace-nowrap', linked && 'text-accent-700 underline')}>
            line {finding.line}:{finding.column}
            {linked && <span className="sr-only"> (opens in the editor)</span>}
          </span>
          <span className="font-mono">{finding.rule}</span>
          {finding.club_rule && <span className="font-medium text-ink-700">{finding.club_rule}</span>}
        </p>
      </div>
    </div>
  );
}
