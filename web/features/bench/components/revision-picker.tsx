import { useId } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ChevronDownIcon } from '../../../components/ui/icons';
import { revisionsOf, useRevisions } from '../../models/api/list-revisions';
import type { LatestRevision, Revision } from '../../models/types';

/** Which revision is on the bench: the latest unless `?revision=` names another. */
export function RevisionPicker({
  modelId,
  current,
  latest,
}: {
  modelId: string;
  current: Revision;
  latest: LatestRevision | null;
}) {
  const id = useId();
  const [, setParams] = useSearchParams();
  const history = useRevisions(modelId);
  const listed = revisionsOf(history.data?.pages);
  const options = listed.some((revision) => revision.id === current.id) ? listed : [current, ...listed];

  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm font-medium text-ink-900">
        Revision
      </label>
      <div className="relative">
        <select
          id={id}
          value={current.id}
          onChange={(event) =>
            setParams(event.target.value === latest?.id ? {} : { revision: event.target.value }, { replace: true })
          }
          className="block h-10 max-w-72 appearance-none truncate rounded-md border border-ply-500 bg-paper-raised pr-9 pl-3 text-base text-ink-900"
        >
          {options.map((revision) => (
            <option key={revision.id} value={revision.id}>
              {revision.number}
              {revision.id === latest?.id ? ' (latest)' : ''}
              {revision.message ? ` · ${revision.message}` : ''}
            </option>
          ))}
        </select>
        <ChevronDownIcon className="pointer-events-none absolute top-1/2 right-3 -translate-y-1/2 text-ink-700" />
      </div>
    </div>
  );
}
