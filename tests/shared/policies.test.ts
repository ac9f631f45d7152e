import { describe, expect, it } from 'vitest';
import { ROLES } from '@shared/contract/roles';
import { modelPolicy, MODEL_POLICY } from '@api/policies/model';
import { receiverPolicy, RECEIVER_POLICY } from '@api/policies/receiver';
import { reviewPolicy, REVIEW_POLICY } from '@api/policies/review';
import { workspacePolicy, WORKSPACE_POLICY } from '@api/policies/workspace';
import { ROUTE_TABLE } from '@api/routes/route-table';

// The policies are pure functions of (role, action, record): called here with no
// database, no request and no server. The route table test (tests/api/route-table.test.ts)
// checks the same decisions through every route as every role.

describe('the policies', () => {
  it('allow the role an action needs and every role above it, and refuse the ones below', () => {
    const viewerCannotEdit = modelPolicy('viewer', 'edit');
    expect(viewerCannotEdit).toEqual({ allowed: false, reason: 'role-too-low', required: 'editor', role: 'viewer' });
    expect(modelPolicy('editor', 'edit')).toEqual({ allowed: true });
    expect(modelPolicy('owner', 'edit')).toEqual({ allowed: true });
    expect(reviewPolicy('reviewer', 'verdict')).toEqual({ allowed: true });
    expect(reviewPolicy('viewer', 'comment').allowed).toBe(false);
    expect(receiverPolicy('editor', 'write')).toEqual({ allowed: true });
    expect(workspacePolicy('editor', 'manage-team')).toMatchObject({ allowed: false, required: 'owner' });
  });

  it('tell a caller with no role in the workspace nothing but "not a member"', () => {
    expect(modelPolicy(null, 'read')).toEqual({ allowed: false, reason: 'not-member' });
    expect(reviewPolicy(null, 'read')).toEqual({ allowed: false, reason: 'not-member' });
    expect(workspacePolicy(null, 'remove-member', { userId: 'a', callerId: 'a' })).toEqual({
      allowed: false,
      reason: 'not-member',
    });
  });

  it('let any member leave, and only an owner remove someone else', () => {
    const self = { userId: 'juno', callerId: 'juno' };
    const other = { userId: 'wren', callerId: 'juno' };
    expect(workspacePolicy('viewer', 'remove-member', self)).toEqual({ allowed: true });
    expect(workspacePolicy('editor', 'remove-member', other)).toMatchObject({ allowed: false, required: 'owner' });
    expect(workspacePolicy('owner', 'remove-member', other)).toEqual({ allowed: true });
  });

  it('ask only for roles the route table knows', () => {
    const tableRoles = new Set(
      ROUTE_TABLE.map((entry) => entry.access).filter((access) => ROLES.includes(access as never)),
    );
    const policyRoles = new Set(
      [MODEL_POLICY, RECEIVER_POLICY, REVIEW_POLICY, WORKSPACE_POLICY].flatMap((table) => Object.values(table)),
    );
    expect([...policyRoles].filter((role) => !tableRoles.has(role))).toEqual([]);
  });
});
