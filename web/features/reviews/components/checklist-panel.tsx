import { Card } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { TimeAgo } from '../../models/components/time-ago';
import { useTickItem } from '../api/reviews';
import type { BaseParam, ReviewDetail } from '../types';

/** The pre-maiden checklist: each item ticked by a reviewer once confirmed on the model itself. */
export function ChecklistPanel({ review, base }: { review: ReviewDetail; base: BaseParam }) {
  const tick = useTickItem(review, base);
  const toast = useToast();
  const done = review.checklist.filter((item) => item.ticked).length;
  const carried = review.checklist.filter((item) => item.ticked && item.carried).length;

  return (
    <Card className="p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-lg font-semibold text-ink-900">Pre-maiden checklist</h2>
        <span className="text-sm text-ink-700" aria-live="polite">
          {done} of {review.checklist.length} ticked
        </span>
      </div>
      <p className="mt-0.5 text-sm text-ink-700">
        Checks made on the model itself, not in the document: tick each one when it has been done. Work through it
        before giving your verdict.
      </p>
      {carried > 0 && (
        <p className="mt-2 rounded-md border border-info-700/40 bg-info-100 px-3 py-2 text-sm text-info-700">
          {carried} {carried === 1 ? 'tick was' : 'ticks were'} carried from an earlier review, because nothing the item
          covers has changed since; each says why. Untick one to check it again.
        </p>
      )}
      <ul className="mt-3 space-y-3">
        {review.checklist.map((item) => {
          const id = `check-${item.id}`;
          return (
            <li key={item.id} className="flex gap-3">
              <input
                id={id}
                type="checkbox"
                checked={item.ticked}
                disabled={!review.can.tick}
                onChange={(event) =>
                  tick.mutate(
                    { item: item.id, ticked: event.target.checked },
                    {
                      onError: (error) =>
                        toast({ title: `Could not change “${item.label}”`, description: error.message, tone: 'error' }),
                    },
                  )
                }
                aria-describedby={`${id}-detail`}
                className="mt-1 h-5 w-5 shrink-0 accent-accent-700"
              />
              <div className="min-w-0">
                <label htmlFor={id} className="font-medium text-ink-900">
                  {item.label}
                </label>
                <p id={`${id}-detail`} className="text-sm text-ink-700">
                  {item.detail}
                </p>
                {item.ticked && item.carried && <p className="mt-0.5 text-sm text-info-700">{item.carried.reason}</p>}
                <p className="mt-0.5 text-xs text-ink-700">
                  {item.source ? `Source: ${item.source.title}.` : item.basis}
                  {item.ticked && item.ticked_by && (
                    <>
                      {' '}
                      Ticked by {item.ticked_by.name}
                      {item.ticked_at && (
                        <>
                          {' '}
                          <TimeAgo iso={item.ticked_at} />
                        </>
                      )}
                      .
                    </>
                  )}
                </p>
              </div>
            </li>
          );
        })}
      </ul>
    </Card>
  );
}
