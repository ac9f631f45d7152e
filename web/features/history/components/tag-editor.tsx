import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { CloseIcon } from '../../../components/ui/icons';
import { useToast } from '../../../components/ui/toast';
import type { RevisionSummary, SetupModelView } from '../../models/types';
import { useAddTag, useRemoveTag } from '../api/revision-actions';

// Same rule as the server's tag names (api/routes/model-inputs.ts), so most mistakes are
// caught before a round trip; the server's message still shows for anything else.
const TAG_PATTERN = /^[a-z0-9][a-z0-9-]{0,39}$/;

export function TagList({ tags }: { tags: string[] }) {
  if (tags.length === 0) return null;
  return (
    <ul className="flex flex-wrap gap-1" aria-label="Tags">
      {tags.map((tag) => (
        <li
          key={tag}
          className="rounded-full border border-accent-700/30 bg-accent-50 px-2 py-0.5 font-mono text-xs text-accent-800"
        >
          {tag}
        </li>
      ))}
    </ul>
  );
}

/** The revision's tags with a remove button each, and a small form to add one. */
export function TagEditor({ model, revision }: { model: SetupModelView; revision: RevisionSummary }) {
  const add = useAddTag(model);
  const remove = useRemoveTag(model);
  const toast = useToast();
  const [adding, setAdding] = useState(false);
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  const inputId = `tag-${revision.id}`;

  function submit(event: FormEvent) {
    event.preventDefault();
    const tag = name.trim();
    if (!TAG_PATTERN.test(tag))
      return setError('A tag is lower-case letters, digits and dashes, like season-2026 or maiden.');
    setError(null);
    add.mutate(
      { revisionId: revision.id, name: tag },
      {
        onSuccess: () => {
          setName('');
          setAdding(false);
        },
        onError: (failure) => setError(failure.message),
      },
    );
  }

  return (
    <div className="flex flex-wrap items-center gap-1">
      {revision.tags.map((tag) => (
        <span
          key={tag}
          className="inline-flex items-center gap-0.5 rounded-full border border-accent-700/30 bg-accent-50 py-0.5 pr-0.5 pl-2 font-mono text-xs text-accent-800"
        >
          {tag}
          <button
            type="button"
            aria-label={`Remove tag ${tag} from revision ${revision.number}`}
            disabled={remove.isPending}
            onClick={() =>
              remove.mutate(
                { revisionId: revision.id, name: tag },
                {
                  onError: (failure) =>
                    toast({ tone: 'error', title: `Tag ${tag} could not be removed`, description: failure.message }),
                },
              )
            }
            className="rounded-full p-0.5 hover:bg-accent-100"
          >
            <CloseIcon />
          </button>
        </span>
      ))}
      {adding ? (
        <form onSubmit={submit} noValidate className="flex flex-wrap items-center gap-1">
          <label htmlFor={inputId} className="sr-only">
            New tag for revision {revision.number}
          </label>
          <input
            id={inputId}
            value={name}
            onChange={(event) => setName(event.target.value)}
            onKeyDown={(event) => event.key === 'Escape' && setAdding(false)}
            placeholder="season-2026"
            autoFocus
            maxLength={40}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${inputId}-error` : undefined}
            className="h-8 w-36 rounded-md border border-ply-500 bg-paper-raised px-2 font-mono text-sm"
          />
          <Button type="submit" size="sm" pending={add.isPending}>
            Add
          </Button>
          <Button size="sm" variant="quiet" onClick={() => setAdding(false)}>
            Cancel
          </Button>
          {error && (
            <p id={`${inputId}-error`} className="w-full text-sm text-danger-700">
              {error}
            </p>
          )}
        </form>
      ) : (
        <Button
          size="sm"
          variant="quiet"
          onClick={() => setAdding(true)}
          aria-label={`Add a tag to revision ${revision.number}`}
        >
          + Tag
        </Button>
      )}
    </div>
  );
}
