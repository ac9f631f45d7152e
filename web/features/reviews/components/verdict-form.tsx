import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { cx } from '../../../lib/cx';
import { useGiveVerdict } from '../api/reviews';
import type { ReviewDetail, Verdict } from '../types';

const CHOICES: { value: Verdict; label: string; hint: string }[] = [
  { value: 'approve', label: 'Approve', hint: 'Signs off this content for the maiden.' },
  { value: 'request-changes', label: 'Ask for changes', hint: 'Holds the maiden until the setup changes or you approve.' },
  { value: 'comment', label: 'Comment', hint: 'A remark that changes nothing.' },
];

export function VerdictForm({ review }: { review: ReviewDetail }) {
  const [verdict, setVerdict] = useState<Verdict>(review.can.approve ? 'approve' : 'comment');
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
          toast({ title: verdict === 'approve' ? 'Approved: the requester has been told' : verdict === 'request-changes' ? 'Changes asked for: the requester has been told' : 'Comment recorded' });
        },
      },
    );
  };

  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Your verdict</h2>
      <form onSubmit={onSubmit} className="mt-3 space-y-4" aria-label="Give a verdict">
        {give.isError && <FormAlert>{give.error.message}</FormAlert>}
        <fieldset>
          <legend className="sr-only">Verdict</legend>
          <div className="space-y-2">
            {CHOICES.map((choice) => {
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
                    onChange={() => setVerdict(choice.value)}
                    className="mt-1 accent-accent-700"
                  />
                  <span>
                    <span className="block font-medium text-ink-900">{choice.label}</span>
                    <span className="block text-sm text-ink-700">{disabled && review.can.approve_refusal ? review.can.approve_refusal.message : choice.hint}</span>
                  </span>
                </label>
              );
            })}
          </div>
        </fieldset>
        {verdict === 'approve' && unticked > 0 && (
          <p className="text-sm text-caution-700">
            {unticked} checklist {unticked === 1 ? 'item is' : 'items are'} not ticked yet; the approval records what was ticked.
          </p>
        )}
        <TextAreaField label="What you found" name="body" rows={4} maxLength={4000} value={body} onChange={(event) => setBody(event.target.value)} placeholder="What you checked, and anything the pilot should know." />
        <Button type="submit" pending={give.isPending} variant={verdict === 'request-changes' ? 'danger' : 'primary'}>
          {CHOICES.find((choice) => choice.value === verdict)?.label}
        </Button>
      </form>
    </Card>
  );
}
