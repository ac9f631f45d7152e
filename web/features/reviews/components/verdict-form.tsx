import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { cx } from '../../../lib/cx';
import type { Id } from '../../../types/api';
import { useSession } from '../../auth/hooks/use-session';
import { TimeAgo } from '../../models/components/time-ago';
import { useGiveVerdict } from '../api/reviews';
import type { ReviewDetail, Verdict, VerdictEntry } from '../types';

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

export function VerdictForm({ review }: { review: ReviewDetail }) {
  const { user } = useSession();
  const standing = standingVerdict(review.verdicts, user.id);
  // What the caller already said is not offered again as if nothing had happened.
  const choices = CHOICES.filter((choice) => choice.value !== standing?.verdict);
  // Until the caller picks, approving is suggested to a reviewer who has not said anything yet.
  const [picked, setPicked] = useState<Verdict | null>(null);
  const offered = (value: Verdict) =>
    choices.some((choice) => choice.value === value) && (value !== 'approve' || review.can.approve);
  const suggested: Verdict = !standing && review.can.approve ? 'approve' : 'comment';
  const verdict: Verdict = picked !== null && offered(picked) ? picked : suggested;
  const [body, setBody] = useState('');
  const give = useGiveVerdict(review);
  const toast = useToast();
  const unticked = review.checklist.filter((item) => !item.ticked).length;

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    give.mutate(
      { verdict, body: body.trim() || undefined },
      {
        onSuccess: () => {
          setBody('');
          setPicked(null);
          toast({
            title:
              verdict === 'approve'
                ? 'Approved: the requester has been told'
                : verdict === 'request-changes'
                  ? 'Changes asked for: the requester has been told'
                  : 'Comment recorded',
          });
        },
      },
    );
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
      <form onSubmit={onSubmit} className="mt-3 space-y-4" aria-label="Give a verdict">
        {give.isError && <FormAlert>{give.error.message}</FormAlert>}
        <fieldset>
          <legend className="sr-only">Verdict</legend>
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
                    onChange={() => setPicked(choice.value)}
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
        </fieldset>
        {verdict === 'approve' && unticked > 0 && (
          <p className="text-sm text-caution-700">
            {unticked} checklist {unticked === 1 ? 'item is' : 'items are'} not ticked yet; the approval records what
            was ticked.
          </p>
        )}
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
          {CHOICES.find((choice) => choice.value === verdict)?.label}
        </Button>
      </form>
    </Card>
  );
}
