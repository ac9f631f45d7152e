import { useState } from 'react';
import type { Finding } from '@shared/findings';
import { SeverityBadge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { TextAreaField } from '../../../components/ui/text-area-field';

const MAX_REASON = 500;

export interface AcceptFindingDialogProps {
  finding: Finding;
  onAccept: (reason: string) => void;
  onClose: () => void;
}

/**
 * Asks why a warning or a note is right for this model. The reason goes into the
 * setup's `accepted` list, so whoever reviews the revision reads it beside the finding.
 */
export function AcceptFindingDialog({ finding, onAccept, onClose }: AcceptFindingDialogProps) {
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | undefined>();

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    const text = reason.trim().replace(/\s+/g, ' ');
    if (text === '') setProblem('Say why this is right for this model, for the reviewer who reads it.');
    else if (text.length > MAX_REASON) setProblem(`Keep the reason to ${MAX_REASON} characters.`);
    else onAccept(text);
  };

  return (
    <Dialog
      title={finding.severity === 'warning' ? 'Accept this warning' : 'Accept this note'}
      description="An accepted finding stays in the list with your reason, apart from the open ones. The reason is part of the setup, so it is saved with the next revision and shown to reviewers."
      onClose={onClose}
    >
      <form onSubmit={submit} noValidate className="space-y-4">
        <div className="rounded-md border border-ply-200 bg-paper p-3">
          <SeverityBadge severity={finding.severity} />
          <p className="mt-1 text-base text-ink-900">{finding.message}</p>
        </div>
        <TextAreaField
          label="Why is this right for this model?"
          hint="For example: “The smoke pump is off at 1000 µs: that is the safe state on signal loss.”"
          value={reason}
          onChange={(event) => setReason(event.target.value)}
          error={problem}
          maxLength={MAX_REASON + 1}
          data-autofocus
        />
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit">Accept with this reason</Button>
        </div>
      </form>
    </Dialog>
  );
}
