import { Link } from 'react-router-dom';
import { buttonClasses } from '../../../components/ui/button';
import { canEdit } from '../../models/permissions';
import type { SetupModelView } from '../../models/types';
import { useSourceUpdates } from '../api/source-updates';

/** On a fork's Overview and History: how many newer revisions its source has, a compare and the merge. */
export function SourceUpdatesNotice({ model }: { model: SetupModelView }) {
  const updates = useSourceUpdates(model.id, Boolean(model.forked_from?.readable));
  const data = updates.data;
  if (!data || data.behind === 0) return null;
  const revisions = data.behind === 1 ? '1 newer revision' : `${data.behind} newer revisions`;
  return (
    <section
      aria-label="Source updates"
      className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-info-700/40 bg-info-100/60 px-5 py-3"
    >
      <p className="text-base text-ink-900">
        The source has {revisions}: {data.source.name} is at revision {data.source.number}, this fork took in revision{' '}
        {data.base.number}.
        {data.conflicts.length > 0 &&
          ` ${data.conflicts.length === 1 ? 'One setting was' : `${data.conflicts.length} settings were`} changed here too.`}
      </p>
      <div className="flex flex-wrap gap-2">
        <Link
          className={buttonClasses('secondary', 'sm')}
          to={`/models/${model.id}/compare?from=${data.base.revision_id}&to=${data.source.revision_id}`}
        >
          Compare what they changed
        </Link>
        {canEdit(model.role) && (
          <Link className={buttonClasses('primary', 'sm')} to={`/models/${model.id}/source-updates`}>
            Take in the changes
          </Link>
        )}
      </div>
    </section>
  );
}
