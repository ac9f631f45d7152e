import type { Role } from '@shared/contract/roles';
import { needsRole, type Decision } from './decision';

// The shelf: everyone in the workspace reads it; editors and owners add units, change
// their records, install, remove and record applied settings.
export const RECEIVER_POLICY = {
  read: 'viewer',
  write: 'editor',
} as const satisfies Record<string, Role>;

export type ReceiverAction = keyof typeof RECEIVER_POLICY;

export function receiverPolicy(role: Role | null, action: ReceiverAction): Decision {
  return needsRole(role, RECEIVER_POLICY[action]);
}
