// The shelf's shapes as the API answers them (api/presenters/receiver.ts), typed from
// the server's own presenters so the two cannot drift.
import type {
  PresentedInstall,
  PresentedReceiver,
  PresentedReceiverEvent,
  PresentedReuseCheck,
  Readiness,
} from '../../../api/presenters/receiver';

export type ShelfUnit = PresentedReceiver;
export type UnitInstall = PresentedInstall;
export type UnitEvent = PresentedReceiverEvent;
export type UnitReadiness = Readiness;
export type ReuseCheckView = PresentedReuseCheck;

export type ShelfStatus = 'installed' | 'free';

export interface UnitHistory {
  installs: UnitInstall[];
  events: UnitEvent[];
}

/** What install answers: the reuse check in the new slot, the unit and the stay (and the one a move ended). */
export interface Installed extends ReuseCheckView {
  receiver: ShelfUnit;
  install: UnitInstall;
  moved_from: UnitInstall | null;
}

export interface Applied extends ReuseCheckView {
  receiver: ShelfUnit;
}
