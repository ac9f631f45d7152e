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
import type { User } from './User';
import type { Workspace } from './Workspace';

/** Who did what to which record, for the workspace's owners to look back on. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare actorId: ForeignKey<User['id']> | null;
  /** e.g. `revision.saved`, `model.forked`, `tag.added` */
  declare action: string;
  declare subjectType: string;
  declare subjectId: string | null;
  declare details: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;

  declare actor?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        action: { type: DataTypes.TEXT, allowNull: false },
        subjectType: { type: DataTypes.TEXT, allowNull: false },
        subjectId: { type: DataTypes.UUID, allowNull: true },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'audit_events', modelName: 'AuditEvent', underscored: true, updatedAt: false },
    );
  }
}
