import { Badge } from '../../../components/ui/badge';
import { CheckIcon, DashedCircleIcon, ErrorIcon, WarningIcon } from '../../../components/ui/icons';
import type { UnitReadiness } from '../types';

/** How an installed unit stands against its slot now: ready, changes to make, cannot fly there, or not checked. */
export function ReadinessBadge({ readiness }: { readiness: UnitReadiness }) {
  switch (readiness.state) {
    case 'ready':
      return (
        <Badge tone="moss" icon={CheckIcon}>
          Ready
        </Badge>
      );
    case 'changes':
      return (
        <Badge tone="caution" icon={WarningIcon}>
          {readiness.changes} {readiness.changes === 1 ? 'change' : 'changes'} to make
        </Badge>
      );
    case 'blocked':
      return (
        <Badge tone="danger" icon={ErrorIcon}>
          Cannot fly there
        </Badge>
      );
    default:
      return (
        <span title={readiness.reason ?? undefined}>
          <Badge icon={DashedCircleIcon}>Not checked</Badge>
        </span>
      );
  }
}
