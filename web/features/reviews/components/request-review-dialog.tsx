import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { FormAlert } from '../../../components/ui/form-alert';
import { LoadingState } from '../../../components/ui/loading-state';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { formErrorsFrom } from '../../../lib/form-errors';
import { useSession } from '../../auth/hooks/use-session';
import type { SetupModelView } from '../../models/types';
import { useMembers } from '../../team/api/get-members';
import { RoleBadge } from '../../team/components/role-badge';
import { useRequestReview } from '../api/reviews';

const MAY_REVIEW = new Set(['reviewer', 'editor', 'owner']);

/** Asks chosen members to review the model's latest revision. */
export function RequestReviewDialog({ model, onClose }: { model: SetupModelView; onClose: () => void }) {
  const latest = model.latest!;
  const members = useMembers(model.workspace_id);
  const [chosen, setChosen] = useState<string[]>([]);
  const [note, setNote] = useState('');
  const request = useRequestReview();
  const navigate = useNavigate();
  const toast = useToast();
  const errors = request.isError ? formErrorsFrom(request.error, ['reviewers', 'note']) : null;

  const { user } = useSession();
  // Neither the author (who may not approve it) nor the one asking.
  const candidates = (members.data ?? []).filter(
    (member) => MAY_REVIEW.has(member.role) && member.user.id !== latest.author?.id && member.user.id !== user.id,
  );

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    request.mutate(
      { revisionId: latest.id, reviewers: chosen, ...(note.trim() ? { note: note.trim() } : {}) },
      {
        onSuccess: (review) => {
          toast({
            title: `Review requested: ${review.reviewers.map((reviewer) => reviewer.name).join(', ')} will get an e-mail`,
          });
          onClose();
          void navigate(`/w/${review.workspace_id}/reviews/${review.id}`);
        },
      },
    );
  };

  return (
    <Dialog
      title={`Request a review of revision ${latest.number}`}
      description="Choose who should look it over before the maiden. Each gets an e-mail with a link to the review."
      onClose={onClose}
    >
      {members.isPending ? (
        <LoadingState label="Loading the members…" />
      ) : members.isError ? (
        <FormAlert>{members.error.message}</FormAlert>
      ) : (
        <form onSubmit={onSubmit} className="space-y-4" aria-label="Request a review">
          {errors?.general && <FormAlert>{errors.general}</FormAlert>}
          <fieldset>
            <legend className="text-sm font-medium text-ink-900">Reviewers</legend>
            {candidates.length === 0 ? (
              <p className="mt-1 text-sm text-ink-700">
                Nobody else here may review this revision: a reviewer needs the reviewer role or higher and cannot be
                its author. Invite one on the Team screen.
              </p>
            ) : (
              <ul className="mt-2 space-y-1.5">
                {candidates.map((member) => (
                  <li key={member.user.id}>
                    <label className="flex cursor-pointer items-center gap-3 rounded-md border border-ply-300 px-3 py-2 hover:bg-ply-100">
                      <input
                        type="checkbox"
                        className="h-4 w-4 accent-accent-700"
                        checked={chosen.includes(member.user.id)}
                        onChange={(event) =>
                          setChosen((current) =>
                            event.target.checked
                              ? [...current, member.user.id]
                              : current.filter((id) => id !== member.user.id),
                          )
                        }
                      />
                      <span className="flex-1 text-ink-900">{member.user.name}</span>
                      <RoleBadge role={member.role} />
                    </label>
                  </li>
                ))}
              </ul>
            )}
            {errors?.fields.reviewers && <p className="mt-1.5 text-sm text-danger-700">{errors.fields.reviewers}</p>}
          </fieldset>
          <TextAreaField
            label="Note (optional)"
            name="note"
            maxLength={2000}
            value={note}
            onChange={(event) => setNote(event.target.value)}
            placeholder="When it should fly, what changed, what to look at."
            error={errors?.fields.note}
          />
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" pending={request.isPending} disabled={chosen.length === 0}>
              Request review
            </Button>
          </div>
        </form>
      )}
    </Dialog>
  );
}
