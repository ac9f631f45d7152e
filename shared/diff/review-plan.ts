import { canonicalJson } from '../canonical/content-hash';
import { sheetLinkLoss, type SheetLinkLoss } from '../contract/field-sheet';
import type { Failsafe } from '../format/schema';

// The whole setup as a reviewer reads it: link, channels, mixes, receivers and their
// pins with what each pin does when its receiver loses the link; every entry marked
// against a base revision by identity (a channel by its number, a mix or a receiver by
// its id, a pin by its number), so a moved line is not a change and a changed value is.
// The documents are read loosely: a revision with schema errors is still reviewed.

/** `new` without a base (a first review) or when the base has no such entry. */
export type PlanStatus = 'new' | 'changed' | 'same';

export interface PlanLink {
  path: 'link';
  status: PlanStatus;
  channels: number | null;
}

export interface PlanChannel {
  path: string;
  status: PlanStatus;
  ch: number;
  function: string | null;
  role: string | null;
  reverse: boolean;
}

export interface PlanMix {
  path: string;
  status: PlanStatus;
  id: string;
  from: string | null;
  to: number | null;
  expo: number | null;
  rates: number[] | null;
}

export interface PlanPin {
  path: string;
  status: PlanStatus;
  pin: number;
  ch: number | null;
  function: string | null;
  failsafe: NonNullable<Failsafe> | null;
  link_loss: SheetLinkLoss;
}

export interface PlanReceiver {
  path: string;
  /** The receiver's own settings (label, role, outputs, telemetry); its pins are marked one by one. */
  status: PlanStatus;
  id: string;
  label: string | null;
  role: string;
  outputs: number | null;
  telemetry: boolean;
  pins: PlanPin[];
}

export interface ReviewPlan {
  /** Whether there was a base to compare with; without one everything is new. */
  compared: boolean;
  link: PlanLink;
  channels: PlanChannel[];
  mixes: PlanMix[];
  receivers: PlanReceiver[];
  /** Entries of the base the reviewed revision no longer has. */
  removed: { path: string; words: string }[];
}

type Loose = Record<string, unknown>;
const record = (value: unknown): Loose =>
  value && typeof value === 'object' && !Array.isArray(value) ? (value as Loose) : {};
const list = (value: unknown): Loose[] => (Array.isArray(value) ? value.map(record) : []);
const int = (value: unknown): number | null => (typeof value === 'number' && Number.isInteger(value) ? value : null);
const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const text = (value: unknown): string | null => (typeof value === 'string' ? value : null);
const failsafeOf = (value: unknown): NonNullable<Failsafe> | null =>
  typeof value === 'number' || value === 'hold' || value === 'off' ? value : null;

function statusOf(base: unknown, current: unknown, compared: boolean): PlanStatus {
  if (!compared || base === undefined) return 'new';
  return canonicalJson(base) === canonicalJson(current) ? 'same' : 'changed';
}

const byKey = (entries: Loose[], key: string) => {
  const map = new Map<string, Loose>();
  for (const entry of entries) {
    const value = entry[key];
    if (typeof value === 'number' || typeof value === 'string') map.set(String(value), entry);
  }
  return map;
};

const withoutMap = ({ map: _map, ...rest }: Loose) => rest;

/** The reviewed document as a plan, marked against `base` (null: a first review, all new). */
export function reviewPlan(document: unknown, base: unknown): ReviewPlan {
  const compared = base !== null && base !== undefined;
  const doc = record(document);
  const old = record(base);
  const functions = new Map(list(doc.channels).map((channel) => [int(channel.ch), text(channel.function)]));

  const oldChannels = byKey(list(old.channels), 'ch');
  const oldMixes = byKey(list(old.mixes), 'id');
  const oldReceivers = byKey(list(old.receivers), 'id');
  const removed: ReviewPlan['removed'] = [];

  const channels = list(doc.channels)
    .filter((channel) => int(channel.ch) !== null)
    .sort((a, b) => int(a.ch)! - int(b.ch)!)
    .map((channel) => ({
      path: `channels[ch=${int(channel.ch)}]`,
      status: statusOf(oldChannels.get(String(channel.ch)), channel, compared),
      ch: int(channel.ch)!,
      function: text(channel.function),
      role: text(channel.role),
      reverse: record(channel.travel).reverse === true,
    }));
  const mixes = list(doc.mixes)
    .filter((mix) => text(mix.id) !== null)
    .map((mix) => ({
      path: `mixes[id=${text(mix.id)}]`,
      status: statusOf(oldMixes.get(text(mix.id)!), mix, compared),
      id: text(mix.id)!,
      from: text(mix.from),
      to: int(mix.to),
      expo: num(mix.expo),
      rates: Array.isArray(record(mix.rates).weights)
        ? (record(mix.rates).weights as unknown[]).flatMap((weight) => (num(weight) === null ? [] : [num(weight)!]))
        : null,
    }));
  const receivers = list(doc.receivers)
    .filter((receiver) => text(receiver.id) !== null)
    .map((receiver) => {
      const id = text(receiver.id)!;
      const before = oldReceivers.get(id);
      const oldPins = byKey(list(before?.map), 'pin');
      const pins = list(receiver.map)
        .filter((entry) => int(entry.pin) !== null)
        .sort((a, b) => int(a.pin)! - int(b.pin)!)
        .map((entry) => {
          const failsafe = failsafeOf(entry.failsafe);
          const ch = int(entry.ch);
          return {
            path: `receivers[id=${id}].map[pin=${int(entry.pin)}]`,
            status: statusOf(oldPins.get(String(entry.pin)), entry, compared && before !== undefined),
            pin: int(entry.pin)!,
            ch,
            function: ch === null ? null : (functions.get(ch) ?? null),
            failsafe,
            link_loss: sheetLinkLoss(failsafe ?? undefined),
          };
        });
      const kept = new Set(pins.map((pin) => String(pin.pin)));
      for (const [pin] of oldPins)
        if (!kept.has(pin) && before)
          removed.push({ path: `receivers[id=${id}].map[pin=${pin}]`, words: `Pin ${pin} of ${id}` });
      return {
        path: `receivers[id=${id}]`,
        status: statusOf(before ? withoutMap(before) : undefined, withoutMap(receiver), compared),
        id,
        label: text(receiver.label),
        role: text(receiver.role) ?? 'primary',
        outputs: int(receiver.outputs),
        telemetry: receiver.telemetry !== false,
        pins,
      };
    });

  if (compared) {
    const now = {
      channels: new Set(channels.map((channel) => String(channel.ch))),
      mixes: new Set(mixes.map((mix) => mix.id)),
      receivers: new Set(receivers.map((receiver) => receiver.id)),
    };
    for (const [ch] of oldChannels)
      if (!now.channels.has(ch)) removed.push({ path: `channels[ch=${ch}]`, words: `Channel ${ch}` });
    for (const [id] of oldMixes) if (!now.mixes.has(id)) removed.push({ path: `mixes[id=${id}]`, words: `Mix ${id}` });
    for (const [id] of oldReceivers)
      if (!now.receivers.has(id)) removed.push({ path: `receivers[id=${id}]`, words: `Receiver ${id}, with its pins` });
  }

  return {
    compared,
    link: { path: 'link', status: statusOf(old.link, doc.link, compared), channels: int(record(doc.link).channels) },
    channels,
    mixes,
    receivers,
    removed,
  };
}
