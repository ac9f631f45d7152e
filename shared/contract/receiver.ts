// The shelf's shapes as the API answers them: written once here, the server's
// presenters are typed against them and the client reads them.
import type { ReuseCheck } from '../reuse/reuse-check';
import type { MarkColour } from '../reuse/receiver-fields';
import type { StoredSettings } from '../reuse/stored-settings';

export interface AuthorRef {
  id: string;
  name: string;
}

export interface ModelRef {
  id: string;
  /** null when the model could not be loaded with the record. */
  name: string | null;
}

/** How an installed unit stands against its slot in the model's latest revision. */
export interface Readiness {
  /** ready: nothing to change; changes: settings to program; blocked: cannot fly there; unchecked: no valid slot to check against. */
  state: 'ready' | 'changes' | 'blocked' | 'unchecked';
  changes: number;
  revision: { id: string; number: number } | null;
  /** Why the check could not run, when unchecked. */
  reason: string | null;
}

export interface PresentedInstall {
  id: string;
  receiver_id: string;
  model: ModelRef;
  slot: string;
  revision_id: string | null;
  from: string;
  to: string | null;
  installed_by: AuthorRef | null;
  removed_by: AuthorRef | null;
}

export interface PresentedReceiver {
  id: string;
  workspace_id: string;
  label: string;
  mark: string | null;
  mark_colour: MarkColour | null;
  outputs: number;
  notes: string;
  /** Six characters printed on the unit's label; the shelf's search finds it. */
  short_code: string;
  stored_settings: StoredSettings | null;
  settings_recorded_at: string | null;
  telemetry: boolean | null;
  status: 'installed' | 'free';
  installed: { install_id: string; model: ModelRef; slot: string; since: string } | null;
  readiness: Readiness | null;
  created_at: string;
  updated_at: string;
}

/** The reuse check: the contract's `changes` and `ready`, what they were found against, and who holds the slot now. */
export interface PresentedReuseCheck {
  receiver_id: string;
  model: { id: string; name: string };
  revision: { id: string; number: number; content_hash: string };
  slot: ReuseCheck['slot'];
  changes: ReuseCheck['changes'];
  ready: boolean;
  notes: ReuseCheck['notes'];
  findings: ReuseCheck['findings'];
  target: ReuseCheck['target'];
  installed_here: boolean;
  holder: { id: string; label: string } | null;
}

export interface PresentedReceiverEvent {
  id: string;
  action: string;
  actor: AuthorRef | null;
  details: Record<string, unknown>;
  at: string;
}
