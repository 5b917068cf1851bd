import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model, NonAttribute, Sequelize,
} from 'sequelize';
import { Region } from '../regions/region.model';
import type { StockKind, StockView } from './stock.schemas';

export class Stock extends Model<InferAttributes<Stock>, InferCreationAttributes<Stock>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  declare kind: StockKind;
  declare unit: string;
  declare defaultModel: string;
  declare description: string | null;
  declare regionId: number;
  declare region?: NonAttribute<Region>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The public view of a stock; the region must have been included. */
  toView(): StockView {
    const r = this.region!;
    return {
      id: this.id, code: this.code, name: this.name, kind: this.kind, unit: this.unit,
      defaultModel: this.defaultModel, description: this.description,
      region: { id: r.id, code: r.code, name: r.name },
    };
  }

  static initModel(sequelize: Sequelize): void {
    Stock.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.ENUM('single', 'predator-prey'), allowNull: false },
        unit: { type: DataTypes.STRING(20), allowNull: false },
        defaultModel: { type: DataTypes.STRING(40), allowNull: false, field: 'default_model' },
        description: { type: DataTypes.TEXT, allowNull: true },
        regionId: { type: DataTypes.INTEGER, allowNull: false, field: 'region_id' },
        createdAt: { type: DataTypes.DATE, field: 'created_at' },
        updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
      },
      { sequelize, tableName: 'stocks', modelName: 'Stock' },
    );
  }

  static associate(): void {
    Stock.belongsTo(Region, { as: 'region', foreignKey: 'regionId' });
    Region.hasMany(Stock, { as: 'stocks', foreignKey: 'regionId' });
  }
}
