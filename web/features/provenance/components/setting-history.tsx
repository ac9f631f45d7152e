import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { ProvenanceChange } from '@shared/contract/provenance';
import { ErrorState } from '../../../components/ui/error-state';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { Spinner } from '../../../components/ui/spinner';
import { useSettingHistory } from '../api/get-setting-history';
import { changeText } from '../since';

/**
 * "Its history" beside a changed setting: a disclosure that lists, when opened, every
 * revision that changed it (newest first), each with its author, date and message and
 * a link to the compare of that revision with the one before it.
 */
export function SettingHistory({ modelId, path, words }: { modelId: string; path: string; words: string }) {
  const [open, setOpen] = useState(false);
  return (
    <details
      className="group mt-1 text-sm"
      onToggle={(event) => setOpen(event.currentTarget.open)}
      data-setting-history={path}
    >
      <summary className="cursor-pointer text-accent-700 underline decoration-dotted underline-offset-2 hover:text-accent-800">
        Its history<span className="sr-only">: {words}</span>
      </summary>
      {open && <HistoryList modelId={modelId} path={path} />}
    </details>
  );
}

function HistoryList({ modelId, path }: { modelId: string; path: string }) {
  const history = useSettingHistory(modelId, path, true);
  if (history.isPending)
    return (
      <p className="mt-1 flex items-center gap-1.5 text-ink-700">
        <Spinner /> Reading its history…
      </p>
    );
  if (history.isError) return <ErrorState title="Its history could not be loaded" error={history.error} />;
  const changes = history.data.pages.flatMap((page) => page.items);
  const total = history.data.pages.at(-1)?.total ?? changes.length;
  if (changes.length === 0) return <p className="mt-1 text-ink-700">No saved revision changed it yet.</p>;
  return (
    <div className="mt-1 w-72 max-w-full rounded-sm border border-ply-300 bg-paper-raised px-2 py-1.5 shadow-card">
      <ol className="space-y-1.5">
        {changes.map((change) => (
          <li key={change.revision.id} className="text-ink-900">
            <span>{changeText(change)}</span> <CompareLink modelId={modelId} change={change} />
          </li>
        ))}
      </ol>
      <ShowMore shown={changes.length} total={total} noun="revisions" {...nextPageOf(history)} />
    </div>
  );
}

function CompareLink({ modelId, change }: { modelId: string; change: ProvenanceChange }) {
  const { revision } = change;
  // Revision 1 has nothing before it: its values were all new then.
  if (!revision.parent_id) return <span className="text-ink-700">(the first revision)</span>;
  return (
    <Link to={`/models/${encodeURIComponent(modelId)}/compare?from=${revision.parent_id}&to=${revision.id}`}>
      compare r{revision.number - 1} with r{revision.number}
    </Link>
  );
}
