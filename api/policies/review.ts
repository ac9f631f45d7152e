import type { Role } from '@shared/contract/roles';
import { needsRole, type Decision } from './decision';

// What each action on reviews needs. Everyone reads reviews; editors (and owners) ask
// for them; reviewers and above give verdicts, tick the checklist and comment. Who may
// approve a particular revision (not its own author) is a sign-off rule: api/reviews/.
export const REVIEW_POLICY = {
  read: 'viewer',
  request: 'editor',
  verdict: 'reviewer',
  tick: 'reviewer',
  comment: 'reviewer',
} as const satisfies Record<string, Role>;

export type ReviewAction = keyof typeof REVIEW_POLICY;

export function reviewPolicy(role: Role | null, action: ReviewAction): Decision {
  return needsRole(role, REVIEW_POLICY[action]);
}
