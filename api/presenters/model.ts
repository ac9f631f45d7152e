import type { Revision, SetupModel } from '../models';
import type { ForkSource as PresentedForkSource, SetupModelView } from '@shared/contract/model';
import type { ApprovedRevision } from '@shared/contract/review';
import type { Role } from '@shared/contract/roles';
import { clearedForMaiden, type ReviewState } from '../review-state';
import { presentLatest } from './revision';

/** Where a fork came from; the source's name only when the caller may read its workspace. */
export interface ForkSource {
  revision: Revision;
  model: SetupModel;
  readable: boolean;
}

export interface ModelView {
  latest: Revision | null;
  reviewState: ReviewState;
  /** The caller's role in the model's workspace. */
  role: Role;
  forkedFrom?: ForkSource | null;
  /** The revision cleared to fly, when one is. */
  approved?: ApprovedRevision | null;
}

function presentForkSource(source: ForkSource | null | undefined): PresentedForkSource | null {
  if (!source) return null;
  return {
    revision_id: source.revision.id,
    number: source.revision.number,
    model_id: source.model.id,
    model_name: source.readable ? source.model.name : null,
    workspace_id: source.readable ? source.model.workspaceId : null,
    readable: source.readable,
  };
}

export function presentModel(model: SetupModel, view: ModelView): SetupModelView {
  return {
    id: model.id,
    workspace_id: model.workspaceId,
    name: model.name,
    airframe: model.airframe,
    forked_from_revision_id: model.forkedFromRevisionId ?? null,
    forked_from: presentForkSource(view.forkedFrom),
    created_by: model.createdBy,
    created_at: model.createdAt.toISOString(),
    updated_at: model.updatedAt.toISOString(),
    archived_at: model.archivedAt ? model.archivedAt.toISOString() : null,
    latest: view.latest ? presentLatest(view.latest) : null,
    review_state: view.reviewState,
    cleared_for_maiden: clearedForMaiden(view.reviewState),
    approved: view.approved ?? null,
    role: view.role,
  };
}

export type PresentedModel = SetupModelView;
