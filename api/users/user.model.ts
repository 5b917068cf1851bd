import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize,
} from 'sequelize';
import { MAIL_PREFERENCES, type MailPreference, type Role, type UserView } from './user.schemas';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string;
  declare organisation: string | null;
  declare regionId: number | null;
  declare active: CreationOptional<boolean>;
  declare boardChair: CreationOptional<boolean>;
  declare mailPreference: CreationOptional<MailPreference>;
  /** When this licensee's last digest was queued. */
  declare digestSentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The public view of a user: what every API response shows. */
  toView(): UserView {
    return {
      id: this.id, email: this.email, name: this.name, role: this.role,
      organisation: this.organisation, regionId: this.regionId, active: this.active, boardChair: this.boardChair,
      mailPreference: this.mailPreference, createdAt: this.createdAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(190), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM('admin', 'assessor', 'board', 'licensee'), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false, field: 'password_hash' },
        organisation: { type: DataTypes.STRING(160), allowNull: true },
        regionId: { type: DataTypes.INTEGER, allowNull: true, field: 'region_id' },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        boardChair: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false, field: 'board_chair' },
        mailPreference: { type: DataTypes.ENUM(...MAIL_PREFERENCES), allowNull: false, defaultValue: 'every', field: 'mail_preference' },
        digestSentAt: { type: DataTypes.DATE, allowNull: true, field: 'digest_sent_at' },
        createdAt: { type: DataTypes.DATE, field: 'created_at' },
        updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
      },
      { sequelize, tableName: 'users', modelName: 'User' },
    );
  }
}
