import { useId, useMemo, useState } from 'react';
import { diffSetups } from '@shared/diff/diff-setups';
import type { Change } from '@shared/diff/types';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { StaleIcon } from '../../../components/ui/icons';
import { LoadingState } from '../../../components/ui/loading-state';
import { useRevision } from '../../models/api/get-revision';
import type { Revision } from '../../models/types';
import type { StaleBase } from '../api/save-revision';
import type { EditorBase } from './setup-editor';

export interface StaleBasePanelProps {
  base: EditorBase;
  stale: StaleBase;
  /** The plain value of the pilot's text now, null when it does not parse. */
  mine: unknown;
  /** True when a save was refused; false when the newer revision was only noticed. */
  refused: boolean;
  onReapply: (latest: Revision) => void;
  onLoadLatest: (latest: Revision) => void;
  onDismiss: () => void;
}

const SHOWN = 8;

function ChangeList({ title, changes, empty }: { title: string; changes: readonly Change[]; empty: string }) {
  const [all, setAll] = useState(false);
  const id = useId();
  const shown = all ? changes : changes.slice(0, SHOWN);
  return (
    <div>
      <h3 id={id} className="text-base font-semibold text-ink-900">
        {title}
      </h3>
      {changes.length === 0 ? (
        <p className="mt-1 text-sm text-ink-700">{empty}</p>
      ) : (
        <>
          <ul aria-labelledby={id} className="mt-1.5 list-disc space-y-1 pl-5 text-sm text-ink-900">
            {shown.map((change, index) => (
              <li key={`${change.path}-${index}`}>{change.summary}</li>
            ))}
          </ul>
          {changes.length > SHOWN && (
            <Button variant="quiet" size="sm" className="mt-1 -ml-3" onClick={() => setAll(!all)}>
              {all ? 'Show fewer' : `Show all ${changes.length} changes`}
            </Button>
          )}
        </>
      )}
    </div>
  );
}

/**
 * What happened while the pilot was editing: the revisions saved meanwhile, in
 * sentences, and what their own text would change on top of the latest. Nothing is
 * merged: the pilot either stands their text on the latest revision, knowing what it
 * undoes, or starts again from the latest.
 */
export function StaleBasePanel({
  base,
  stale,
  mine,
  refused,
  onReapply,
  onLoadLatest,
  onDismiss,
}: StaleBasePanelProps) {
  const latest = useRevision(stale.latestId);
  const headingId = useId();

  const diffs = useMemo(() => {
    if (!latest.data) return null;
    return {
      meanwhile: diffSetups(base.document, latest.data.document).changes,
      mine: diffSetups(latest.data.document, mine).changes,
    };
  }, [base.document, latest.data, mine]);

  const revisionWord =
    stale.latest - base.number === 1
      ? `Revision ${stale.latest} was`
      : `Revisions ${base.number + 1}-${stale.latest} were`;
  const title = refused
    ? `Not saved: ${revisionWord.toLowerCase()} saved while you were editing`
    : `${revisionWord} saved since your edit began`;

  return (
    <section
      aria-labelledby={headingId}
      role={refused ? 'alert' : undefined}
      className="mb-6 rounded-lg border border-caution-700/50 bg-caution-100/60 px-5 py-4"
    >
      <h2 id={headingId} className="flex items-start gap-2 text-lg font-semibold text-ink-900">
        <StaleIcon className="mt-1.5 shrink-0 text-caution-700" />
        <span>{title}</span>
      </h2>
      <p className="mt-1 max-w-prose text-base text-ink-700">
        Your edit started from revision {base.number}; the latest is revision {stale.latest}
        {latest.data?.author ? `, saved by ${latest.data.author.name}` : ''}
        {latest.data?.message ? ` (“${latest.data.message}”)` : ''}. Nothing was merged: look at both lists, then
        choose.
      </p>
      {!stale.latestId ? null : latest.isPending ? (
        <LoadingState label={`Loading revision ${stale.latest}…`} />
      ) : latest.isError ? (
        <div className="mt-3">
          <ErrorState
            title={`Revision ${stale.latest} could not be loaded`}
            error={latest.error}
            onRetry={() => void latest.refetch()}
          />
        </div>
      ) : (
        diffs && (
          <div className="mt-4 grid gap-5 md:grid-cols-2">
            <ChangeList
              title={`Changed meanwhile (revision ${base.number} → ${stale.latest})`}
              changes={diffs.meanwhile}
              empty="No change to the setup itself: only its text or layout differs."
            />
            <ChangeList
              title={`What your text would change on revision ${stale.latest}`}
              changes={diffs.mine}
              empty={`Your text means the same setup as revision ${stale.latest}.`}
            />
          </div>
        )
      )}
      <div className="mt-4 flex flex-wrap gap-2">
        <Button disabled={!latest.data} onClick={() => latest.data && onReapply(latest.data)}>
          Load revision {stale.latest} and re-apply my text
        </Button>
        <Button variant="secondary" disabled={!latest.data} onClick={() => latest.data && onLoadLatest(latest.data)}>
          Discard my edit, open revision {stale.latest}
        </Button>
        <Button variant="quiet" onClick={onDismiss}>
          Keep editing
        </Button>
      </div>
      <p className="mt-2 max-w-prose text-sm text-ink-700">
        Re-applying keeps your text exactly as it is and saves it on top of revision {stale.latest}: any change in the
        first list that your text does not also hold is undone by that save, as the second list shows.
      </p>
    </section>
  );
}
