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
}

const MAX_MESSAGE = 2000;

export function SaveDialog({ base, counts, pending, error, onSave, onClose }: SaveDialogProps) {
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
