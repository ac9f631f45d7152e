import { Badge, SeverityBadge } from '../../../components/ui/badge';
import { CheckIcon } from '../../../components/ui/icons';

/** A revision's check summary as badges: its errors and warnings, or a word that there are none. */
export function CheckBadges({ errors, warnings }: { errors: number; warnings: number }) {
  if (errors === 0 && warnings === 0) {
    return (
      <Badge tone="moss" icon={CheckIcon}>
        No problems
      </Badge>
    );
  }
  return (
    <span className="inline-flex flex-wrap gap-1">
      {errors > 0 && <SeverityBadge severity="error" count={errors} />}
      {warnings > 0 && <SeverityBadge severity="warning" count={warnings} />}
    </span>
  );
}
