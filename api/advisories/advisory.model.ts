import { CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize } from 'sequelize';

/** A published advisory: immutable once written (a correction is a new advisory that supersedes it). */
export class Advisory extends Model<InferAttributes<Advisory>, InferCreationAttributes<Advisory>> {
  declare id: CreationOptional<number>;
  declare docId: string;
  declare stockId: number;
  declare regionId: number;
  declare decisionId: number;
  declare supersedesId: number | null;
  declare supersededById: number | null;
  declare approvedLimit: number;
  declare override: boolean;
  declare title: string;
  declare summary: string;
  declare pdf: Buffer;
  declare sha256: string;
  declare publishedBy: number;
  declare publishedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Advisory.init({
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      docId: { type: DataTypes.STRING(40), allowNull: false, unique: true, field: 'doc_id' },
      stockId: { type: DataTypes.INTEGER, allowNull: false, field: 'stock_id' },
      regionId: { type: DataTypes.INTEGER, allowNull: false, field: 'region_id' },
      decisionId: { type: DataTypes.INTEGER, allowNull: false, field: 'decision_id' },
      supersedesId: { type: DataTypes.INTEGER, allowNull: true, field: 'supersedes_id' },
      supersededById: { type: DataTypes.INTEGER, allowNull: true, field: 'superseded_by_id' },
      approvedLimit: { type: DataTypes.DOUBLE, allowNull: false, field: 'approved_limit' },
      override: { type: DataTypes.BOOLEAN, allowNull: false },
      title: { type: DataTypes.STRING(200), allowNull: false },
      summary: { type: DataTypes.TEXT, allowNull: false },
      pdf: { type: DataTypes.BLOB('long'), allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      publishedBy: { type: DataTypes.INTEGER, allowNull: false, field: 'published_by' },
      publishedAt: { type: DataTypes.DATE, field: 'published_at' },
    }, { sequelize, tableName: 'advisories', modelName: 'Advisory', createdAt: 'publishedAt', updatedAt: false });
  }
}
