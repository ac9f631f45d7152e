import { REBIND_NOTE_SHEET } from '@shared/reuse/rebind-note';
import { ReviewStateBadge } from '../../../components/ui/badge';
import { CautionsPanel } from '../../cautions/components/cautions-panel';
import { FindingsList } from '../../findings/components/findings-list';
import { CheckBadges } from '../../models/components/check-badges';
import { exactTime } from '../../models/format-time';
import { MarkLabel } from '../../shelf/components/mark-label';
import type { FieldSheet as Sheet } from '../types';
import { SheetPinTable } from './sheet-pin-table';

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-xs text-ink-700">{label}</dt>
      <dd className="mt-0.5 font-semibold text-ink-900">{children}</dd>
    </div>
  );
}

/** The sheet itself: what a pilot takes to the bench and the field, on screen and on paper. */
export function FieldSheet({ sheet }: { sheet: Sheet }) {
  const half = Math.ceil(sheet.channels.length / 2);
  const columns =
    sheet.channels.length > 8 ? [sheet.channels.slice(0, half), sheet.channels.slice(half)] : [sheet.channels];
  const about = [
    sheet.model.airframe,
    sheet.model.wingspan_mm && `span ${sheet.model.wingspan_mm} mm`,
    sheet.model.weight_g && `${sheet.model.weight_g} g`,
    sheet.receiver_supply && `receiver supply: ${sheet.receiver_supply}`,
  ].filter(Boolean);

  return (
    <article className="field-sheet space-y-5 rounded-lg border border-ply-200 bg-paper-raised px-6 py-5 shadow-card print:rounded-none print:border-0 print:p-0">
      <header className="border-b-2 border-ink-900 pb-3">
        <p className="text-xs font-semibold tracking-widest text-ink-700 uppercase">Bindery field sheet</p>
        <h1 className="text-2xl font-semibold tracking-tight text-ink-900">{sheet.model.name}</h1>
        <dl className="mt-2 flex flex-wrap gap-x-8 gap-y-2 text-base">
          <Fact label="Revision">{sheet.revision.number}</Fact>
          <Fact label="Content fingerprint">
            <code className="font-mono text-sm" title={sheet.revision.content_hash}>
              {sheet.revision.short_hash}
            </code>
          </Fact>
          <Fact label="Review">
            <ReviewStateBadge state={sheet.review_state} />
          </Fact>
          <Fact label="Link">
            {sheet.link.channels} channels{sheet.link.packet_rate_hz ? ` at ${sheet.link.packet_rate_hz} Hz` : ''}
          </Fact>
          <Fact label="Checks">
            <CheckBadges errors={sheet.counts.errors} warnings={sheet.counts.warnings} />
          </Fact>
        </dl>
        <p className="mt-2 text-sm text-ink-700">
          {about.join(' · ')}
          {sheet.revision.author &&
            ` · saved by ${sheet.revision.author.name}, ${exactTime(sheet.revision.created_at)}`}
        </p>
      </header>

      <section aria-labelledby="sheet-channel-plan">
        <h2 id="sheet-channel-plan" className="text-lg font-semibold text-ink-900">
          Channel plan
        </h2>
        <div className="mt-1 grid gap-x-6 sm:grid-cols-2 print:grid-cols-2">
          {columns.map((channels, index) => (
            <table key={index} className="w-full text-left text-sm">
              <caption className="sr-only">
                Channels {channels[0]?.ch} to {channels[channels.length - 1]?.ch}
              </caption>
              <thead className="border-b border-ply-300 text-xs text-ink-700">
                <tr>
                  <th scope="col" className="py-1 pr-2 font-medium">
                    Ch
                  </th>
                  <th scope="col" className="py-1 pr-2 font-medium">
                    Function
                  </th>
                  <th scope="col" className="py-1 pr-2 font-medium">
                    Role
                  </th>
                  <th scope="col" className="py-1 font-medium">
                    Notes
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-ply-200">
                {channels.map((channel) => (
                  <tr key={channel.ch}>
                    <td className="py-1 pr-2 font-mono">{channel.ch}</td>
                    <td className="py-1 pr-2">{channel.function}</td>
                    <td className="py-1 pr-2">{channel.side ? `${channel.role} (${channel.side})` : channel.role}</td>
                    <td className="py-1 text-ink-700">
                      {[channel.reverse && 'reversed', channel.cut && `cut: ${channel.cut.words}`]
                        .filter(Boolean)
                        .join(', ')}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ))}
        </div>
      </section>

      <div className="grid gap-x-6 gap-y-5 sm:grid-cols-2 print:grid-cols-2">
        {sheet.receivers.map((receiver) => (
          <section key={receiver.id} aria-labelledby={`sheet-receiver-${receiver.id}`}>
            <h2 id={`sheet-receiver-${receiver.id}`} className="text-lg font-semibold text-ink-900">
              {receiver.label ?? `Receiver ${receiver.id}`}
              {receiver.label && <span className="font-normal text-ink-700"> · “{receiver.id}” in the setup</span>}
            </h2>
            <p className="text-sm text-ink-700">
              {receiver.role}, {receiver.outputs} outputs, telemetry:{' '}
              <strong className="font-semibold text-ink-900">
                {receiver.telemetry ? 'on (this receiver sends it)' : 'off'}
              </strong>
            </p>
            <p className="mb-1 text-sm">
              {receiver.unit ? (
                <span className="inline-flex flex-wrap items-center gap-x-2">
                  Unit: <strong className="font-semibold">{receiver.unit.label}</strong>
                  <MarkLabel mark={receiver.unit.mark} colour={receiver.unit.mark_colour} />
                  <span className="text-ink-700">{REBIND_NOTE_SHEET}</span>
                </span>
              ) : (
                <span className="text-ink-700">Unit: none on the shelf is installed here</span>
              )}
            </p>
            <SheetPinTable receiver={receiver} />
          </section>
        ))}
      </div>

      {sheet.findings.length > 0 && (
        <section aria-labelledby="sheet-findings">
          <h2 id="sheet-findings" className="text-lg font-semibold text-ink-900">
            Check findings to settle before flying
          </h2>
          <FindingsList className="mt-1" findings={sheet.findings} modelId={sheet.model.id} />
        </section>
      )}

      <CautionsPanel className="print:border-ink-900/40 print:bg-white" />
    </article>
  );
}
