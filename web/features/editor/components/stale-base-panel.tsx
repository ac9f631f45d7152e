import { useId, useMemo, useState } from 'react';
import { diffSetups } from '@shared/diff/diff-setups';
import type { Change } from '@shared/diff/types';
import { applyToText } from '@shared/lineage/apply-to-text';
import { mergeSetups, type MergeSide } from '@shared/lineage/merge-setups';
import { ConflictChoices } from '../../lineage/components/conflict-choices';
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
  /** The pilot's text now. */
  mineText: string;
  /** True when a save was refused; false when the newer revision was only noticed. */
  refused: boolean;
  onReapply: (latest: Revision) => void;
  onLoadLatest: (latest: Revision) => void;
  /** The pilot's edits brought onto the latest revision: the merged text, to stand on `latest`. */
  onMerge: (latest: Revision, text: string) => void;
  onDismiss: () => void;
}

/**
 * The three-way merge a fork uses to take in its source, here for a stale tab: the
 * changes saved meanwhile and the pilot's own, by identity path, with a choice for each
 * setting both changed. The pilot's text keeps its comments and layout.
 */
function MergeOnLatest({
  base,
  latest,
  mine,
  mineText,
  onMerge,
}: {
  base: EditorBase;
  latest: Revision;
  mine: unknown;
  mineText: string;
  onMerge: (latest: Revision, text: string) => void;
}) {
  const [choices, setChoices] = useState<Record<string, MergeSide>>({});
  const conflicts = useMemo(
    () => mergeSetups(base.document, mine, latest.document).conflicts,
    [base.document, mine, latest.document],
  );
  const open = conflicts.filter((conflict) => !choices[conflict.path]);
  const merge = () => {
    const merged = mergeSetups(base.document, mine, latest.document, choices);
    onMerge(latest, applyToText(mineText, mine, merged.data));
  };
  return (
    <div className="mt-4 border-t border-caution-700/30 pt-4">
      <h3 className="text-base font-semibold text-ink-900">Bring my edits onto revision {latest.number}</h3>
      <p className="mt-1 max-w-prose text-sm text-ink-700">
        Keeps every change saved meanwhile and every change of yours
        {conflicts.length > 0
          ? `; ${conflicts.length === 1 ? 'one setting was' : `${conflicts.length} settings were`} changed on both sides, so choose which to keep.`
          : ', as no setting was changed on both sides.'}{' '}
        The result opens in the editor for you to look over and save.
      </p>
      {conflicts.length > 0 && (
        <div className="mt-3">
          <ConflictChoices
            conflicts={conflicts}
            choices={choices}
            onChoose={(path, side) => setChoices({ ...choices, [path]: side })}
            oursLabel="mine"
            theirsLabel={`revision ${latest.number}’s`}
          />
        </div>
      )}
      <Button className="mt-3" disabled={open.length > 0} onClick={merge}>
        Bring my edits onto revision {latest.number}
      </Button>
    </div>
  );
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
  mineText,
  refused,
  onReapply,
  onLoadLatest,
  onMerge,
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
        {latest.data?.message ? ` (“${latest.data.message}”)` : ''}. Nothing was merged yet: look at both lists, then
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
      {latest.data && mine !== null && (
        <MergeOnLatest base={base} latest={latest.data} mine={mine} mineText={mineText} onMerge={onMerge} />
      )}
      <div className="mt-4 flex flex-wrap gap-2">
        <Button
          variant={latest.data && mine !== null ? 'secondary' : 'primary'}
          disabled={!latest.data}
          onClick={() => latest.data && onReapply(latest.data)}
        >
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
