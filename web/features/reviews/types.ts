// Shapes the review routes answer with (api/presenters/review.ts, api/queries/review-views.ts).
import type { Comparison } from '@shared/diff';
import type { Finding } from '@shared/findings';
import type { Id } from '../../types/api';
import type { ReviewState, RevisionSummary } from '../models/types';

export type ReviewRequestState = 'open' | 'approved' | 'changes-requested';
export type Verdict = 'approve' | 'request-changes' | 'comment';

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

export interface ChecklistEntry {
  id: string;
  label: string;
  detail: string;
  source: { label: string; title: string } | null;
  basis: string | null;
  ticked: boolean;
  ticked_by: Person | null;
  ticked_at: string | null;
}

export interface VerdictEntry {
  id: Id;
  reviewer: Person | null;
  verdict: Verdict;
  body: string;
  content_hash: string;
  created_at: string;
}

export interface CommentEntry {
  id: Id;
  review_id: Id | null;
  path: string | null;
  body: string;
  author: Person | null;
  revision: { id: Id; number: number | null };
  /** Made on an earlier revision and shown because its path still exists. */
  carried: boolean;
  created_at: string;
}

export interface ReviewDetail extends Omit<ReviewSummary, 'revision'> {
  revision: RevisionSummary;
  findings: Finding[];
  base: { kind: 'approved' | 'parent' | 'fork-source'; revision: RevisionSummary } | null;
  compare: Comparison | null;
  checklist: ChecklistEntry[];
  verdicts: VerdictEntry[];
  comments: CommentEntry[];
  model_state: { review_state: ReviewState; cleared_for_maiden: boolean };
  can: {
    verdict: boolean;
    approve: boolean;
    approve_refusal: { code: string; message: string } | null;
    tick: boolean;
    comment: boolean;
  };
}
