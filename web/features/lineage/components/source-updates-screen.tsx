import { useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { MergeSide } from '@shared/lineage/merge-setups';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { FormAlert } from '../../../components/ui/form-alert';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useToast } from '../../../components/ui/toast';
import { useModel } from '../../models/api/get-model';
import { canEdit } from '../../models/permissions';
import type { SetupModelView } from '../../models/types';
import { useSourceUpdates, useTakeInSource } from '../api/source-updates';
import { ConflictChoices } from './conflict-choices';

/** A fork taking in its source's newer revisions: what comes in, the conflicts to settle, then one new revision. */
export function SourceUpdatesScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);
  const updates = useSourceUpdates(modelId, Boolean(model.data?.forked_from?.readable));

  let body: ReactNode;
  if (model.isPending || (model.data?.forked_from?.readable && updates.isPending))
    body = <LoadingState label="Comparing the fork with its source…" />;
  else if (model.isError)
    body = (
      <ErrorState title="This model could not be loaded" error={model.error} onRetry={() => void model.refetch()} />
    );
  else if (!model.data.forked_from?.readable)
    body = (
      <EmptyState title="Nothing to take in">
        This model is not a fork of a model you can read, so it has no source to take changes from.
      </EmptyState>
    );
  else if (updates.isError)
    body = (
      <ErrorState
        title="The source could not be compared"
        error={updates.error}
        onRetry={() => void updates.refetch()}
      />
    );
  else body = <TakeIn model={model.data} updates={updates.data!} />;

  return (
    <>
      <PageHeader
        title="Take in the source’s changes"
        documentTitle={model.data ? `Source updates · ${model.data.name}` : 'Source updates'}
        description="A change only the source made comes in; a change only this fork made stays; a setting both changed is yours to choose. The fork's comments and layout are kept, and the result is checked like any save."
      />
      {body}
    </>
  );
}

function TakeIn({
  model,
  updates,
}: {
  model: SetupModelView;
  updates: NonNullable<ReturnType<typeof useSourceUpdates>['data']>;
}) {
  const [choices, setChoices] = useState<Record<string, MergeSide>>({});
  const [message, setMessage] = useState('');
  const takeIn = useTakeInSource(model);
  const navigate = useNavigate();
  const toast = useToast();

  if (updates.behind === 0)
    return (
      <EmptyState title="Up to date">
        This fork has everything up to revision {updates.source.number} of {updates.source.name}.{' '}
        <Link to={`/models/${model.id}/overview`}>Back to the overview</Link>
      </EmptyState>
    );

  const open = updates.conflicts.filter((conflict) => !choices[conflict.path]);
  const submit = () =>
    takeIn.mutate(
      { modelId: model.id, base: updates.ours.number, resolutions: choices, message: message.trim() || undefined },
      {
        onSuccess: (saved) => {
          toast({
            tone: 'success',
            title: `Saved revision ${saved.number}`,
            description: `It takes in ${updates.source.name} up to revision ${updates.source.number}.`,
          });
          void navigate(`/models/${model.id}/overview`);
        },
      },
    );

  return (
    <div className="space-y-6">
      <Card className="px-5 py-4">
        <h2 className="text-lg font-semibold text-ink-900">
          {updates.source.name}:{' '}
          {updates.behind === 1
            ? `revision ${updates.source.number} changed`
            : `revisions ${updates.base.number + 1}-${updates.source.number} changed`}
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-900">
          {updates.changes.map((change, index) => (
            <li key={`${change.path}-${index}`}>{change.summary}</li>
          ))}
        </ul>
        <Link
          className="mt-2 inline-block text-sm"
          to={`/models/${model.id}/compare?from=${updates.base.revision_id}&to=${updates.source.revision_id}`}
        >
          Open the full compare
        </Link>
      </Card>

      {updates.conflicts.length > 0 && (
        <section aria-labelledby="conflicts-heading">
          <h2 id="conflicts-heading" className="text-lg font-semibold text-ink-900">
            Changed on both sides: choose which to keep
          </h2>
          <p className="mb-3 text-sm text-ink-700">
            {open.length === 0
              ? 'Every conflict has a side chosen.'
              : `${open.length} of ${updates.conflicts.length} still to choose.`}
          </p>
          <ConflictChoices
            conflicts={updates.conflicts}
            choices={choices}
            onChoose={(path, side) => setChoices({ ...choices, [path]: side })}
            oursLabel="this fork’s"
            theirsLabel="the source’s"
          />
        </section>
      )}

      {takeIn.error && <FormAlert>{takeIn.error.message}</FormAlert>}

      {canEdit(model.role) && (
        <div className="flex flex-wrap items-end gap-3">
          <label className="block min-w-64 flex-1 text-sm text-ink-700">
            Message for the new revision (optional)
            <input
              className="mt-1 block w-full rounded-sm border border-ply-300 bg-paper-raised px-3 py-2 text-base text-ink-900"
              value={message}
              maxLength={500}
              placeholder={`Took in ${updates.source.name} up to revision ${updates.source.number}`}
              onChange={(event) => setMessage(event.target.value)}
            />
          </label>
          <Button disabled={open.length > 0 || takeIn.isPending} onClick={submit}>
            Save revision {updates.ours.number + 1} with these changes
          </Button>
          <Link className={buttonClasses('quiet')} to={`/models/${model.id}/overview`}>
            Not now
          </Link>
        </div>
      )}
    </div>
  );
}
