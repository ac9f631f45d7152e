// The field sheet as the API answers it (GET /api/models/:id/field-sheet), shared by
// the server that builds it and the screen and PDF that show it.
import type { Caution } from '../cautions';
import type { Finding, FindingCounts } from '../findings';
import type { Failsafe } from '../format/schema';
import type { MarkColour } from '../reuse/receiver-fields';
import type { ReviewState } from './review-state';

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
