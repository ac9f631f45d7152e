import { Fragment, type ReactNode } from 'react';
import type { ChosenSetting } from '../../reviews/components/review-plan';
import { Badge } from '../../../components/ui/badge';
import { Card } from '../../../components/ui/card';
import { cx } from '../../../lib/cx';
import { failsafeText, type ChannelPlan, type PlanReceiver, type PlanRow } from '../channel-plan';
import { MarkBadge } from './mark-badge';
import { TelemetryIcon } from './mark-icons';

export const receiverName = (receiver: Pick<PlanReceiver, 'id' | 'label'>) =>
  receiver.label ?? `Receiver ${receiver.id}`;

export function TelemetryBadge({ receiver }: { receiver: PlanReceiver }) {
  return receiver.telemetry ? (
    <Badge tone="accent" icon={TelemetryIcon}>
      Sends telemetry
    </Badge>
  ) : (
    <Badge tone="neutral">Telemetry off</Badge>
  );
}

/** A setting's name as a button that starts a comment on it, when the reader may comment. */
function Choosable({
  setting,
  onChoose,
  children,
}: {
  setting: ChosenSetting;
  onChoose?: (setting: ChosenSetting) => void;
  children: ReactNode;
}) {
  if (!onChoose) return <>{children}</>;
  return (
    <button
      type="button"
      onClick={() => onChoose(setting)}
      aria-label={`Comment on ${setting.words}`}
      className="cursor-pointer rounded-sm underline decoration-dotted underline-offset-2 hover:text-accent-800"
    >
      {children}
    </button>
  );
}

/**
 * Channels 1 to the link's count (and any used beyond it) against the receivers that
 * carry them. With `onChoose`, a channel's number and a pin start a comment on it.
 */
export function ChannelGrid({ plan, onChoose }: { plan: ChannelPlan; onChoose?: (setting: ChosenSetting) => void }) {
  const { rows, receivers, linkChannels } = plan;
  const columns = 3 + receivers.length;

  return (
    <Card className="overflow-x-auto">
      {/* On a phone each channel is a block of its own lines, each naming its column, so nothing scrolls sideways. */}
      <table className="w-full border-collapse text-left text-base max-sm:block">
        <caption className="sr-only">
          Channel plan: each channel's function, the receiver pins that carry it, and what the checks found
        </caption>
        <thead className="border-b-2 border-ply-300 align-bottom text-sm text-ink-700 max-sm:sr-only">
          <tr>
            <th scope="col" className="w-14 px-3 py-2 font-medium">
              Ch
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Function
            </th>
            {receivers.map((receiver) => (
              <th key={receiver.id} scope="col" className="border-l border-ply-200 px-3 py-2 font-medium">
                <span className="block text-ink-900">{receiverName(receiver)}</span>
                <span className="mt-0.5 flex flex-wrap items-center gap-1 font-normal">
                  <span className="text-xs capitalize">{receiver.role}</span>
                  <TelemetryBadge receiver={receiver} />
                </span>
              </th>
            ))}
            <th scope="col" className="border-l border-ply-200 px-3 py-2 font-medium">
              Marks
            </th>
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {rows.map((row) => (
            <Fragment key={row.ch}>
              {linkChannels !== null && row.ch === linkChannels + 1 && (
                <tr className="max-sm:block">
                  <td
                    colSpan={columns}
                    className="border-y-2 max-sm:block border-dashed border-ply-500 bg-ply-100 px-3 py-1.5 text-sm font-medium text-ink-700"
                  >
                    Beyond the link: it carries {linkChannels} channels, so nothing below reaches a receiver
                  </td>
                </tr>
              )}
              <ChannelRow row={row} receivers={receivers} onChoose={onChoose} />
            </Fragment>
          ))}
        </tbody>
      </table>
    </Card>
  );
}

// A cell as a line of its own under the channel on a phone, led by its column's name.
const PHONE_LINE =
  'max-sm:flex max-sm:basis-full max-sm:flex-wrap max-sm:items-start max-sm:gap-x-2 max-sm:border-l-0 max-sm:py-1 max-sm:pl-15 max-sm:before:w-full max-sm:before:text-sm max-sm:before:text-ink-700 max-sm:before:content-[attr(data-column)]';

function ChannelRow({
  row,
  receivers,
  onChoose,
}: {
  row: PlanRow;
  receivers: PlanReceiver[];
  onChoose?: (setting: ChosenSetting) => void;
}) {
  // Accepted findings and notes do not colour the row: only what is open and needs a look.
  const open = row.marks.filter((mark) => mark.kind !== 'accepted' && mark.finding.severity !== 'info');
  const worst = open.some((mark) => mark.finding.severity === 'error') ? 'error' : open.length > 0 ? 'warning' : null;
  return (
    <tr
      className={cx(
        'border-b border-ply-100 align-top max-sm:flex max-sm:flex-wrap max-sm:py-1',
        row.beyondLink && 'bg-ply-100/60',
        worst === 'error' && 'bg-danger-100/40',
        worst === 'warning' && 'bg-caution-100/40',
      )}
    >
      <th
        scope="row"
        className={cx(
          'border-l-4 px-3 py-2 font-mono text-base font-medium text-ink-900 max-sm:w-12 max-sm:shrink-0',
          worst === 'error' ? 'border-danger-700' : worst === 'warning' ? 'border-caution-700' : 'border-transparent',
        )}
      >
        <Choosable setting={{ path: `channels[ch=${row.ch}]`, words: `Channel ${row.ch}` }} onChoose={onChoose}>
          {row.ch}
        </Choosable>
      </th>
      <td className="px-3 py-2 max-sm:min-w-0 max-sm:flex-1">
        {row.functions.length === 0 ? (
          <span className="text-sm text-ink-500">free</span>
        ) : (
          <ul className="space-y-0.5">
            {row.functions.map((fn, index) => (
              <li key={`${fn.function}-${index}`}>
                <span className="font-medium text-ink-900">{fn.function}</span>
                {fn.role && (
                  <span className="ml-1.5 text-sm text-ink-700">
                    {fn.role}
                    {fn.side ? `, ${fn.side}` : ''}
                  </span>
                )}
              </li>
            ))}
          </ul>
        )}
      </td>
      {receivers.map((receiver) => {
        const pins = row.pins[receiver.id] ?? [];
        return (
          <td
            key={receiver.id}
            data-column={receiverName(receiver)}
            // A receiver that does not carry the channel takes no line on a phone.
            className={cx('border-l border-ply-200 px-3 py-2', PHONE_LINE, pins.length === 0 && 'max-sm:hidden')}
          >
            {pins.length === 0 ? (
              <span className="text-ink-500">
                <span aria-hidden="true">·</span>
                <span className="sr-only">not carried</span>
              </span>
            ) : (
              <ul className="flex flex-wrap gap-1">
                {pins.map((pin) => (
                  <li
                    key={pin.pin}
                    className="rounded-sm border border-accent-700/30 bg-accent-50 px-1.5 py-0.5 text-sm text-ink-900"
                  >
                    <Choosable
                      setting={{
                        path: `receivers[id=${receiver.id}].map[pin=${pin.pin}]`,
                        words: `Pin ${pin.pin} of receiver ${receiver.id}`,
                      }}
                      onChoose={onChoose}
                    >
                      <span className="font-medium">Pin {pin.pin}</span>
                    </Choosable>
                    <span className="ml-1 text-xs text-ink-700">failsafe {failsafeText(pin.failsafe)}</span>
                  </li>
                ))}
              </ul>
            )}
          </td>
        );
      })}
      <td
        data-column="Marks"
        className={cx('border-l border-ply-200 px-3 py-2', PHONE_LINE, row.marks.length === 0 && 'max-sm:hidden')}
      >
        {row.marks.length === 0 ? (
          <span className="text-sm text-ink-500">clear</span>
        ) : (
          <ul className="flex flex-col items-start gap-1">
            {row.marks.map((mark) => (
              <li key={mark.kind}>
                <MarkBadge mark={mark} />
              </li>
            ))}
          </ul>
        )}
      </td>
    </tr>
  );
}
