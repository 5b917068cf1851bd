import { CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize } from 'sequelize';

/** One e-mail to send: written in the transaction of the event it reports, sent (once) after it commits. */
export class OutboxMail extends Model<InferAttributes<OutboxMail>, InferCreationAttributes<OutboxMail>> {
  declare id: CreationOptional<number>;
  declare dedupeKey: string;
  declare toAddress: string;
  declare subject: string;
  declare body: string;
  declare advisoryId: number | null;
  declare status: CreationOptional<'pending' | 'sending' | 'sent' | 'failed'>;
  declare attempts: CreationOptional<number>;
  declare lastError: string | null;
  declare messageId: string | null;
  declare nextAttemptAt: Date;
  declare sentAt: Date | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    OutboxMail.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      dedupeKey: { type: DataTypes.STRING(120), allowNull: false, unique: true, field: 'dedupe_key' },
      toAddress: { type: DataTypes.STRING(190), allowNull: false, field: 'to_address' },
      subject: { type: DataTypes.STRING(250), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      advisoryId: { type: DataTypes.INTEGER, allowNull: true, field: 'advisory_id' },
      status: { type: DataTypes.ENUM('pending', 'sending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true, field: 'last_error' },
      messageId: { type: DataTypes.STRING(250), allowNull: true, field: 'message_id' },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false, field: 'next_attempt_at' },
      sentAt: { type: DataTypes.DATE, allowNull: true, field: 'sent_at' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    }, { sequelize, tableName: 'outbox', modelName: 'OutboxMail', updatedAt: false });
  }
}
