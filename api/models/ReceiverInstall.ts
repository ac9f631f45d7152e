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
import type { Receiver } from './Receiver';
import type { Revision } from './Revision';
import type { SetupModel } from './SetupModel';
import type { User } from './User';

/** One stay of a receiver in a model's receiver slot; open (removedAt null) while it is still there. */
export class ReceiverInstall extends Model<InferAttributes<ReceiverInstall>, InferCreationAttributes<ReceiverInstall>> {
  declare id: CreationOptional<string>;
  declare receiverId: ForeignKey<Receiver['id']>;
  declare modelId: ForeignKey<SetupModel['id']>;
  /** The `id` of a receiver in the model's setup. */
  declare slot: string;
  declare revisionId: Revision['id'] | null;
  declare installedAt: CreationOptional<Date>;
  declare installedBy: User['id'] | null;
  declare removedAt: CreationOptional<Date | null>;
  declare removedBy: CreationOptional<User['id'] | null>;

  declare receiver?: NonAttribute<Receiver>;
  declare model?: NonAttribute<SetupModel>;
  declare installer?: NonAttribute<User | null>;
  declare remover?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    ReceiverInstall.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        slot: { type: DataTypes.TEXT, allowNull: false },
        revisionId: { type: DataTypes.UUID, allowNull: true },
        installedBy: { type: DataTypes.UUID, allowNull: true },
        removedBy: { type: DataTypes.UUID, allowNull: true, defaultValue: null },
        installedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        removedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
      },
      { sequelize, tableName: 'receiver_installs', modelName: 'ReceiverInstall', underscored: true, timestamps: false },
    );
  }
}
