import type { Transaction } from 'sequelize';
import { Unprocessable } from '../errors';
import { Receiver, ReceiverInstall, type Revision, type SetupModel, User } from '../models';
import { setupOf } from '../queries/receiver-slot';
import { reviewStateOf } from '../review-state';
import { CAUTIONS, CAUTIONS_HEADING } from '@shared/cautions';
import {
  sheetCut,
  sheetLinkLoss,
  type FieldSheet,
  type SheetPin,
  type SheetReceiver,
} from '@shared/contract/field-sheet';

export type { FieldSheet, SheetPin, SheetReceiver };

export const SHORT_HASH_LENGTH = 12;

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
        cut: channel.cut ? sheetCut(channel.cut, setup) : null,
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
            link_loss: sheetLinkLoss(entry.failsafe),
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
