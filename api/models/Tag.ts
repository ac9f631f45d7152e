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
import type { SetupModel } from './SetupModel';
import type { User } from './User';

/**
 * A label on a revision (`season-2026`, `maiden`). Unlike revisions, tags may be added
 * and removed: they are not part of the setup. A name is unique within a model, so it
 * names one revision, like a git tag (the repository export relies on that).
 */
export class Tag extends Model<InferAttributes<Tag>, InferCreationAttributes<Tag>> {
  declare id: CreationOptional<string>;
  declare modelId: ForeignKey<SetupModel['id']>;
  declare revisionId: ForeignKey<Revision['id']>;
  declare name: string;
  declare createdBy: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;

  declare revision?: NonAttribute<Revision>;

  static initModel(sequelize: Sequelize): void {
    Tag.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'tags', modelName: 'Tag', underscored: true, updatedAt: false },
    );
  }
}
