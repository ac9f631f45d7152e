import type { Role } from '@shared/contract/roles';
import { needsRole, type Decision } from './decision';

// What each action on models and revisions needs, in one place. Viewers and reviewers
// read everything; editors and owners change models and their histories; the audit
// trail is for owners.
export const MODEL_POLICY = {
  read: 'viewer',
  create: 'editor',
  edit: 'editor',
  // Threads on a revision outside a review, as in a review (REVIEW_POLICY.comment).
  comment: 'reviewer',
  audit: 'owner',
} as const satisfies Record<string, Role>;

export type ModelAction = keyof typeof MODEL_POLICY;

export function modelPolicy(role: Role | null, action: ModelAction): Decision {
  return needsRole(role, MODEL_POLICY[action]);
}
