// The field sheet as the API answers it (GET /api/models/:id/field-sheet), shared by
// the server that builds it and the screen and PDF that show it.
import type { Caution } from '../cautions';
import type { Finding, FindingCounts } from '../findings';
import type { Channel, Failsafe, Setup } from '../format/schema';
import type { MarkColour } from '../reuse/receiver-fields';
import type { ReviewState } from './review-state';

/**
 * What a pin does when its receiver loses the link (evaluation rule 9): its failsafe
 * pulse, the pulse it had (`hold`), no pulses (`off`), or the receiver's own default
 * (no failsafe set: the unit's setting, which the setup does not know).
 */
export interface SheetLinkLoss {
  kind: 'pulse' | 'held' | 'no-pulses' | 'receiver-default';
  /** The pulse for kind `pulse`; null otherwise. */
  pulse_us: number | null;
  words: string;
}

export interface SheetPin {
  pin: number;
  ch: number;
  /** The channel plan's function for that channel; null when the plan has none. */
  function: string | null;
  role: string | null;
  failsafe: Failsafe | null;
  link_loss: SheetLinkLoss;
}

/** A channel's cut: which switch, in which position, holds the channel at which value. */
export interface SheetCut {
  control: string;
  /** The switch's label in the setup, when it has one. */
  control_label: string | null;
  position: number;
  /** Percent. */
  value: number;
  /** The cut in one line, as the screen and the PDF print it. */
  words: string;
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
  channels: {
    ch: number;
    function: string;
    role: string;
    side: string | null;
    reverse: boolean;
    cut: SheetCut | null;
  }[];
  receivers: SheetReceiver[];
  receiver_supply: string | null;
  counts: FindingCounts;
  /** Errors and warnings, to be read before flying. */
  findings: Finding[];
  cautions: { heading: string; items: readonly Caution[] };
}

const signed = (value: number) => `${value > 0 ? '+' : ''}${value}`;

/** The cut named in full: "Arm (guarded) (motor-arm) at position 0 holds it at -100 %". */
export function sheetCut(cut: NonNullable<Channel['cut']>, setup: Pick<Setup, 'controls'>): SheetCut {
  const label = setup.controls.find((control) => control.id === cut.control)?.label ?? null;
  const name = label ? `${label} (${cut.control})` : cut.control;
  return {
    control: cut.control,
    control_label: label,
    position: cut.position,
    value: cut.value,
    words: `${name} at position ${cut.position} holds it at ${signed(cut.value)} %`,
  };
}

/** What the pin does when its receiver loses the link, by evaluation rule 9. */
export function sheetLinkLoss(failsafe: Failsafe): SheetLinkLoss {
  if (typeof failsafe === 'number') return { kind: 'pulse', pulse_us: failsafe, words: `${failsafe} µs` };
  if (failsafe === 'hold') return { kind: 'held', pulse_us: null, words: 'held' };
  if (failsafe === 'off') return { kind: 'no-pulses', pulse_us: null, words: 'no pulses' };
  return { kind: 'receiver-default', pulse_us: null, words: 'receiver default' };
}
