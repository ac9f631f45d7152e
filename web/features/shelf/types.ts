// The shelf's shapes as the API answers them: written once in shared/contract, where the
// server's presenters are typed against them, so the two cannot drift.
import type {
  PresentedInstall,
  PresentedReceiver,
  PresentedReceiverEvent,
  PresentedReuseCheck,
  Readiness,
} from '@shared/contract/receiver';

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
