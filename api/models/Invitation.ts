import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { ROLES, type Role } from '@shared/contract/roles';
import type { User } from './User';
import type { Workspace } from './Workspace';

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired';

/**
 * An invitation to join a workspace with a role. The e-mailed link carries a signed
 * token naming this row; the row makes the token single-use (accepted_at) and
 * revocable (revoked_at).
 */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare email: string;
  declare role: Role;
  declare invitedBy: ForeignKey<User['id']>;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedBy: CreationOptional<string | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare workspace?: NonAttribute<Workspace>;
  declare inviter?: NonAttribute<User>;

  statusAt(now: Date): InvitationStatus {
    if (this.acceptedAt) return 'accepted';
    if (this.revokedAt) return 'revoked';
    return this.expiresAt.getTime() <= now.getTime() ? 'expired' : 'pending';
  }

  static initModel(sequelize: Sequelize): void {
    Invitation.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        email: {
          type: DataTypes.TEXT,
          allowNull: false,
          set(value: string) {
            this.setDataValue('email', value.trim().toLowerCase());
          },
        },
        role: { type: DataTypes.TEXT, allowNull: false, validate: { isIn: [[...ROLES]] } },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        acceptedBy: { type: DataTypes.UUID, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations', modelName: 'Invitation', underscored: true },
    );
  }
}
