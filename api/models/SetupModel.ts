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
import type { Revision } from './Revision';
import type { User } from './User';
import type { Workspace } from './Workspace';

/** A model (one airframe) in a workspace: the `models` table. Named so it does not shadow Sequelize's `Model`. */
export class SetupModel extends Model<InferAttributes<SetupModel>, InferCreationAttributes<SetupModel>> {
  declare id: CreationOptional<string>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare name: string;
  /** The airframe kind named by the latest readable revision, when it names a known one. */
  declare airframe: string | null;
  declare forkedFromRevisionId: CreationOptional<string | null>;
  /** Set while the model is archived: hidden from the hangar, never deleted. */
  declare archivedAt: CreationOptional<Date | null>;
  declare archivedBy: CreationOptional<string | null>;
  declare createdBy: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare creator?: NonAttribute<User>;
  declare forkedFrom?: NonAttribute<Revision | null>;

  static initModel(sequelize: Sequelize): void {
    SetupModel.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.TEXT, allowNull: false },
        airframe: { type: DataTypes.TEXT, allowNull: true },
        forkedFromRevisionId: { type: DataTypes.UUID, allowNull: true },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        archivedBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'models', modelName: 'SetupModel', underscored: true },
    );
  }
}
