import { useId } from 'react';
import { Link } from 'react-router-dom';
import type { Finding, Severity } from '@shared/findings';
import { Badge, SeverityBadge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
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
  /** When given, each open warning and note offers to be accepted (errors never can). */
  onAccept?: (finding: Finding) => void;
  /** When given, each accepted finding offers to take the acceptance back. */
  onWithdraw?: (finding: Finding) => void;
}

const keyOf = (finding: Finding, index: number) =>
  `${finding.rule}-${finding.path}-${finding.line}-${finding.column}-${index}`;

/**
 * The findings of one text: the open ones first, then the accepted ones apart with
 * the pilot's reason (they do not count as open: docs/format.md, accepted[]).
 */
export function FindingsList({
  findings,
  modelId,
  emptyText = 'The checks found nothing to change.',
  className,
  onAccept,
  onWithdraw,
}: FindingsListProps) {
  const headingId = useId();
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
  const open = orderFindings(findings.filter((finding) => finding.accepted === undefined));
  const accepted = orderFindings(findings.filter((finding) => finding.accepted !== undefined));
  return (
    <div className={cx('space-y-3', className)}>
      {open.length > 0 ? (
        <ul className="divide-y divide-ply-100 rounded-lg border border-ply-200 bg-paper-raised">
          {open.map((finding, index) => (
            <FindingItem
              key={keyOf(finding, index)}
              finding={finding}
              modelId={modelId}
              action={
                onAccept && finding.severity !== 'error'
                  ? { label: 'Accept…', which: finding.rule, run: () => onAccept(finding) }
                  : undefined
              }
            />
          ))}
        </ul>
      ) : (
        <p className="flex items-center gap-2 text-base text-ink-700">
          <Badge tone="moss" icon={CheckIcon}>
            No open findings
          </Badge>
          Every finding left is accepted, with its reason below.
        </p>
      )}
      {accepted.length > 0 && (
        <section aria-labelledby={headingId}>
          <h3 id={headingId} className="text-sm font-semibold text-ink-900">
            Accepted ({accepted.length})
          </h3>
          <p className="text-sm text-ink-700">Looked at and accepted with a reason; not counted as open.</p>
          <ul className="mt-1.5 divide-y divide-ply-100 rounded-lg border border-dashed border-ply-300 bg-paper">
            {accepted.map((finding, index) => (
              <FindingItem
                key={keyOf(finding, index)}
                finding={finding}
                modelId={modelId}
                action={
                  onWithdraw
                    ? {
                        label: 'Take back',
                        which: finding.rule,
                        run: () => onWithdraw(finding),
                      }
                    : undefined
                }
              />
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}

interface ItemAction {
  label: string;
  /** Said to assistive technology after the label: the label alone does not say which finding. */
  which: string;
  run: () => void;
}

function FindingItem({ finding, modelId, action }: { finding: Finding; modelId?: string; action?: ItemAction }) {
  return (
    <li className="flex items-start">
      {modelId ? (
        <Link
          to={findingEditPath(modelId, finding)}
          className="block min-w-0 flex-1 px-4 py-3 text-ink-900 no-underline hover:bg-paper hover:text-ink-900"
        >
          <FindingBody finding={finding} linked />
        </Link>
      ) : (
        <div className="min-w-0 flex-1 px-4 py-3">
          <FindingBody finding={finding} />
        </div>
      )}
      {action && (
        <div className="shrink-0 py-3 pr-3">
          <Button variant="secondary" size="sm" onClick={action.run}>
            {action.label}
            <span className="sr-only"> ({action.which})</span>
          </Button>
        </div>
      )}
    </li>
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
        {finding.accepted !== undefined ? (
          <p className="mt-0.5 text-sm text-ink-900">
            <span className="font-semibold">Accepted:</span> {finding.accepted}
          </p>
        ) : (
          finding.hint && <p className="mt-0.5 text-sm text-ink-700">{finding.hint}</p>
        )}
        <p className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5 text-sm text-ink-500">
          {finding.path && <code className="font-mono break-all">{finding.path}</code>}
          <span className={cx('font-mono whitespace-nowrap', linked && 'text-accent-700 underline')}>
            line {finding.line}:{finding.column}
            {linked && <span className="sr-only"> (opens in the editor)</span>}
          </span>
          <span className="font-mono">{finding.rule}</span>
        </p>
      </div>
    </div>
  );
}
