import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, Sequelize,
} from 'sequelize';
import type { DatasetView } from './dataset.schemas';

/** One immutable version of a stock's data: kept for ever, never overwritten. */
export class Dataset extends Model<InferAttributes<Dataset>, InferCreationAttributes<Dataset>> {
  declare id: CreationOptional<number>;
  declare stockId: number;
  declare version: number;
  declare note: string;
  declare kind: 'single' | 'predator-prey';
  declare csvText: string;
  declare firstYear: number;
  declare lastYear: number;
  declare indexNames: string[];
  declare createdBy: number;
  declare createdAt: CreationOptional<Date>;

  toView(createdByName: string | null = null): DatasetView {
    return {
      id: this.id, stockId: this.stockId, version: this.version, note: this.note, kind: this.kind,
      firstYear: this.firstYear, lastYear: this.lastYear, indexNames: this.indexNames,
      createdBy: this.createdBy, createdByName, createdAt: this.createdAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    Dataset.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        stockId: { type: DataTypes.INTEGER, allowNull: false, field: 'stock_id' },
        version: { type: DataTypes.INTEGER, allowNull: false },
        note: { type: DataTypes.STRING(500), allowNull: false },
        kind: { type: DataTypes.ENUM('single', 'predator-prey'), allowNull: false },
        csvText: { type: DataTypes.TEXT('medium'), allowNull: false, field: 'csv_text' },
        firstYear: { type: DataTypes.INTEGER, allowNull: false, field: 'first_year' },
        lastYear: { type: DataTypes.INTEGER, allowNull: false, field: 'last_year' },
        indexNames: { type: DataTypes.JSON, allowNull: false, field: 'index_names' },
        createdBy: { type: DataTypes.INTEGER, allowNull: false, field: 'created_by' },
        createdAt: { type: DataTypes.DATE, field: 'created_at' },
      },
      { sequelize, tableName: 'datasets', modelName: 'Dataset', updatedAt: false },
    );
  }
}
