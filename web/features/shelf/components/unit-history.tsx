import { Link } from 'react-router-dom';
import { plainText } from '@shared/parse/plain-text';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { nextPageOf, ShowMore } from '../../../components/ui/show-more';
import { exactTime } from '../../models/format-time';
import { TimeAgo } from '../../models/components/time-ago';
import { useReceiverHistory } from '../api/get-receiver';
import type { UnitEvent } from '../types';

const text = (value: unknown): string | null => (typeof value === 'string' ? value : null);
const count = (value: unknown): number | null =>
  typeof value === 'number' ? value : Array.isArray(value) ? value.length : null;

/** One line per recorded event, in the pilot's words. */
function describe(event: UnitEvent): string {
  const d = event.details;
  const where = `${text(d.model_name) ?? 'a model'} as receiver ${text(d.slot) ?? '?'}`;
  switch (event.action) {
    case 'receiver.added':
      return 'Put on the shelf';
    case 'receiver.installed': {
      const changes = count(d.changes);
      const from = d.moved_from as { slot?: string; model_name?: string } | null;
      const moved = from ? `, moved from ${from.model_name ?? 'a model'} (receiver ${from.slot})` : '';
      const state = d.ready ? 'its settings already matched' : `${changes ?? 'some'} settings to change`;
      return `Installed in ${where} (revision ${plainText(d.revision_number ?? '?')}; ${state})${moved}`;
    }
    case 'receiver.removed':
      return d.moved_to
        ? `Left ${where} for ${(d.moved_to as { model_name?: string }).model_name ?? 'a model'} (receiver ${(d.moved_to as { slot?: string }).slot})`
        : `Removed from ${where}, back on the shelf`;
    case 'receiver.settings-applied':
      return `Settings for ${where} applied (revision ${plainText(d.revision_number ?? '?')}, ${count(d.changes) ?? 0} changes)`;
    case 'receiver.updated': {
      const after = (d.after ?? {}) as Record<string, unknown>;
      const names = Object.keys(after).map((key) =>
        key === 'stored_settings' ? 'the pin map and failsafes it holds' : key.replace('_', ' '),
      );
      return `Changed on its shelf record: ${names.join(', ')}`;
    }
    default:
      return event.action;
  }
}

export function UnitHistory({ receiverId }: { receiverId: string }) {
  const history = useReceiverHistory(receiverId);
  if (history.isPending) return <LoadingState label="Loading the history…" />;
  if (!history.data)
    return (
      <ErrorState
        title="The history could not be loaded"
        error={history.error}
        onRetry={() => void history.refetch()}
      />
    );
  const pages = history.data.pages;
  const installs = pages.flatMap((page) => page.installs);
  const events = pages.flatMap((page) => page.events);
  const { totals } = pages[pages.length - 1];
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <section>
        <h3 className="text-base font-semibold text-ink-900">Where it has been</h3>
        {installs.length === 0 ? (
          <p className="mt-2 text-base text-ink-700">It has not been installed in any model yet.</p>
        ) : (
          <ol className="mt-2 divide-y divide-ply-100 rounded-lg border border-ply-200 bg-paper-raised">
            {installs.map((stay) => (
              <li key={stay.id} className="px-3 py-2.5">
                <p>
                  <Link to={`/models/${stay.model.id}/overview`}>{stay.model.name ?? 'A model'}</Link>
                  <span className="text-ink-700">
                    {' '}
                    · slot <code className="font-mono text-sm">{stay.slot}</code>
                  </span>
                </p>
                <p className="text-sm text-ink-700">
                  <time dateTime={stay.from}>{exactTime(stay.from)}</time> to{' '}
                  {stay.to ? (
                    <time dateTime={stay.to}>{exactTime(stay.to)}</time>
                  ) : (
                    <strong className="font-semibold text-ink-900">now</strong>
                  )}
                </p>
              </li>
            ))}
          </ol>
        )}
      </section>
      <section>
        <h3 className="text-base font-semibold text-ink-900">Record</h3>
        {events.length === 0 ? (
          <EmptyState title="Nothing recorded yet" />
        ) : (
          <ol className="mt-2 space-y-2.5">
            {events.map((event) => (
              <li key={event.id} className="border-l-2 border-ply-300 pl-3">
                <p className="text-base text-ink-900">{describe(event)}</p>
                <p className="text-sm text-ink-700">
                  <TimeAgo iso={event.at} />
                  {event.actor && ` by ${event.actor.name}`}
                </p>
              </li>
            ))}
          </ol>
        )}
      </section>
      <div className="lg:col-span-2">
        <ShowMore
          shown={installs.length + events.length}
          total={totals.installs + totals.events}
          noun={`entries (${installs.length} of ${totals.installs} stays, ${events.length} of ${totals.events} records)`}
          label="Show older history"
          {...nextPageOf(history)}
        />
      </div>
    </div>
  );
}
