import { useState } from 'react';
import type { FindingCounts } from '@shared/findings';
import { SeverityBadge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextField } from '../../../components/ui/text-field';

export interface SaveDialogProps {
  base: number;
  counts: FindingCounts;
  pending: boolean;
  /** A refusal other than a stale base, said in the dialog. */
  error: string | null;
  onSave: (message: string) => void;
  onClose: () => void;
  /** What the save does to the sign-off of the revision it starts from. */
  signOff: SaveSignOff | null;
}

/**
 * The sign-off the save touches: the approval the base revision holds (and who gave
 * it), or an open review of it; and whether the edit changes settings at all, since
 * comments and layout alone leave an approval standing.
 */
export interface SaveSignOff {
  kind: 'approved' | 'pending';
  number: number;
  approvers: string[];
  changesSettings: boolean;
}

const names = (people: string[]) =>
  people.length <= 1 ? (people[0] ?? 'the reviewer') : `${people.slice(0, -1).join(', ')} and ${people.at(-1)}`;

function signOffWords(signOff: SaveSignOff, next: number): string {
  if (!signOff.changesSettings)
    return signOff.kind === 'approved'
      ? `Only comments or layout change, so the approval of revision ${signOff.number} still holds for revision ${next}.`
      : `Only comments or layout change, so the open review of revision ${signOff.number} still applies.`;
  return signOff.kind === 'approved'
    ? `Revision ${signOff.number} is approved by ${names(signOff.approvers)}. This save changes settings, so that approval goes stale: ${names(signOff.approvers)} or another reviewer must look at revision ${next} before the model is cleared to fly again.`
    : `Revision ${signOff.number} is waiting for review. This save changes settings, so its reviewers must look at revision ${next} instead: ask for a review of it once saved.`;
}

const MAX_MESSAGE = 2000;

export function SaveDialog({ base, counts, pending, error, onSave, onClose, signOff }: SaveDialogProps) {
  const [message, setMessage] = useState('');
  const [problem, setProblem] = useState<string | undefined>();

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    const text = message.trim();
    if (text === '') setProblem('Say in a few words what this revision changes, for whoever reads the history.');
    else if (text.length > MAX_MESSAGE) setProblem(`Keep the message to ${MAX_MESSAGE} characters.`);
    else {
      setProblem(undefined);
      onSave(text);
    }
  };

  return (
    <Dialog
      title={`Save as revision ${base + 1}`}
      description={`Your edit started from revision ${base}. Saving adds a new revision after it; nothing earlier changes.`}
      onClose={pending ? () => undefined : onClose}
    >
      <form onSubmit={submit} noValidate className="space-y-4">
        {signOff && (
          <p
            className={
              signOff.changesSettings
                ? 'rounded-md border border-caution-700/40 bg-caution-100 px-3 py-2 text-sm text-ink-900'
                : 'rounded-md border border-moss-700/40 bg-moss-100 px-3 py-2 text-sm text-ink-900'
            }
          >
            {signOffWords(signOff, base + 1)}
          </p>
        )}
        {counts.errors + counts.warnings > 0 && (
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-700">
            The checks found
            {counts.errors > 0 && <SeverityBadge severity="error" count={counts.errors} />}
            {counts.warnings > 0 && <SeverityBadge severity="warning" count={counts.warnings} />}
            {counts.errors > 0
              ? 'A revision with errors is kept, but it cannot be approved for flight.'
              : 'They are saved with the revision.'}
          </p>
        )}
        <TextField
          label="What changed"
          hint="One line, like “Wing receiver on channels 9-16”."
          value={message}
          onChange={(event) => setMessage(event.target.value)}
          error={problem}
          maxLength={MAX_MESSAGE + 1}
          data-autofocus
        />
        {error && <FormAlert>{error}</FormAlert>}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={onClose} disabled={pending}>
            Cancel
          </Button>
          <Button type="submit" pending={pending}>
            Save revision
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
