import type { Sequelize } from 'sequelize';
import { Membership } from './Membership';
import { User } from './User';
import { Workspace } from './Workspace';

export { Membership, User, Workspace };

let boundTo: Sequelize | null = null;

// Model classes are module-wide, so a process binds them to one Sequelize instance
// (one per test file, since vitest isolates files).
export function initModels(sequelize: Sequelize): void {
  if (boundTo === sequelize) return;
  if (boundTo) throw new Error('The models are already bound to another Sequelize instance in this process.');
  User.initModel(sequelize);
  Workspace.initModel(sequelize);
  Membership.initModel(sequelize);

  User.hasMany(Membership, { as: 'memberships', foreignKey: 'userId' });
  Workspace.hasMany(Membership, { as: 'memberships', foreignKey: 'workspaceId' });
  Membership.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Membership.belongsTo(Workspace, { as: 'workspace', foreignKey: 'workspaceId' });
  boundTo = sequelize;
}
