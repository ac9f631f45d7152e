import type { Channel, Control, Mix, PinMapEntry, Receiver, Setup } from '../format/schema';
import { controlsById } from '../evaluate/control-value';
import { controlReferences, type ControlReference } from './control-references';

export interface Carrier {
  receiver: Receiver;
  receiverIndex: number;
  entry: PinMapEntry;
  entryIndex: number;
}

export interface PlannedChannel {
  channel: Channel;
  index: number;
}

/** Lookups shared by the checks, built once per run. */
export interface CheckContext {
  /** The first control of each id. */
  controls: Map<string, Control>;
  /** Plan entries by channel number (more than one when `channel-shared`). */
  planned: Map<number, PlannedChannel[]>;
  /** Mixes by target channel, with their index in `mixes`. */
  mixesByTarget: Map<number, { mix: Mix; index: number }[]>;
  /** Receiver pins by the channel they carry. */
  carriers: Map<number, Carrier[]>;
  /** Every place that names a control. */
  references: ControlReference[];
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

export function buildContext(setup: Setup): CheckContext {
  const planned = new Map<number, PlannedChannel[]>();
  setup.channels.forEach((channel, index) => push(planned, channel.ch, { channel, index }));
  const mixesByTarget = new Map<number, { mix: Mix; index: number }[]>();
  setup.mixes.forEach((mix, index) => push(mixesByTarget, mix.to, { mix, index }));
  const carriers = new Map<number, Carrier[]>();
  setup.receivers.forEach((receiver, receiverIndex) =>
    receiver.map.forEach((entry, entryIndex) =>
      push(carriers, entry.ch, { receiver, receiverIndex, entry, entryIndex }),
    ),
  );
  return {
    controls: controlsById(setup.controls),
    planned,
    mixesByTarget,
    carriers,
    references: controlReferences(setup),
  };
}

/** "channel 8 (flap-right)", or "channel 8" when nothing is planned on it. */
export function channelName(ctx: CheckContext, ch: number): string {
  const entries = ctx.planned.get(ch);
  if (!entries || entries.length === 0) return `channel ${ch}`;
  return `channel ${ch} (${entries.map((entry) => entry.channel.function).join(', ')})`;
}

/** Joins names as "a", "a and b", "a, b and c". */
export function listNames(names: readonly string[]): string {
  if (names.length <= 1) return names.join('');
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

export function capitalize(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
