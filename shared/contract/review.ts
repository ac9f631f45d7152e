// Reviews as the API answers them (api/presenters/review.ts, api/queries/review-views.ts),
// written once for the server's presenters, the screens and the tests.
import type { Comparison } from '../diff';
import type { ReviewPlan } from '../diff/review-plan';
import type { Finding } from '../findings';
import type { Id, RevisionSummary } from './model';
import type { ReviewState } from './review-state';

export type { ReviewPlan };

export const REVIEW_REQUEST_STATES = ['open', 'approved', 'changes-requested'] as const;
export type ReviewRequestState = (typeof REVIEW_REQUEST_STATES)[number];

export const VERDICTS = ['approve', 'request-changes', 'comment'] as const;
export type Verdict = (typeof VERDICTS)[number];

export interface Person {
  id: Id;
  name: string;
}

export interface ReviewSummary {
  id: Id;
  workspace_id: Id;
  model: { id: Id; name: string };
  revision: {
    id: Id;
    number: number;
    content_hash: string;
    error_count: number;
    warning_count: number;
    author: Person | null;
  };
  requested_by: Person | null;
  reviewers: Person[];
  note: string;
  state: ReviewRequestState;
  decided_at: string | null;
  created_at: string;
  verdict_count: number;
  /** The model's latest revision, and whether it still has the reviewed content. */
  latest: { id: Id; number: number; same_content: boolean } | null;
}

/** A tick brought over from the review of an earlier revision, and why it still holds. */
export interface CarriedTick {
  review_id: Id;
  revision_number: number | null;
  reason: string;
}

export interface ChecklistEntry {
  id: string;
  label: string;
  detail: string;
  source: { label: string; title: string } | null;
  basis: string | null;
  /** The parts of the setup the item covers, in words; null when it covers none (checked before each flight). */
  covers: string | null;
  ticked: boolean;
  ticked_by: Person | null;
  ticked_at: string | null;
  carried: CarriedTick | null;
}

/** What an approval was given with, left undone, as the approver confirmed it. */
export interface LeftOpen {
  unticked: { id: string; label: string }[];
  warnings: { rule: string; path: string; message: string }[];
}

export interface VerdictEntry {
  id: Id;
  reviewer: Person | null;
  verdict: Verdict;
  body: string;
  content_hash: string;
  /** Set on an approval given with unticked items or open warnings. */
  left_open: LeftOpen | null;
  created_at: string;
}

export interface CommentReply {
  id: Id;
  body: string;
  author: Person | null;
  created_at: string;
}

/** A thread: its first comment (anchored to a setting, or on the whole revision) and the replies. */
export interface CommentThread {
  id: Id;
  review_id: Id | null;
  path: string | null;
  body: string;
  author: Person | null;
  revision: { id: Id; number: number | null };
  /** Started on an earlier revision and shown here because its setting still exists. */
  carried: boolean;
  created_at: string;
  replies: CommentReply[];
  resolved: { by: Person | null; at: string } | null;
}

export type CommentStatus = 'open' | 'resolved' | 'all';

/**
 * How many threads a revision shows, for a page that lists them through the paged
 * comments route: open and resolved, and the setting path of each open anchored thread
 * (repeated per thread) so a plan can count them per setting.
 */
export interface ThreadCounts {
  open: number;
  resolved: number;
  open_paths: string[];
}

/** Which revision a review compares with: the last approved, the one before, one chosen, or none (all new). */
export type ReviewBaseKind = 'approved' | 'previous' | 'chosen' | 'none';

export interface ReviewDetail extends Omit<ReviewSummary, 'revision'> {
  revision: RevisionSummary;
  findings: Finding[];
  base: { kind: Exclude<ReviewBaseKind, 'none'>; revision: RevisionSummary } | null;
  /** The bases the page offers by name; a chosen revision is any other of the model's. */
  base_options: { approved: { id: Id; number: number } | null; previous: { id: Id; number: number } | null };
  compare: Comparison | null;
  /** The whole setup, each entry marked new, changed or the same against the base. */
  plan: ReviewPlan;
  checklist: ChecklistEntry[];
  verdicts: VerdictEntry[];
  /** The threads themselves are read a page at a time from `GET /api/revisions/:id/comments`. */
  threads: ThreadCounts;
  model_state: { review_state: ReviewState; cleared_for_maiden: boolean };
  can: {
    verdict: boolean;
    approve: boolean;
    approve_refusal: { code: string; message: string } | null;
    tick: boolean;
    comment: boolean;
  };
}

/** The last approved revision of a model and who approved it, for the hangar and the save dialog. */
export interface ApprovedRevision {
  id: Id;
  number: number;
  approvers: Person[];
  decided_at: string;
}
