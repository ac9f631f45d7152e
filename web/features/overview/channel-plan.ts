import type { Finding } from '@shared/findings';

// The channel plan as the Overview draws it: one row per channel, the functions
// planned on it, the receiver pins carrying it, and the marks the checks gave it. The
// marks come from the revision's findings, so the picture says exactly what the checks
// say; the document is read loosely because a revision with schema errors is still shown.

export type Failsafe = number | 'hold' | 'off' | null;

// `finding` stands for any other open finding about the channel, its mixes or the pins
// carrying it (a failsafe at the surface's stop, say), so no row with one reads "clear";
// `accepted` for one the pilot accepted with a reason.
export type MarkKind = 'shared' | 'unrouted' | 'beyond-link' | 'no-function' | 'finding' | 'accepted';

export interface ChannelMark {
  kind: MarkKind;
  /** The finding the mark stands for. */
  finding: Finding;
}

export interface PlannedFunction {
  function: string;
  role: string | null;
  side: string | null;
}

export interface CarryingPin {
  pin: number;
  failsafe: Failsafe;
}

export interface PlanRow {
  ch: number;
  functions: PlannedFunction[];
  /** Pins carrying this channel, by receiver id. */
  pins: Record<string, CarryingPin[]>;
  beyondLink: boolean;
  marks: ChannelMark[];
}

export interface PlanReceiver {
  id: string;
  label: string | null;
  role: 'primary' | 'secondary';
  outputs: number | null;
  telemetry: boolean;
  /** Every map entry of the receiver, by pin. */
  map: { pin: number; ch: number; failsafe: Failsafe }[];
}

export interface ChannelPlan {
  /** Channels the link carries; null when the document does not say. */
  linkChannels: number | null;
  receivers: PlanReceiver[];
  rows: PlanRow[];
}

const MAX_CHANNEL = 32;

const record = (value: unknown): Record<string, unknown> =>
  value && typeof value === 'object' && !Array.isArray(value) ? (value as Record<string, unknown>) : {};
const list = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);
const int = (value: unknown): number | null => (typeof value === 'number' && Number.isInteger(value) ? value : null);
const text = (value: unknown): string | null => (typeof value === 'string' ? value : null);
const failsafeOf = (value: unknown): Failsafe =>
  typeof value === 'number' || value === 'hold' || value === 'off' ? value : null;

function readReceivers(document: Record<string, unknown>): PlanReceiver[] {
  return list(document.receivers).flatMap((item, index) => {
    const receiver = record(item);
    const id = text(receiver.id) ?? `receiver-${index + 1}`;
    const map = list(receiver.map).flatMap((entry) => {
      const { pin, ch, failsafe } = record(entry);
      const [p, c] = [int(pin), int(ch)];
      return p === null || c === null ? [] : [{ pin: p, ch: c, failsafe: failsafeOf(failsafe) }];
    });
    return [
      {
        id,
        label: text(receiver.label),
        role: receiver.role === 'secondary' ? 'secondary' : 'primary',
        outputs: int(receiver.outputs),
        telemetry: receiver.telemetry !== false,
        map: map.sort((a, b) => a.pin - b.pin),
      },
    ];
  });
}

const pathChannel = /^channels\[ch=(\d+)\]/;
const pathMix = /^mixes\[id=([^\]]+)\]/;
const pathPin = /^receivers\[id=([^\]]+)\]\.map\[pin=(\d+)\]/;

/** The channel a finding is about, from its semantic path. */
function channelOfFinding(
  finding: Finding,
  document: Record<string, unknown>,
  receivers: PlanReceiver[],
): number | null {
  const channel = pathChannel.exec(finding.path);
  if (channel) return Number(channel[1]);
  const pin = pathPin.exec(finding.path);
  if (pin)
    return (
      receivers.find((receiver) => receiver.id === pin[1])?.map.find((entry) => entry.pin === Number(pin[2]))?.ch ??
      null
    );
  const mix = pathMix.exec(finding.path);
  if (mix)
    return int(
      list(document.mixes)
        .map(record)
        .find((entry) => entry.id === mix[1])?.to,
    );
  return null;
}

const MARK_OF_RULE: Record<string, MarkKind> = {
  'channel-shared': 'shared',
  'function-unrouted': 'unrouted',
  'channel-beyond-link': 'beyond-link',
  'pin-undriven': 'no-function',
};

export function buildChannelPlan(document: unknown, findings: readonly Finding[]): ChannelPlan {
  const root = record(document);
  const linkChannels = int(record(root.link).channels);
  const receivers = readReceivers(root);
  const planned = list(root.channels).flatMap((item) => {
    const entry = record(item);
    const ch = int(entry.ch);
    const name = text(entry.function);
    return ch === null
      ? []
      : [{ ch, function: name ?? `channel ${ch}`, role: text(entry.role), side: text(entry.side) }];
  });

  const used = [
    ...planned.map((entry) => entry.ch),
    ...receivers.flatMap((receiver) => receiver.map.map((entry) => entry.ch)),
  ];
  const last = Math.min(MAX_CHANNEL, Math.max(linkChannels ?? 0, ...used.filter((ch) => ch >= 1), 0));

  const rows: PlanRow[] = [];
  for (let ch = 1; ch <= last; ch++) {
    const pins: Record<string, CarryingPin[]> = {};
    for (const receiver of receivers) {
      pins[receiver.id] = receiver.map
        .filter((entry) => entry.ch === ch)
        .map(({ pin, failsafe }) => ({ pin, failsafe }));
    }
    rows.push({
      ch,
      functions: planned
        .filter((entry) => entry.ch === ch)
        .map((entry) => ({ function: entry.function, role: entry.role, side: entry.side })),
      pins,
      beyondLink: linkChannels !== null && ch > linkChannels,
      marks: [],
    });
  }

  const rank = { error: 0, warning: 1, info: 2 } as const;
  for (const finding of findings) {
    const kind: MarkKind = finding.accepted !== undefined ? 'accepted' : (MARK_OF_RULE[finding.rule] ?? 'finding');
    const ch = channelOfFinding(finding, root, receivers);
    const row = rows.find((candidate) => candidate.ch === ch);
    if (!row) continue;
    const same = row.marks.findIndex((mark) => mark.kind === kind);
    // One mark of a kind per row, standing for the worst finding of that kind.
    if (same < 0) row.marks.push({ kind, finding });
    else if (rank[finding.severity] < rank[row.marks[same].finding.severity]) row.marks[same] = { kind, finding };
  }
  return { linkChannels, receivers, rows };
}

/** The words a mark is shown with, beside its icon. */
export const MARK_WORDS: Record<MarkKind, string> = {
  shared: 'Conflict: shared channel',
  unrouted: 'Unrouted: on no pin',
  'beyond-link': 'Beyond the link',
  'no-function': 'No function planned',
  finding: 'Error, Warning or Note',
  accepted: 'Accepted',
};

export function failsafeText(failsafe: Failsafe): string {
  if (failsafe === null) return 'not set';
  if (failsafe === 'hold') return 'hold';
  if (failsafe === 'off') return 'off (no pulses)';
  return `${failsafe} µs`;
}
