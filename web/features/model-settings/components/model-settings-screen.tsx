import { useState, type FormEvent, type ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Dialog } from '../../../components/ui/dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { FormAlert } from '../../../components/ui/form-alert';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { useModel } from '../../models/api/get-model';
import { useRevision } from '../../models/api/get-revision';
import { canEdit } from '../../models/permissions';
import type { SetupModelView } from '../../models/types';
import { useRenameModel, useSetArchived } from '../api/model-settings';

/** The name the setup text gives itself (`model.name`), when it gives one. */
function textName(document: unknown): string | null {
  const name = (document as { model?: { name?: unknown } } | null)?.model?.name;
  return typeof name === 'string' && name.trim() !== '' ? name.trim() : null;
}

export function ModelSettingsScreen() {
  const { modelId = '' } = useParams();
  const model = useModel(modelId);

  let body: ReactNode;
  if (model.isPending) body = <LoadingState label="Loading the model…" />;
  else if (model.isError)
    body = (
      <ErrorState title="This model could not be loaded" error={model.error} onRetry={() => void model.refetch()} />
    );
  else body = <Settings model={model.data} />;

  return (
    <>
      <PageHeader
        title="Settings"
        documentTitle={model.data ? `Settings · ${model.data.name}` : 'Settings'}
        description="The model's name and its place in the hangar. Nothing here deletes a revision."
      />
      {body}
    </>
  );
}

function Settings({ model }: { model: SetupModelView }) {
  const editable = canEdit(model.role);
  const latest = useRevision(model.latest?.id);
  const inText = latest.data ? textName(latest.data.document) : null;
  return (
    <div className="grid max-w-3xl gap-6">
      <RenameCard model={model} editable={editable} inText={inText} />
      <ArchiveCard model={model} editable={editable} />
    </div>
  );
}

function RenameCard({ model, editable, inText }: { model: SetupModelView; editable: boolean; inText: string | null }) {
  const toast = useToast();
  const rename = useRenameModel(model);
  const [name, setName] = useState(model.name);
  const [problem, setProblem] = useState<string | undefined>();
  const drifted = inText !== null && inText !== model.name;

  const submit = (wanted: string) => {
    const next = wanted.trim();
    if (next === '') return setProblem('Give the model a name.');
    if (next.length > 80) return setProblem('Keep the name to 80 characters.');
    setProblem(undefined);
    rename.mutate(next, {
      onSuccess: ({ model: renamed, revision }) => {
        setName(renamed.name);
        toast({
          title: `Renamed to ${renamed.name}`,
          description: revision
            ? `The setup's model.name changed with it, saved as revision ${revision.number}.`
            : 'The setup text already had this name.',
        });
      },
      onError: (error) => setProblem(isApiError(error) ? (error.fields.name ?? error.message) : error.message),
    });
  };

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    submit(name);
  };

  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Name</h2>
      <p className="mt-1 text-sm text-ink-700">
        The name shows in the hangar, on reviews and on the field sheet. It is kept in step with the setup&apos;s own{' '}
        <code className="font-mono">model.name</code>: renaming here saves a revision that changes that one line, so the
        history and any review show the rename.
      </p>
      {drifted && (
        <div className="mt-3 flex flex-wrap items-center gap-3 rounded-md border border-caution-700/40 bg-caution-100/60 px-3 py-2 text-sm text-ink-900">
          <span className="min-w-0 flex-1 basis-64">
            The setup text calls this model <strong className="font-semibold">{inText}</strong>, the hangar{' '}
            <strong className="font-semibold">{model.name}</strong>.
          </span>
          {editable && (
            <Button variant="secondary" size="sm" onClick={() => submit(model.name)} pending={rename.isPending}>
              Write “{model.name}” into the text
            </Button>
          )}
        </div>
      )}
      {editable ? (
        <form onSubmit={onSubmit} noValidate className="mt-4 flex flex-wrap items-end gap-3">
          <TextField
            label="Model name"
            value={name}
            onChange={(event) => setName(event.target.value)}
            error={problem}
            maxLength={81}
            className="w-full max-w-sm"
          />
          <Button type="submit" pending={rename.isPending} disabled={name.trim() === model.name && !drifted}>
            Rename
          </Button>
        </form>
      ) : (
        <p className="mt-4 text-base text-ink-900">
          {model.name}
          <span className="ml-2 text-sm text-ink-700">Owners and editors rename models.</span>
        </p>
      )}
    </Card>
  );
}

function ArchiveCard({ model, editable }: { model: SetupModelView; editable: boolean }) {
  const toast = useToast();
  const archive = useSetArchived(model);
  const [confirming, setConfirming] = useState(false);
  const archived = model.archived_at !== null;

  const run = (next: boolean) =>
    archive.mutate(next, {
      onSuccess: () => {
        setConfirming(false);
        toast({
          title: next ? `${model.name} is archived` : `${model.name} is back in the hangar`,
          description: next ? 'The hangar lists it only when you ask it to show archived models.' : undefined,
        });
      },
    });

  return (
    <Card className="p-5">
      <h2 className="flex items-center gap-2 text-lg font-semibold text-ink-900">
        Hangar {archived && <Badge>Archived</Badge>}
      </h2>
      <p className="mt-1 text-sm text-ink-700">
        {archived
          ? 'This model is archived: the hangar leaves it out unless asked to show archived models. Its history, reviews, field sheet and exports are all still here.'
          : 'Archive a model you no longer fly (sold, retired, crashed) to take it out of the hangar list. Nothing is deleted: its history, reviews and exports stay, and it can be brought back at any time.'}
      </p>
      {archive.isError && (
        <div className="mt-3">
          <FormAlert>{archive.error.message}</FormAlert>
        </div>
      )}
      {editable ? (
        <div className="mt-4">
          {archived ? (
            <Button variant="secondary" onClick={() => run(false)} pending={archive.isPending}>
              Bring back to the hangar
            </Button>
          ) : (
            <Button variant="secondary" onClick={() => setConfirming(true)}>
              Archive this model…
            </Button>
          )}
        </div>
      ) : (
        <p className="mt-4 text-sm text-ink-700">Owners and editors archive models.</p>
      )}
      {confirming && (
        <Dialog
          title={`Archive ${model.name}?`}
          description="It leaves the hangar list; nothing is deleted, and it can be brought back from here."
          onClose={() => setConfirming(false)}
        >
          <div className="flex flex-wrap justify-end gap-2">
            <Button variant="secondary" onClick={() => setConfirming(false)} data-autofocus>
              Keep it in the hangar
            </Button>
            <Button onClick={() => run(true)} pending={archive.isPending}>
              Archive
            </Button>
          </div>
        </Dialog>
      )}
    </Card>
  );
}
