import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Membership, User, Workspace } from '@api/models';

export const DEMO_SETUP = readFileSync(
  fileURLToPath(new URL('../../../fixtures/valid/scale-16-channel-two-receivers.yaml', import.meta.url)),
  'utf8',
);

/** An editor and a workspace of their own to save in; the password is never used. */
export async function benchPilot(): Promise<{ user: User; workspace: Workspace }> {
  const user = await User.create({
    email: `bench-${randomBytes(4).toString('hex')}@bench.example`,
    name: 'Bench Pilot',
    passwordHash: 'not-a-password-hash',
  });
  const workspace = await Workspace.create({ name: 'Bench field' });
  await Membership.create({ workspaceId: workspace.id, userId: user.id, role: 'editor' });
  return { user, workspace };
}

/** The demo setup with one value changed, so that each save stores new content. */
export const demoVariant = (index: number): string => DEMO_SETUP.replace('weight_g: 6200', `weight_g: ${6200 + index}`);
