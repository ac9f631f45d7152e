// Shapes the review routes answer with, written once in shared/contract/review.ts.
export type {
  CarriedTick,
  ChecklistEntry,
  CommentReply,
  CommentStatus,
  CommentThread,
  LeftOpen,
  Person,
  ReviewBaseKind,
  ReviewDetail,
  ReviewPlan,
  ReviewRequestState,
  ReviewSummary,
  ThreadCounts,
  Verdict,
  VerdictEntry,
} from '@shared/contract/review';

/** What the review page compares with: a kind by name or a revision by number; absent, the page's default. */
export type BaseParam = 'approved' | 'previous' | 'none' | `${number}` | null;
