import { hashPassword } from '../../auth/passwords';
import { Membership, User, Workspace } from '../../models';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_WORKSPACE_NAME } from '../demo-data';
import type { SeedContext } from '../index';

/** The demo club's workspace and its four members. */
export async function run({ sequelize }: SeedContext): Promise<void> {
  const hashes = await Promise.all(DEMO_ACCOUNTS.map(() => hashPassword(DEMO_PASSWORD)));
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.create({ name: DEMO_WORKSPACE_NAME }, { transaction });
    for (const [index, account] of DEMO_ACCOUNTS.entries()) {
      const [user] = await User.findOrCreate({
        where: { email: account.email },
        defaults: { email: account.email, name: account.name, passwordHash: hashes[index] },
        transaction,
      });
      await Membership.create({ workspaceId: workspace.id, userId: user.id, role: account.role }, { transaction });
    }
  });
}
