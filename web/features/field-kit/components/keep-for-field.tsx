import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { useKeptModels, useOnline, useSavesOffline } from '../../../hooks/use-offline';
import { setKeptModel } from '../../../lib/offline';
import type { Id } from '../../../types/api';
import { useKeepForField } from '../api/keep-for-field';

const when = (iso: string) =>
  new Date(iso).toLocaleString(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

/**
 * "Keep for the field": saves the model's newest approved revision (its Overview and
 * Field sheet) on this device for reading with no signal. Shown only where a service
 * worker saves answers, since nothing would be kept without one.
 */
export function KeepForField({ modelId }: { modelId: Id }) {
  const saves = useSavesOffline();
  const online = useOnline();
  const kept = useKeptModels().find((entry) => entry.modelId === modelId);
  const keep = useKeepForField(modelId);
  if (!saves) return null;

  return (
    <div className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-2 text-sm text-ink-700 print:hidden">
      {kept ? (
        <>
          <p role="status">
            Kept for the field on this device: revision {kept.revisionNumber}, saved {when(kept.savedAt)}.{' '}
            <Link to={`/models/${encodeURIComponent(modelId)}/sheet?revision=${kept.revisionNumber}`}>
              Its field sheet
            </Link>
          </p>
          <Button
            variant="secondary"
            size="sm"
            disabled={!online}
            pending={keep.isPending}
            onClick={() => keep.mutate()}
          >
            Save again
          </Button>
          <Button variant="quiet" size="sm" onClick={() => setKeptModel(modelId, null)}>
            Stop keeping
          </Button>
        </>
      ) : (
        <>
          <Button
            variant="secondary"
            size="sm"
            disabled={!online}
            pending={keep.isPending}
            onClick={() => keep.mutate()}
          >
            Keep for the field
          </Button>
          <span>
            {online
              ? 'Saves its newest approved revision on this device, to read with no signal.'
              : 'Keeping a model for the field needs the network.'}
          </span>
        </>
      )}
      {keep.isError && (
        <p role="alert" className="basis-full text-danger-700">
          {keep.error.message}
        </p>
      )}
    </div>
  );
}
