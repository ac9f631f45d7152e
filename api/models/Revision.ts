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
import type { Finding } from '@shared/findings';
import type { SetupModel } from './SetupModel';
import type { Tag } from './Tag';
import type { User } from './User';

export const REVISION_ORIGINS = ['create', 'save', 'upload', 'revert', 'fork', 'merge'] as const;
export type RevisionOrigin = (typeof REVISION_ORIGINS)[number];

/**
 * One immutable revision of a model's setup. The database refuses UPDATE and DELETE
 * on this table (see migration 0002), so instances are only ever created and read.
 */
export class Revision extends Model<InferAttributes<Revision>, InferCreationAttributes<Revision>> {
  declare id: CreationOptional<string>;
  declare modelId: ForeignKey<SetupModel['id']>;
  declare number: number;
  declare parentId: string | null;
  declare authorId: ForeignKey<User['id']>;
  declare message: string;
  declare yamlText: string;
  declare document: unknown;
  declare contentHash: string;
  declare findings: Finding[];
  declare errorCount: number;
  declare warningCount: number;
  declare infoCount: number;
  declare origin: RevisionOrigin;
  declare sourceRevisionId: string | null;
  declare createdAt: CreationOptional<Date>;

  declare author?: NonAttribute<User>;
  declare model?: NonAttribute<SetupModel>;
  declare tags?: NonAttribute<Tag[]>;

  static initModel(sequelize: Sequelize): void {
    Revision.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        number: { type: DataTypes.INTEGER, allowNull: false },
        parentId: { type: DataTypes.UUID, allowNull: true },
        message: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        yamlText: { type: DataTypes.TEXT, allowNull: false },
        document: { type: DataTypes.JSONB, allowNull: false },
        contentHash: { type: DataTypes.TEXT, allowNull: false },
        findings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        errorCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        warningCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        infoCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        origin: {
          type: DataTypes.TEXT,
          allowNull: false,
          defaultValue: 'save',
          validate: { isIn: [[...REVISION_ORIGINS]] },
        },
        sourceRevisionId: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'revisions', modelName: 'Revision', underscored: true, updatedAt: false },
    );
  }
}
