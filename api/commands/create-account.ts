import type { Sequelize } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import { hashPassword } from '../auth/passwords';
import { Conflict } from '../errors';
import { User, type Workspace } from '../models';
import { createWorkspace } from './create-workspace';

export interface NewAccount {
  email: string;
  name: string;
  password: string;
}

export const emailTaken = () =>
  new Conflict('An account with this e-mail address already exists.', {
    code: 'email-taken',
    details: { fields: { email: 'An account with this e-mail address already exists.' } },
  });

/** The user and a personal workspace they own, together or not at all. */
export async function createAccount(
  sequelize: Sequelize,
  input: NewAccount,
): Promise<{ user: User; workspace: Workspace }> {
  const passwordHash = await hashPassword(input.password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const user = await User.create({ email: input.email, name: input.name, passwordHash }, { transaction });
      const workspace = await createWorkspace(sequelize, {
        owner: user,
        name: `${input.name}'s workspace`,
        transaction,
      });
      return { user, workspace };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw emailTaken();
    throw error;
  }
}
