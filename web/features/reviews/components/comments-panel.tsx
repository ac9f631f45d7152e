import { useMemo, useState, type FormEvent } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormAlert } from '../../../components/ui/form-alert';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { formErrorsFrom } from '../../../lib/form-errors';
import { TimeAgo } from '../../models/components/time-ago';
import { useAddComment } from '../api/reviews';
import type { ReviewDetail } from '../types';

/** Comments on the reviewed revision, anchored ones carried over from earlier revisions included. */
export function CommentsPanel({ review }: { review: ReviewDetail }) {
  const [path, setPath] = useState('');
  const [body, setBody] = useState('');
  const add = useAddComment(review);
  const errors = add.isError ? formErrorsFrom(add.error, ['path', 'body']) : null;

  // Places worth anchoring to: what changed and what the checks point at.
  const suggestions = useMemo(() => {
    const paths = new Set<string>();
    for (const change of review.compare?.changes ?? []) paths.add(change.path);
    for (const finding of review.findings) if (finding.path) paths.add(finding.path);
    return [...paths].sort();
  }, [review]);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    add.mutate(
      { body: body.trim(), ...(path.trim() ? { path: path.trim() } : {}) },
      {
        onSuccess: () => {
          setBody('');
          setPath('');
        },
      },
    );
  };

  return (
    <Card className="p-5">
      <h2 className="text-lg font-semibold text-ink-900">Comments</h2>
      <p className="mt-0.5 text-sm text-ink-700">
        A comment anchored to a place in the setup stays on later revisions for as long as that place exists.
      </p>
      {review.comments.length === 0 ? (
        <p className="mt-3 text-base text-ink-700">No comments yet.</p>
      ) : (
        <ul className="mt-3 space-y-3" aria-label="Comments">
          {review.comments.map((comment) => (
            <li key={comment.id} className="rounded-md border border-ply-200 bg-paper px-3 py-2">
              <div className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
                <span className="font-medium text-ink-900">{comment.author?.name ?? 'Former member'}</span>
                <TimeAgo iso={comment.created_at} className="text-ink-500" />
                {comment.path ? (
                  <code className="rounded-sm bg-ply-100 px-1.5 py-0.5 font-mono text-xs break-all text-ink-700">
                    {comment.path}
                  </code>
                ) : (
                  <Badge>Whole revision</Badge>
                )}
                {comment.carried && <Badge tone="info">From revision {comment.revision.number}</Badge>}
              </div>
              <p className="mt-1 text-base whitespace-pre-wrap text-ink-900">{comment.body}</p>
            </li>
          ))}
        </ul>
      )}
      {review.can.comment && (
        <form onSubmit={onSubmit} className="mt-4 space-y-3 border-t border-ply-200 pt-4" aria-label="Add a comment">
          {errors?.general && <FormAlert>{errors.general}</FormAlert>}
          <TextField
            label="Anchor (optional)"
            name="path"
            list="comment-paths"
            hint="A place in the setup, like receivers[id=wing].map[pin=3]; leave empty for the whole revision."
            value={path}
            onChange={(event) => setPath(event.target.value)}
            error={errors?.fields.path}
          />
          <datalist id="comment-paths">
            {suggestions.map((suggestion) => (
              <option key={suggestion} value={suggestion} />
            ))}
          </datalist>
          <TextAreaField
            label="Comment"
            name="comment"
            maxLength={4000}
            value={body}
            onChange={(event) => setBody(event.target.value)}
            error={errors?.fields.body}
          />
          <Button type="submit" variant="secondary" pending={add.isPending} disabled={body.trim() === ''}>
            Add comment
          </Button>
        </form>
      )}
    </Card>
  );
}
