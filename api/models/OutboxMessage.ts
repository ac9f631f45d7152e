import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export type OutboxState = 'pending' | 'delivered' | 'failed';

/**
 * The `outbox` table: the mail queue. Commands queue a message (pending) in their own
 * transaction; the delivery loop sends it after commit and records the outcome. With the
 * local mail server, what it caught is written back onto the same row (`receivedAt`).
 */
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
  declare state: CreationOptional<OutboxState>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date | null;
  declare lastError: CreationOptional<string | null>;
  declare queuedAt: CreationOptional<Date>;
  declare deliveredAt: CreationOptional<Date | null>;
  /** When the local mail server caught it; null until then, and always with a real SMTP host. */
  declare receivedAt: CreationOptional<Date | null>;

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
        state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: true },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        queuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        deliveredAt: { type: DataTypes.DATE, allowNull: true },
        receivedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'outbox', modelName: 'OutboxMessage', underscored: true, timestamps: false },
    );
  }
}
