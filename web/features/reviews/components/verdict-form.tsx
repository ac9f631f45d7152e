import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { Dialog } from '../../../components/ui/dialog';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { cx } from '../../../lib/cx';
import type { Id } from '../../../types/api';
import { useSession } from '../../auth/hooks/use-session';
import { TimeAgo } from '../../models/components/time-ago';
import { useGiveVerdict } from '../api/reviews';
import type { LeftOpen, ReviewDetail, Verdict, VerdictEntry } from '../types';

const CHOICES: { value: Verdict; label: string; hint: string }[] = [
  { value: 'approve', label: 'Approve', hint: 'Signs off this content for the maiden.' },
  {
    value: 'request-changes',
    label: 'Ask for changes',
    hint: 'Holds the maiden until the setup changes or you approve.',
  },
  { value: 'comment', label: 'Comment', hint: 'A remark that changes nothing.' },
];

/** The caller's last approval or request for changes on this revision: a comment leaves it standing. */
function standingVerdict(verdicts: readonly VerdictEntry[], userId: Id): VerdictEntry | null {
  return verdicts.filter((entry) => entry.reviewer?.id === userId && entry.verdict !== 'comment').at(-1) ?? null;
}

const STANDING_WORDS: Record<Exclude<Verdict, 'comment'>, { said: string; otherwise: string }> = {
  approve: {
    said: 'You approved this revision',
    otherwise: 'If you find a problem after all, ask for changes; a comment leaves your approval standing.',
  },
  'request-changes': {
    said: 'You asked for changes to this revision',
    otherwise: 'If it is fine as it is after all, approve it; a comment leaves your request standing.',
  },
};

/** What approving now would leave undone, from the page's checklist and findings. */
function leftOpenOf(review: ReviewDetail): LeftOpen {
  return {
    unticked: review.checklist.filter((item) => !item.ticked).map(({ id, label }) => ({ id, label })),
    warnings: review.findings
      .filter((finding) => finding.severity === 'warning' && finding.accepted === undefined)
      .map(({ rule, path, message }) => ({ rule, path, message })),
  };
}

const isEmpty = (left: LeftOpen) => left.unticked.length === 0 && left.warnings.length === 0;

/**
 * The reviewer's verdict, after the checklist: nothing is chosen for them, and an
 * approval with items unticked or warnings open is confirmed in a dialog that lists
 * them; the approval records what was left.
 */
export function VerdictForm({ review }: { review: ReviewDetail }) {
  const { user } = useSession();
  const standing = standingVerdict(review.verdicts, user.id);
  // What the caller already said is not offered again as if nothing had happened.
  const choices = CHOICES.filter((choice) => choice.value !== standing?.verdict);
  const [picked, setPicked] = useState<Verdict | null>(null);
  const offered = (value: Verdict) =>
    choices.some((choice) => choice.value === value) && (value !== 'approve' || review.can.approve);
  const verdict: Verdict | null = picked !== null && offered(picked) ? picked : null;
  const [body, setBody] = useState('');
  const [confirming, setConfirming] = useState<LeftOpen | null>(null);
  const [unpicked, setUnpicked] = useState(false);
  const give = useGiveVerdict(review);
  const toast = useToast();

  const send = (chosen: Verdict, confirmLeftOpen: boolean) =>
    give.mutate(
      { verdict: chosen, body: body.trim() || undefined, ...(confirmLeftOpen ? { confirm_left_open: true } : {}) },
      {
        onSuccess: () => {
          setBody('');
          setPicked(null);
          setConfirming(null);
          toast({
            title:
              chosen === 'approve'
                ? 'Approved: the requester has been told'
                : chosen === 'request-changes'
                  ? 'Changes asked for: the requester has been told'
                  : 'Comment recorded',
          });
        },
        onError: () => setConfirming(null),
      },
    );

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (verdict === null) {
      setUnpicked(true);
      return;
    }
    if (verdict === 'approve') {
      const left = leftOpenOf(review);
      if (!isEmpty(left)) {
        setConfirming(left);
        return;
      }
    }
    send(verdict, false);
  };

  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Your verdict</h2>
      {standing && standing.verdict !== 'comment' && (
        <div className="mt-2">
          <p className="text-base font-medium text-ink-900">
            {STANDING_WORDS[standing.verdict].said} <TimeAgo iso={standing.created_at} inSentence />.
          </p>
          <p className="mt-0.5 text-sm text-ink-700">{STANDING_WORDS[standing.verdict].otherwise}</p>
        </div>
      )}
      <form onSubmit={onSubmit} className="mt-3 space-y-4" aria-label="Give a verdict" noValidate>
        {give.isError && <FormAlert>{give.error.message}</FormAlert>}
        <fieldset aria-describedby={unpicked && verdict === null ? 'verdict-unpicked' : undefined}>
          <legend className="mb-2 text-sm font-medium text-ink-900">Choose your verdict</legend>
          <div className="space-y-2">
            {choices.map((choice) => {
              const disabled = choice.value === 'approve' && !review.can.approve;
              return (
                <label
                  key={choice.value}
                  className={cx(
                    'flex gap-3 rounded-md border px-3 py-2',
                    verdict === choice.value ? 'border-accent-700 bg-accent-50' : 'border-ply-300',
                    disabled ? 'cursor-not-allowed opacity-60' : 'cursor-pointer',
                  )}
                >
                  <input
                    type="radio"
                    name="verdict"
                    value={choice.value}
                    checked={verdict === choice.value}
                    disabled={disabled}
                    onChange={() => {
                      setPicked(choice.value);
                      setUnpicked(false);
                    }}
                    className="mt-1 accent-accent-700"
                  />
                  <span>
                    <span className="block font-medium text-ink-900">{choice.label}</span>
                    <span className="block text-sm text-ink-700">
                      {disabled && review.can.approve_refusal ? review.can.approve_refusal.message : choice.hint}
                    </span>
                  </span>
                </label>
              );
            })}
          </div>
          {unpicked && verdict === null && (
            <p id="verdict-unpicked" className="mt-2 text-sm text-danger-700">
              Choose a verdict first.
            </p>
          )}
        </fieldset>
        <TextAreaField
          label="What you found"
          name="body"
          rows={4}
          maxLength={4000}
          value={body}
          onChange={(event) => setBody(event.target.value)}
          placeholder="What you checked, and anything the pilot should know."
        />
        <Button type="submit" pending={give.isPending} variant={verdict === 'request-changes' ? 'danger' : 'primary'}>
          {verdict === null ? 'Give verdict' : CHOICES.find((choice) => choice.value === verdict)?.label}
        </Button>
      </form>
      {confirming && (
        <ConfirmApproval
          left={confirming}
          pending={give.isPending}
          onConfirm={() => send('approve', true)}
          onClose={() => setConfirming(null)}
        />
      )}
    </Card>
  );
}

function ConfirmApproval({
  left,
  pending,
  onConfirm,
  onClose,
}: {
  left: LeftOpen;
  pending: boolean;
  onConfirm: () => void;
  onClose: () => void;
}) {
  return (
    <Dialog
      title="Approve with these left open?"
      description="The approval records what was left, and the review shows it to everyone."
      onClose={onClose}
    >
      <div className="space-y-3 text-base text-ink-900">
        {left.unticked.length > 0 && (
          <section>
            <h3 className="font-medium">
              {left.unticked.length} checklist {left.unticked.length === 1 ? 'item is' : 'items are'} not ticked
            </h3>
            <ul className="mt-1 list-disc pl-5 text-sm">
              {left.unticked.map((item) => (
                <li key={item.id}>{item.label}</li>
              ))}
            </ul>
          </section>
        )}
        {left.warnings.length > 0 && (
          <section>
            <h3 className="font-medium">
              {left.warnings.length} {left.warnings.length === 1 ? 'warning is' : 'warnings are'} open
            </h3>
            <ul className="mt-1 list-disc pl-5 text-sm">
              {left.warnings.map((warning) => (
                <li key={`${warning.rule}:${warning.path}`}>{warning.message}</li>
              ))}
            </ul>
          </section>
        )}
        <div className="flex flex-wrap justify-end gap-2 pt-2">
          <Button variant="secondary" onClick={onClose} data-autofocus>
            Go back
          </Button>
          <Button onClick={onConfirm} pending={pending}>
            Approve with these left
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
