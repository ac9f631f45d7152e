import type { FindingsDelta } from '@shared/diff';
import { FindingsList } from '../../findings/components/findings-list';

/** What the checks say differently: findings the newer revision brought, and those it cleared. */
export function FindingsDeltaView({
  delta,
  toModelId,
  toIsLatest,
}: {
  delta: FindingsDelta;
  toModelId: string;
  toIsLatest: boolean;
}) {
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <div>
        <h3 className="mb-2 text-base font-semibold text-ink-900">
          Introduced <span className="font-normal text-ink-700">({delta.introduced.length})</span>
        </h3>
        <FindingsList
          findings={delta.introduced}
          modelId={toIsLatest ? toModelId : undefined}
          emptyText="The newer revision brings no new findings."
        />
      </div>
      <div>
        <h3 className="mb-2 text-base font-semibold text-ink-900">
          Resolved <span className="font-normal text-ink-700">({delta.resolved.length})</span>
        </h3>
        <FindingsList findings={delta.resolved} emptyText="No finding of the older revision went away." />
      </div>
    </div>
  );
}
