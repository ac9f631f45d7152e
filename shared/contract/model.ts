// Models and revisions as the API answers them (docs/design.md, API contract), written
// once: the server's presenters are typed against these, the client and its test fakes
// read them.
import type { Finding } from '../findings';
import type { ApprovedRevision } from './review';
import type { ReviewState } from './review-state';
import type { Role } from './roles';

export type { ReviewState };

/** Records are keyed by UUID. */
export type Id = string;

export type RevisionOrigin = 'create' | 'save' | 'upload' | 'revert' | 'fork' | 'merge';

export interface Author {
  id: Id;
  name: string;
}

/** The latest revision as the hangar and the model page show it. */
export interface LatestRevision {
  id: Id;
  number: number;
  content_hash: string;
  error_count: number;
  warning_count: number;
  info_count: number;
  message: string;
  created_at: string;
  author: Author | null;
}

/** Where a fork came from; the name and workspace are null when the caller may not read them. */
export interface ForkSource {
  revision_id: Id;
  number: number;
  model_id: Id;
  model_name: string | null;
  workspace_id: Id | null;
  readable: boolean;
}

export interface SetupModelView {
  id: Id;
  workspace_id: Id;
  name: string;
  airframe: string | null;
  forked_from_revision_id: Id | null;
  forked_from: ForkSource | null;
  created_by: Id;
  created_at: string;
  updated_at: string;
  /** Set while the model is archived: hidden from the hangar by default, never deleted. */
  archived_at: string | null;
  latest: LatestRevision | null;
  review_state: ReviewState;
  cleared_for_maiden: boolean;
  /** The revision cleared to fly (the latest approved one) and who approved it; null when none is. */
  approved: ApprovedRevision | null;
  /** The caller's role in the model's workspace. */
  role: Role;
}

/** A revision without its text: one entry of the history. */
export interface RevisionSummary {
  id: Id;
  model_id: Id;
  number: number;
  parent_id: Id | null;
  author: Author | null;
  message: string;
  content_hash: string;
  error_count: number;
  warning_count: number;
  info_count: number;
  origin: RevisionOrigin;
  source_revision_id: Id | null;
  tags: string[];
  created_at: string;
}

/** The model a revision belongs to, as `GET /api/revisions/:id` and the compare name it. */
export interface RevisionModelRef {
  id: Id;
  name: string;
  workspace_id: Id;
}

/** One revision in full: its exact YAML text, the parsed document and the findings. */
export interface Revision extends RevisionSummary {
  yaml: string;
  document: unknown;
  findings: Finding[];
  model?: RevisionModelRef;
}

/** What a save answers: the summary and the findings the checks gave. */
export interface SavedRevision extends RevisionSummary {
  findings: Finding[];
}

/** What creating, uploading or forking a model answers. */
export interface CreatedModel {
  model: SetupModelView;
  revision: SavedRevision;
}
