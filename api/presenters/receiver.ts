import type { ReuseCheck } from '@shared/reuse/reuse-check';
import type { AuditEvent, Receiver, ReceiverInstall, Revision, SetupModel } from '../models';
import type {
  PresentedInstall,
  PresentedReceiver,
  PresentedReceiverEvent,
  PresentedReuseCheck,
  Readiness,
} from '@shared/contract/receiver';
import { presentAuthor } from './revision';

export type { PresentedInstall, PresentedReceiver, PresentedReceiverEvent, PresentedReuseCheck, Readiness };

const iso = (date: Date | null | undefined) => (date ? date.toISOString() : null);

const presentModelRef = (model: SetupModel | undefined, modelId: string) => ({
  id: modelId,
  name: model?.name ?? null,
});

export function presentInstall(install: ReceiverInstall): PresentedInstall {
  return {
    id: install.id,
    receiver_id: install.receiverId,
    model: presentModelRef(install.model, install.modelId),
    slot: install.slot,
    revision_id: install.revisionId,
    from: install.installedAt.toISOString(),
    to: iso(install.removedAt),
    installed_by: presentAuthor(install.installer),
    removed_by: presentAuthor(install.remover),
  };
}

export interface ReceiverView {
  /** The open install, with its model loaded. */
  install: ReceiverInstall | null;
  readiness?: Readiness | null;
}

export function presentReceiver(receiver: Receiver, view: ReceiverView): PresentedReceiver {
  const install = view.install;
  return {
    id: receiver.id,
    workspace_id: receiver.workspaceId,
    label: receiver.label,
    mark: receiver.mark ?? null,
    mark_colour: receiver.markColour ?? null,
    outputs: receiver.outputs,
    notes: receiver.notes,
    short_code: receiver.shortCode,
    stored_settings: receiver.storedSettings ?? null,
    settings_recorded_at: iso(receiver.settingsRecordedAt),
    telemetry: receiver.storedSettings ? receiver.storedSettings.telemetry : null,
    status: install ? ('installed' as const) : ('free' as const),
    installed: install
      ? {
          install_id: install.id,
          model: presentModelRef(install.model, install.modelId),
          slot: install.slot,
          since: install.installedAt.toISOString(),
        }
      : null,
    readiness: view.readiness ?? null,
    created_at: receiver.createdAt.toISOString(),
    updated_at: receiver.updatedAt.toISOString(),
  };
}

/**
 * The reuse check as the API answers it: the contract's `changes` and `ready`, what
 * they were found against, and which unit holds the slot now (`holder`, null when free).
 */
export function presentReuseCheck(
  receiver: Receiver,
  model: SetupModel,
  revision: Revision,
  check: ReuseCheck,
  install: ReceiverInstall | null,
  holder: Pick<Receiver, 'id' | 'label'> | null = null,
): PresentedReuseCheck {
  return {
    receiver_id: receiver.id,
    model: { id: model.id, name: model.name },
    revision: { id: revision.id, number: revision.number, content_hash: revision.contentHash },
    slot: check.slot,
    changes: check.changes,
    ready: check.ready,
    notes: check.notes,
    findings: check.findings,
    target: check.target,
    installed_here: Boolean(install && install.modelId === model.id && install.slot === check.slot.id),
    holder: holder ? { id: holder.id, label: holder.label } : null,
  };
}

export function presentReceiverEvent(event: AuditEvent): PresentedReceiverEvent {
  return {
    id: event.id,
    action: event.action,
    actor: presentAuthor(event.actor),
    details: event.details,
    at: event.createdAt.toISOString(),
  };
}
