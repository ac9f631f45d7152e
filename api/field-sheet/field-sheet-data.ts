import type { Transaction } from 'sequelize';
import type { Finding, FindingCounts } from '../../shared/findings';
import type { Failsafe } from '../../shared/format/schema';
import type { MarkColour } from '../../shared/reuse/receiver-fields';
import { Unprocessable } from '../errors';
import { Receiver, ReceiverInstall, type Revision, type SetupModel, User } from '../models';
import { setupOf } from '../queries/receiver-slot';
import { reviewStateOf, type ReviewState } from '../review-state';
import { CAUTIONS, CAUTIONS_HEADING, type Caution } from '../../shared/cautions';

export const SHORT_HASH_LENGTH = 12;

export interface SheetPin {
  pin: number;
  ch: number;
  /** The channel plan's function for that channel; null when the plan has none. */
  function: string | null;
  role: string | null;
  failsafe: Failsafe | null;
}

export interface SheetUnit {
  id: string;
  label: string;
  mark: string | null;
  mark_colour: MarkColour | null;
}

export interface SheetReceiver {
  id: string;
  label: string | null;
  role: 'primary' | 'secondary';
  outputs: number;
  telemetry: boolean;
  pins: SheetPin[];
  /** The shelf unit installed in this slot now, when one is. */
  unit: SheetUnit | null;
}

export interface FieldSheet {
  model: {
    id: string;
    name: string;
    setup_name: string;
    airframe: string;
    wingspan_mm: number | null;
    weight_g: number | null;
  };
  revision: {
    id: string;
    number: number;
    content_hash: string;
    short_hash: string;
    created_at: string;
    message: string;
    author: { id: string; name: string } | null;
  };
  review_state: ReviewState;
  link: { channels: number; packet_rate_hz: number | null };
  channels: { ch: number; function: string; role: string; side: string | null; reverse: boolean; cut: string | null }[];
  receivers: SheetReceiver[];
  receiver_supply: string | null;
  counts: FindingCounts;
  /** Errors and warnings, to be read before flying. */
  findings: Finding[];
  cautions: { heading: string; items: readonly Caution[] };
}

/** Everything the printed sheet shows for one revision; 422 when the revision has no valid setup to print. */
export async function fieldSheetOf(
  model: SetupModel,
  revision: Revision,
  transaction?: Transaction,
): Promise<FieldSheet> {
  const setup = setupOf(revision);
  if (!setup) {
    throw new Unprocessable(
      `Revision ${revision.number} of ${model.name} does not pass the format's schema, so there is no channel plan to print. Fix the setup first.`,
      {
        code: 'setup-not-valid',
        details: { revision: { id: revision.id, number: revision.number } },
      },
    );
  }
  const [states, installs, author] = await Promise.all([
    reviewStateOf([revision]),
    ReceiverInstall.findAll({
      where: { modelId: model.id, removedAt: null },
      include: [{ model: Receiver, as: 'receiver', attributes: ['id', 'label', 'mark', 'markColour'] }],
      transaction,
    }),
    User.findByPk(revision.authorId, { attributes: ['id', 'name'], transaction }),
  ]);
  const units = new Map(installs.map((install) => [install.slot, install.receiver]));
  const plan = new Map(setup.channels.map((channel) => [channel.ch, channel]));
  const serious = revision.findings.filter((finding) => finding.severity !== 'info');

  return {
    model: {
      id: model.id,
      name: model.name,
      setup_name: setup.model.name,
      airframe: setup.model.airframe,
      wingspan_mm: setup.model.wingspan_mm ?? null,
      weight_g: setup.model.weight_g ?? null,
    },
    revision: {
      id: revision.id,
      number: revision.number,
      content_hash: revision.contentHash,
      short_hash: revision.contentHash.slice(0, SHORT_HASH_LENGTH),
      created_at: revision.createdAt.toISOString(),
      message: revision.message,
      author: author ? { id: author.id, name: author.name } : null,
    },
    review_state: states.get(revision.id) ?? 'none',
    link: { channels: setup.link.channels, packet_rate_hz: setup.link.packet_rate_hz ?? null },
    channels: [...setup.channels]
      .sort((a, b) => a.ch - b.ch)
      .map((channel) => ({
        ch: channel.ch,
        function: channel.function,
        role: channel.role,
        side: channel.side ?? null,
        reverse: channel.travel.reverse,
        cut: channel.cut ? `${channel.cut.control} at ${channel.cut.position}: ${channel.cut.value} %` : null,
      })),
    receivers: setup.receivers.map((receiver) => {
      const unit = units.get(receiver.id);
      return {
        id: receiver.id,
        label: receiver.label ?? null,
        role: receiver.role,
        outputs: receiver.outputs,
        telemetry: receiver.telemetry,
        pins: [...receiver.map]
          .sort((a, b) => a.pin - b.pin)
          .map((entry) => ({
            pin: entry.pin,
            ch: entry.ch,
            function: plan.get(entry.ch)?.function ?? null,
            role: plan.get(entry.ch)?.role ?? null,
            failsafe: entry.failsafe ?? null,
          })),
        unit: unit
          ? { id: unit.id, label: unit.label, mark: unit.mark ?? null, mark_colour: unit.markColour ?? null }
          : null,
      };
    }),
    receiver_supply: setup.power?.receiver_supply ?? null,
    counts: { errors: revision.errorCount, warnings: revision.warningCount, infos: revision.infoCount },
    findings: serious,
    cautions: { heading: CAUTIONS_HEADING, items: CAUTIONS },
  };
}
