import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A message the local mail server caught (development and demo mode only): the `outbox` table. */
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<string>;
  declare messageId: string | null;
  declare envelopeFrom: string | null;
  declare envelopeTo: string[];
  declare fromHeader: string;
  declare toHeader: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare sizeBytes: number;
  declare receivedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    OutboxMessage.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        messageId: { type: DataTypes.TEXT, allowNull: true },
        envelopeFrom: { type: DataTypes.TEXT, allowNull: true },
        envelopeTo: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        fromHeader: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        toHeader: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        subject: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        textBody: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        htmlBody: { type: DataTypes.TEXT, allowNull: true },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'outbox', modelName: 'OutboxMessage', underscored: true, timestamps: false },
    );
  }
}
