import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ErrorState } from '../../../components/ui/error-state';
import { FormAlert } from '../../../components/ui/form-alert';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { cx } from '../../../lib/cx';
import { formErrorsFrom } from '../../../lib/form-errors';
import { itemsOf, totalOf } from '../../../lib/paged';
import type { Id } from '../../../types/api';
import { TimeAgo } from '../../models/components/time-ago';
import { usePagedThreads, useStartThread, useStepThread } from '../api/reviews';
import { settingWords } from '../setting-words';
import type { CommentThread } from '../types';
import type { ChosenSetting } from './review-plan';

export interface ThreadsWhere {
  reviewId?: Id;
  revisionId: Id;
  workspaceId: Id;
}

/**
 * Comment threads on a revision: each on a setting chosen on the page (or on the whole
 * revision), with replies, resolve and reopen. Threads started on earlier revisions are
 * shown while their setting still exists. Open and resolved threads are each read a page
 * at a time from the revision's comments, so a long-discussed setup stays quick to open.
 */
export function ThreadsPanel({
  where,
  canComment,
  chosen,
  onChosenChange,
  headingLevel = 2,
}: {
  where: ThreadsWhere;
  canComment: boolean;
  chosen: ChosenSetting | null;
  onChosenChange: (setting: ChosenSetting | null) => void;
  headingLevel?: 2 | 3;
}) {
  const [showResolved, setShowResolved] = useState(false);
  const openPages = usePagedThreads(where.revisionId, 'open');
  const resolvedPages = usePagedThreads(where.revisionId, 'resolved');
  const open = itemsOf(openPages.data?.pages);
  const resolved = itemsOf(resolvedPages.data?.pages);
  const openTotal = totalOf(openPages.data?.pages);
  const resolvedTotal = totalOf(resolvedPages.data?.pages);
  const Heading = headingLevel === 2 ? 'h2' : 'h3';

  return (
    <Card className="p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <Heading id="threads-heading" className="text-lg font-semibold text-ink-900">
          Comments
        </Heading>
        {openPages.isSuccess && resolvedPages.isSuccess && (
          <span className="text-sm text-ink-700">
            {openTotal} open, {resolvedTotal} resolved
          </span>
        )}
      </div>
      <p className="mt-0.5 text-sm text-ink-700">
        {canComment
          ? 'Choose a setting’s name (a channel, a mix, a pin) to comment on it. A comment stays on later revisions while its setting exists.'
          : 'A comment stays on later revisions while its setting exists.'}
      </p>
      {canComment && <NewThreadForm where={where} chosen={chosen} onChosenChange={onChosenChange} />}
      {openPages.isPending ? (
        <p className="mt-4 text-base text-ink-700">Loading the comments…</p>
      ) : openPages.isError && open.length === 0 ? (
        <div className="mt-4">
          <ErrorState
            title="The comments could not be loaded"
            error={openPages.error}
            onRetry={() => void openPages.refetch()}
          />
        </div>
      ) : open.length === 0 ? (
        <p className="mt-4 text-base text-ink-700">No open comments.</p>
      ) : (
        <PagedThreads
          label="Open comments"
          noun="open comments"
          threads={open}
          pages={openPages}
          where={where}
          canComment={canComment}
          className="mt-4"
        />
      )}
      {resolvedTotal > 0 && (
        <div className="mt-4">
          <Button variant="quiet" size="sm" aria-expanded={showResolved} onClick={() => setShowResolved((now) => !now)}>
            {showResolved ? 'Hide' : 'Show'} {resolvedTotal} resolved
          </Button>
          {showResolved && (
            <PagedThreads
              label="Resolved comments"
              noun="resolved comments"
              threads={resolved}
              pages={resolvedPages}
              where={where}
              canComment={canComment}
              className="mt-2"
            />
          )}
        </div>
      )}
    </Card>
  );
}

/** One list of threads with how many of how many are shown and the way to the next page. */
function PagedThreads({
  label,
  noun,
  threads,
  pages,
  where,
  canComment,
  className,
}: {
  label: string;
  noun: string;
  threads: readonly CommentThread[];
  pages: ReturnType<typeof usePagedThreads>;
  where: ThreadsWhere;
  canComment: boolean;
  className: string;
}) {
  return (
    <>
      <ul className={cx('space-y-3', className)} aria-label={label}>
        {threads.map((thread) => (
          <Thread key={thread.id} thread={thread} where={where} canComment={canComment} />
        ))}
      </ul>
      <ShowMore shown={threads.length} total={totalOf(pages.data?.pages)} noun={noun} {...nextPageOf(pages)} />
    </>
  );
}

function NewThreadForm({
  where,
  chosen,
  onChosenChange,
}: {
  where: ThreadsWhere;
  chosen: ChosenSetting | null;
  onChosenChange: (setting: ChosenSetting | null) => void;
}) {
  const [body, setBody] = useState('');
  const start = useStartThread(where);
  const errors = start.isError ? formErrorsFrom(start.error, ['path', 'body']) : null;
  const area = useRef<HTMLTextAreaElement>(null);

  // Choosing a setting on the page brings the reviewer here, ready to type.
  useEffect(() => {
    if (!chosen) return;
    area.current?.focus();
    area.current?.scrollIntoView?.({ block: 'center' });
  }, [chosen]);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    start.mutate(
      { body: body.trim(), ...(chosen ? { path: chosen.path } : {}) },
      {
        onSuccess: () => {
          setBody('');
          onChosenChange(null);
        },
      },
    );
  };

  return (
    <form
      onSubmit={onSubmit}
      className="mt-4 space-y-3 rounded-md border border-ply-200 bg-paper px-3 py-3"
      aria-label="Start a comment"
    >
      {errors?.general && <FormAlert>{errors.general}</FormAlert>}
      {errors?.fields.path && <FormAlert>{errors.fields.path}</FormAlert>}
      <p className="flex flex-wrap items-center gap-2 text-sm text-ink-900">
        <span className="font-medium">On:</span>
        <span>{chosen ? chosen.words : 'the whole revision'}</span>
        {chosen && (
          <Button variant="quiet" size="sm" onClick={() => onChosenChange(null)}>
            Comment on the whole revision instead
          </Button>
        )}
      </p>
      <TextAreaField
        ref={area}
        label={chosen ? `Comment on ${chosen.words}` : 'Comment on the whole revision'}
        name="comment"
        rows={3}
        maxLength={4000}
        value={body}
        onChange={(event) => setBody(event.target.value)}
        error={errors?.fields.body}
      />
      <Button type="submit" variant="secondary" pending={start.isPending} disabled={body.trim() === ''}>
        Add comment
      </Button>
    </form>
  );
}

function Thread({ thread, where, canComment }: { thread: CommentThread; where: ThreadsWhere; canComment: boolean }) {
  const [reply, setReply] = useState('');
  const step = useStepThread({ reviewId: where.reviewId ?? thread.review_id, workspaceId: where.workspaceId });
  const replyId = useId();
  const words = settingWords(thread.path);

  return (
    <li className="rounded-md border border-ply-200 bg-paper px-3 py-2" aria-label={`Comment on ${words}`}>
      <div className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
        <Badge tone={thread.path ? 'accent' : 'neutral'}>{words}</Badge>
        {thread.carried && <Badge tone="info">From revision {thread.revision.number}</Badge>}
        {thread.resolved && (
          <Badge tone="moss">
            Resolved by {thread.resolved.by?.name ?? 'a former member'} <TimeAgo iso={thread.resolved.at} />
          </Badge>
        )}
      </div>
      <Entry author={thread.author?.name} at={thread.created_at} body={thread.body} />
      {thread.replies.length > 0 && (
        <ol className="mt-2 space-y-2 border-l-2 border-ply-200 pl-3" aria-label="Replies">
          {thread.replies.map((entry) => (
            <li key={entry.id}>
              <Entry author={entry.author?.name} at={entry.created_at} body={entry.body} />
            </li>
          ))}
        </ol>
      )}
      {step.isError && (
        <div className="mt-2">
          <FormAlert>{step.error.message}</FormAlert>
        </div>
      )}
      {canComment && (
        <div className="mt-2 space-y-2">
          {!thread.resolved && (
            <form
              className="flex flex-wrap items-end gap-2"
              aria-label={`Reply on ${words}`}
              onSubmit={(event) => {
                event.preventDefault();
                step.mutate(
                  { threadId: thread.id, step: { kind: 'reply', body: reply.trim() } },
                  { onSuccess: () => setReply('') },
                );
              }}
            >
              <label htmlFor={replyId} className="sr-only">
                Reply on {words}
              </label>
              <input
                id={replyId}
                value={reply}
                maxLength={4000}
                onChange={(event) => setReply(event.target.value)}
                placeholder="Reply"
                className="h-8 min-w-40 flex-1 rounded-md border border-ply-500 bg-paper-raised px-2 text-sm text-ink-900"
              />
              <Button
                type="submit"
                size="sm"
                variant="secondary"
                disabled={reply.trim() === ''}
                pending={step.isPending}
              >
                Reply
              </Button>
            </form>
          )}
          <Button
            size="sm"
            variant="quiet"
            pending={step.isPending}
            onClick={() => step.mutate({ threadId: thread.id, step: { kind: thread.resolved ? 'reopen' : 'resolve' } })}
          >
            {thread.resolved ? 'Reopen' : 'Resolve'}
          </Button>
        </div>
      )}
    </li>
  );
}

function Entry({ author, at, body }: { author: string | undefined; at: string; body: string }) {
  return (
    <div className="mt-1">
      <p className="text-sm">
        <span className="font-medium text-ink-900">{author ?? 'Former member'}</span>{' '}
        <TimeAgo iso={at} className="text-ink-500" />
      </p>
      <p className="text-base whitespace-pre-wrap text-ink-900">{body}</p>
    </div>
  );
}
