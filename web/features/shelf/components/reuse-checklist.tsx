import { useId, useState, type ReactNode } from 'react';
import { REBIND_NOTE } from '@shared/reuse/rebind-note';
import type { ReuseChange } from '@shared/reuse/reuse-check';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { CheckIcon, ErrorIcon, InfoIcon, WarningIcon } from '../../../components/ui/icons';
import { CautionsPanel } from '../../cautions/components/cautions-panel';
import { FindingsList } from '../../findings/components/findings-list';
import type { ReuseCheckView } from '../types';
import '../bench-list.css';

const changeKey = (change: ReuseChange) => `${change.setting}-${change.pin ?? 'unit'}`;
const REBIND_KEY = 'rebind';

function ChangeGroup({
  title,
  tone,
  changes,
  tickable,
  keys,
  toggle,
}: {
  title: string;
  tone?: 'danger';
  changes: ReuseChange[];
  tickable: boolean;
  keys: Set<string>;
  toggle: (key: string) => void;
}) {
  return (
    <div className="mt-3">
      <h3
        className={tone === 'danger' ? 'text-sm font-semibold text-danger-700' : 'text-sm font-semibold text-ink-900'}
      >
        {title}
      </h3>
      <ul
        className={
          tone === 'danger'
            ? 'mt-1.5 divide-y divide-ply-100 rounded-lg border-2 border-danger-700/60 bg-paper-raised'
            : 'mt-1.5 divide-y divide-ply-100 rounded-lg border border-ply-200 bg-paper-raised'
        }
      >
        {changes.map((change) => {
          const key = changeKey(change);
          const words = (
            <span>
              <span className={keys.has(key) ? 'text-ink-700 line-through decoration-ink-500' : 'text-ink-900'}>
                {change.summary}
              </span>
              {change.safety && <span className="block text-sm text-danger-700">{change.safety}</span>}
            </span>
          );
          return (
            <li key={key}>
              {tickable ? (
                <label className="flex cursor-pointer items-start gap-3 px-3 py-2.5 hover:bg-paper">
                  <input
                    type="checkbox"
                    checked={keys.has(key)}
                    onChange={() => toggle(key)}
                    className="mt-1 h-4 w-4 shrink-0 accent-accent-700"
                  />
                  {words}
                </label>
              ) : (
                <p className="flex items-start gap-3 px-3 py-2.5">
                  <WarningIcon className="mt-1 shrink-0 text-caution-700" />
                  {words}
                </p>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}

export interface ReuseChecklistProps {
  check: ReuseCheckView;
  /** Ticks are for the bench, once the unit is in the slot; a preview lists the changes only. */
  tickable?: boolean;
  /** The action under the checklist (install here, or "I have applied these settings"); given every item's tick. */
  action?: (allTicked: boolean) => ReactNode;
}

/**
 * The reuse check as a bench checklist: each setting to program on the unit with a box
 * to tick, what blocks, what to know, the model's findings for the slot and the cautions.
 */
export function ReuseChecklist({ check, tickable = false, action }: ReuseChecklistProps) {
  // Ticks belong to one check: a new revision or another slot starts the list afresh.
  const rebindId = useId();
  const [ticked, setTicked] = useState<{ of: string; keys: Set<string> }>({ of: '', keys: new Set() });
  const checkId = `${check.revision.id}:${check.slot.id}:${check.changes.map(changeKey).join(',')}`;
  const keys = ticked.of === checkId ? ticked.keys : new Set<string>();
  const toggle = (key: string) => {
    const next = new Set(keys);
    if (next.has(key)) next.delete(key);
    else next.add(key);
    setTicked({ of: checkId, keys: next });
  };
  const blocking = check.notes.filter((note) => note.blocking);
  const others = check.notes.filter((note) => !note.blocking);
  const allTicked = check.changes.every((change) => keys.has(changeKey(change))) && (!tickable || keys.has(REBIND_KEY));
  const safety = check.changes.filter((change) => change.safety !== null);
  const rest = check.changes.filter((change) => change.safety === null);
  const slotName = check.slot.label ? `${check.slot.label} · ${check.slot.id}` : check.slot.id;

  return (
    <div className="bench-list space-y-5">
      <div>
        <p className="text-sm text-ink-700">
          Against receiver <strong className="font-semibold text-ink-900">{slotName}</strong> of {check.model.name},
          revision {check.revision.number}: {check.slot.role}, {check.slot.outputs} outputs, telemetry{' '}
          {check.slot.telemetry ? 'on' : 'off'}.
        </p>
        <div className="mt-2">
          {check.ready ? (
            <Badge tone="moss" icon={CheckIcon}>
              Ready: nothing to change on the unit
            </Badge>
          ) : blocking.length > 0 ? (
            <Badge tone="danger" icon={ErrorIcon}>
              Cannot fly as this receiver as it stands
            </Badge>
          ) : (
            <Badge tone="caution" icon={WarningIcon}>
              {check.changes.length} {check.changes.length === 1 ? 'setting' : 'settings'} to change on the unit
            </Badge>
          )}
        </div>
      </div>

      {blocking.map((note) => (
        <div
          key={note.kind}
          role="alert"
          className="flex items-start gap-2 rounded-md border border-danger-700 bg-danger-100 px-3 py-2.5 text-base text-danger-700"
        >
          <ErrorIcon className="mt-1 shrink-0" />
          <p>{note.message}</p>
        </div>
      ))}

      {check.changes.length > 0 && (
        <fieldset>
          <legend className="text-base font-semibold text-ink-900">
            {tickable ? 'Program these on the unit' : 'What would have to change on the unit'}
          </legend>
          <p className="text-sm text-ink-700">
            {tickable ? 'Tick each one as it is done at the bench; ' : ''}
            {safety.length > 0
              ? 'the safety changes come first: do them before anything else.'
              : 'none of them is about the throttle or telemetry.'}
          </p>
          {safety.length > 0 && (
            <ChangeGroup
              title="Safety first"
              tone="danger"
              changes={safety}
              tickable={tickable}
              keys={keys}
              toggle={toggle}
            />
          )}
          {rest.length > 0 && (
            <ChangeGroup
              title={safety.length > 0 ? 'Then the rest' : 'Changes'}
              changes={rest}
              tickable={tickable}
              keys={keys}
              toggle={toggle}
            />
          )}
        </fieldset>
      )}

      <section aria-labelledby={rebindId}>
        <h3 id={rebindId} className="text-base font-semibold text-ink-900">
          Re-bind and check again
        </h3>
        {tickable ? (
          <label className="mt-1.5 flex cursor-pointer items-start gap-3 rounded-lg border border-ply-200 bg-paper-raised px-3 py-2.5 hover:bg-paper">
            <input
              type="checkbox"
              checked={keys.has(REBIND_KEY)}
              onChange={() => toggle(REBIND_KEY)}
              className="mt-1 h-4 w-4 shrink-0 accent-accent-700"
            />
            <span className={keys.has(REBIND_KEY) ? 'text-ink-700 line-through decoration-ink-500' : 'text-ink-900'}>
              Bind the unit to this model&apos;s transmitter, then check every setting above once more on the unit.
            </span>
          </label>
        ) : null}
        <p className="mt-1.5 flex items-start gap-2 text-base text-ink-700">
          <InfoIcon className="mt-1 shrink-0 text-info-700" />
          <span>{REBIND_NOTE}</span>
        </p>
      </section>

      {others.length > 0 && (
        <ul className="space-y-1.5">
          {others.map((note) => (
            <li key={`${note.kind}-${note.pin ?? ''}`} className="flex items-start gap-2 text-base text-ink-700">
              <InfoIcon className="mt-1 shrink-0 text-info-700" />
              <span>{note.message}</span>
            </li>
          ))}
        </ul>
      )}

      <section>
        <h3 className="text-base font-semibold text-ink-900">The model’s findings for this receiver</h3>
        <FindingsList
          className="mt-2"
          findings={check.findings}
          modelId={check.model.id}
          emptyText="The checks found nothing about this receiver."
        />
      </section>

      <CautionsPanel headingLevel={3} />

      {action && (
        <div className="flex flex-wrap items-center gap-3 print:hidden">
          {action(allTicked)}
          {check.changes.length > 0 && (
            <Button variant="secondary" onClick={() => window.print()}>
              Print the bench list
            </Button>
          )}
        </div>
      )}
    </div>
  );
}
