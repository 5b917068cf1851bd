import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('stocks', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.ENUM('single', 'predator-prey'), allowNull: false },
    unit: { type: DataTypes.STRING(20), allowNull: false },
    default_model: { type: DataTypes.STRING(40), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    region_id: {
      type: DataTypes.INTEGER, allowNull: false,
      references: { model: 'regions', key: 'id' }, onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('stocks');
}
