import type { ReactNode } from 'react';
import { Badge } from '../../../components/ui/badge';
import { cx } from '../../../lib/cx';
import type { PlanStatus } from '@shared/diff/review-plan';
import { failsafeWords } from '../../bench/failsafe-words';
import { SettingHistory } from '../../provenance/components/setting-history';
import type { ReviewPlan } from '../types';

/** A setting the reviewer chose to comment on: its semantic path and how to say it. */
export interface ChosenSetting {
  path: string;
  words: string;
}

const STATUS_WORDS: Record<PlanStatus, string> = { new: 'New', changed: 'Changed', same: 'Same' };

function StatusBadge({ status }: { status: PlanStatus }) {
  if (status === 'same') return <span className="text-sm text-ink-500">Same</span>;
  return <Badge tone={status === 'new' ? 'info' : 'caution'}>{STATUS_WORDS[status]}</Badge>;
}

/** The mark against the base and, for a changed or new entry, the way to its earlier history. */
function StatusCell({ status, modelId, setting }: { status: PlanStatus; modelId: string; setting: ChosenSetting }) {
  return (
    <>
      <StatusBadge status={status} />
      {status !== 'same' && <SettingHistory modelId={modelId} path={setting.path} words={setting.words} />}
    </>
  );
}

const rowTone = (status: PlanStatus) =>
  status === 'changed' ? 'bg-caution-100/40' : status === 'new' ? 'bg-info-100/30' : undefined;

/** The setting's name as a button that starts a comment thread on it; plain text for readers who cannot comment. */
function SettingName({
  setting,
  canComment,
  onChoose,
  threads,
  children,
}: {
  setting: ChosenSetting;
  canComment: boolean;
  onChoose: (setting: ChosenSetting) => void;
  threads: number;
  children: ReactNode;
}) {
  const count = threads > 0 && (
    <span className="ml-1.5 text-xs text-ink-700">
      ({threads} open {threads === 1 ? 'comment' : 'comments'})
    </span>
  );
  if (!canComment)
    return (
      <>
        {children}
        {count}
      </>
    );
  return (
    <>
      <button
        type="button"
        onClick={() => onChoose(setting)}
        aria-label={`Comment on ${setting.words}`}
        className="cursor-pointer rounded-sm text-left font-medium text-accent-700 underline decoration-dotted underline-offset-2 hover:text-accent-800"
      >
        {children}
      </button>
      {count}
    </>
  );
}

const headCell = 'px-3 py-2 text-left text-sm font-medium text-ink-700';
const cell = 'px-3 py-2 align-top text-base text-ink-900';

// Relative, so the screen-reader-only words inside a scrolled cell stay in this scroll box
// instead of widening the page on a phone.
function PlanTable({ caption, heads, children }: { caption: string; heads: string[]; children: ReactNode }) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ply-200 bg-paper-raised">
      <table className="w-full border-collapse">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-ply-200 bg-ply-50">
          <tr>
            {heads.map((head) => (
              <th key={head} scope="col" className={headCell}>
                {head}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-ply-100">{children}</tbody>
      </table>
    </div>
  );
}

/**
 * The whole setup on the review: link, channels, mixes, receivers and their pins with
 * what each does when its receiver loses the link, each marked against the base.
 * Choosing a setting's name starts a comment thread anchored to it.
 */
export function ReviewPlanView({
  modelId,
  plan,
  openPaths,
  canComment,
  onChoose,
}: {
  /** The reviewed model: each changed setting's history is read from it. */
  modelId: string;
  plan: ReviewPlan;
  /** The setting path of each open anchored thread, once per thread. */
  openPaths: readonly string[];
  canComment: boolean;
  onChoose: (setting: ChosenSetting) => void;
}) {
  const open = (path: string) => openPaths.filter((anchored) => anchored.startsWith(path)).length;
  const name = (setting: ChosenSetting, label: ReactNode) => (
    <SettingName setting={setting} canComment={canComment} onChoose={onChoose} threads={open(setting.path)}>
      {label}
    </SettingName>
  );

  return (
    <div className="space-y-5">
      <p className="flex flex-wrap items-center gap-2 text-base text-ink-900">
        {/* The button says what its label says (the setting); the rest of the line describes it. */}
        {name({ path: 'link', words: 'The link' }, 'The link')}
        <span>
          {plan.link.channels === null ? 'does not say its channel count' : `carries ${plan.link.channels} channels`}
        </span>
        <StatusBadge status={plan.link.status} />
      </p>

      <section aria-labelledby="plan-channels">
        <h3 id="plan-channels" className="mb-2 text-base font-semibold text-ink-900">
          Channels
        </h3>
        <PlanTable
          caption="Channels of the reviewed revision"
          heads={['Channel', 'Function', 'Role', 'Reversed', 'Against the base']}
        >
          {plan.channels.map((channel) => (
            <tr key={channel.path} className={rowTone(channel.status)}>
              <td className={cell}>
                {name({ path: channel.path, words: `Channel ${channel.ch}` }, `Channel ${channel.ch}`)}
              </td>
              <td className={cell}>{channel.function ?? 'not given'}</td>
              <td className={cell}>{channel.role ?? 'not given'}</td>
              <td className={cell}>{channel.reverse ? 'Yes' : 'No'}</td>
              <td className={cell}>
                <StatusCell
                  status={channel.status}
                  modelId={modelId}
                  setting={{ path: channel.path, words: `Channel ${channel.ch}` }}
                />
              </td>
            </tr>
          ))}
        </PlanTable>
      </section>

      {plan.mixes.length > 0 && (
        <section aria-labelledby="plan-mixes">
          <h3 id="plan-mixes" className="mb-2 text-base font-semibold text-ink-900">
            Mixes
          </h3>
          <PlanTable
            caption="Mixes of the reviewed revision"
            heads={['Mix', 'From', 'To channel', 'Expo', 'Rates', 'Against the base']}
          >
            {plan.mixes.map((mix) => (
              <tr key={mix.path} className={rowTone(mix.status)}>
                <td className={cell}>{name({ path: mix.path, words: `Mix ${mix.id}` }, mix.id)}</td>
                <td className={cell}>{mix.from ?? 'not given'}</td>
                <td className={cell}>{mix.to ?? 'not given'}</td>
                <td className={cell}>{mix.expo === null ? 'none' : `${mix.expo} %`}</td>
                <td className={cell}>{mix.rates ? mix.rates.map((rate) => `${rate} %`).join(' / ') : 'one rate'}</td>
                <td className={cell}>
                  <StatusCell
                    status={mix.status}
                    modelId={modelId}
                    setting={{ path: mix.path, words: `Mix ${mix.id}` }}
                  />
                </td>
              </tr>
            ))}
          </PlanTable>
        </section>
      )}

      {plan.receivers.map((receiver) => (
        <section key={receiver.path} aria-labelledby={`plan-${receiver.id}`}>
          <h3
            id={`plan-${receiver.id}`}
            className="mb-1 flex flex-wrap items-center gap-2 text-base font-semibold text-ink-900"
          >
            {name({ path: receiver.path, words: `Receiver ${receiver.id}` }, `Receiver ${receiver.id}`)}
            {receiver.label && <span className="font-normal text-ink-700">{receiver.label}</span>}
            <StatusBadge status={receiver.status} />
          </h3>
          <p className="mb-2 text-sm text-ink-700">
            {receiver.role === 'secondary' ? 'Second receiver' : 'Main receiver'}
            {receiver.outputs !== null && `, ${receiver.outputs} outputs`}
            {receiver.telemetry ? ', sends telemetry' : ', no telemetry'}.
          </p>
          <PlanTable
            caption={`Pins of receiver ${receiver.id}`}
            heads={['Pin', 'Channel', 'Function', 'Failsafe: when this receiver loses the link', 'Against the base']}
          >
            {receiver.pins.map((pin) => (
              <tr key={pin.path} className={rowTone(pin.status)}>
                <td className={cell}>
                  {name({ path: pin.path, words: `Pin ${pin.pin} of receiver ${receiver.id}` }, `Pin ${pin.pin}`)}
                </td>
                <td className={cell}>{pin.ch ?? 'not given'}</td>
                <td className={cell}>{pin.function ?? 'no function planned'}</td>
                <td className={cell}>
                  {pin.failsafe === null ? 'not set: the receiver’s own default' : failsafeWords(pin.failsafe)}
                </td>
                <td className={cell}>
                  <StatusCell
                    status={pin.status}
                    modelId={modelId}
                    setting={{ path: pin.path, words: `Pin ${pin.pin} of receiver ${receiver.id}` }}
                  />
                </td>
              </tr>
            ))}
          </PlanTable>
        </section>
      ))}

      {plan.removed.length > 0 && (
        <section
          aria-labelledby="plan-removed"
          className={cx('rounded-lg border border-danger-700/40 bg-danger-100/40 px-4 py-3')}
        >
          <h3 id="plan-removed" className="text-base font-semibold text-ink-900">
            No longer in this revision
          </h3>
          <ul className="mt-1 list-disc pl-5 text-base text-ink-900">
            {plan.removed.map((entry) => (
              <li key={entry.path}>{entry.words}</li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
