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
import type { MarkColour } from '@shared/reuse/receiver-fields';
import type { StoredSettings } from '@shared/reuse/stored-settings';
import type { ReceiverInstall } from './ReceiverInstall';
import type { User } from './User';
import type { Workspace } from './Workspace';

/** A physical receiver on a workspace's shelf, with the settings it was last known to hold. */
export class Receiver extends Model<InferAttributes<Receiver>, InferCreationAttributes<Receiver>> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare label: string;
  declare mark: CreationOptional<string | null>;
  declare markColour: CreationOptional<MarkColour | null>;
  declare outputs: number;
  declare notes: CreationOptional<string>;
  /** Printed on the unit's label; the database gives each new unit one (migration 0060). */
  declare shortCode: CreationOptional<string>;
  /** Null when the unit's settings were never recorded. */
  declare storedSettings: CreationOptional<StoredSettings | null>;
  declare settingsRecordedAt: CreationOptional<Date | null>;
  declare createdBy: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare installs?: NonAttribute<ReceiverInstall[]>;

  static initModel(sequelize: Sequelize): void {
    Receiver.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        label: { type: DataTypes.TEXT, allowNull: false },
        mark: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        markColour: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        outputs: { type: DataTypes.INTEGER, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        // Left to the database's trigger on insert; the column is NOT NULL there.
        shortCode: { type: DataTypes.TEXT },
        storedSettings: { type: DataTypes.JSONB, allowNull: true, defaultValue: null },
        settingsRecordedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'receivers', modelName: 'Receiver', underscored: true },
    );
  }
}
