import { roleAtLeast, type Role } from '@shared/contract/roles';

/**
 * What a policy answers. A caller with no role in the record's workspace is told
 * nothing about it (the route answers 404, as if it did not exist); a role too low is
 * refused with the role it needs (403).
 */
export type Decision =
  | { allowed: true }
  | { allowed: false; reason: 'not-member' }
  | { allowed: false; reason: 'role-too-low'; required: Role; role: Role };

/** The decision for a caller with `role` (null: not a member) where `required` or higher is needed. */
export function needsRole(role: Role | null, required: Role): Decision {
  if (role === null) return { allowed: false, reason: 'not-member' };
  return roleAtLeast(role, required) ? { allowed: true } : { allowed: false, reason: 'role-too-low', required, role };
}
