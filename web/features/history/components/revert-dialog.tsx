import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import type { RevisionSummary, SetupModelView } from '../../models/types';
import { useRevert } from '../api/revision-actions';

/** Asks for a message, then makes a new revision equal to `revision` on top of the latest. */
export function RevertDialog({
  model,
  revision,
  onClose,
}: {
  model: SetupModelView;
  revision: RevisionSummary;
  onClose: () => void;
}) {
  const revert = useRevert(model);
  const toast = useToast();
  const [message, setMessage] = useState(`Revert to revision ${revision.number}`);
  const [error, setError] = useState<string | null>(null);
  const latest = model.latest?.number ?? revision.number;

  function submit(event: FormEvent) {
    event.preventDefault();
    setError(null);
    revert.mutate(
      { modelId: model.id, number: revision.number, base: latest, message: message.trim() || undefined },
      {
        onSuccess: (created) => {
          toast({
            title: `Revision ${created.number} saved`,
            description: `It has the content of revision ${revision.number}.`,
          });
          onClose();
        },
        onError: (failure) => {
          if (isApiError(failure) && failure.code === 'stale-base') {
            const now = (failure.details as { latest?: number } | null)?.latest;
            setError(
              `Someone saved revision ${now ?? 'a newer one'} meanwhile. The history is up to date now; look at it and revert again if you still want to.`,
            );
          } else setError(failure instanceof Error ? failure.message : 'The revert failed.');
        },
      },
    );
  }

  return (
    <Dialog
      title={`Revert to revision ${revision.number}`}
      description={`A new revision ${latest + 1} gets the content of revision ${revision.number}. Nothing is removed: ${
        latest === revision.number + 1
          ? `revision ${latest} stays`
          : `revisions ${revision.number + 1} to ${latest} stay`
      } in the history.`}
      onClose={onClose}
    >
      <form noValidate onSubmit={submit} className="space-y-4">
        {error && <FormAlert>{error}</FormAlert>}
        <TextAreaField
          label="Message"
          value={message}
          onChange={(event) => setMessage(event.target.value)}
          maxLength={2000}
          data-autofocus
        />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" pending={revert.isPending}>
            Revert
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
