import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

const stamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable('regions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    ...stamps,
  });
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(190), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'assessor', 'board', 'licensee'), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    organisation: { type: DataTypes.STRING(160), allowNull: true },
    region_id: {
      type: DataTypes.INTEGER, allowNull: true,
      references: { model: 'regions', key: 'id' }, onDelete: 'RESTRICT',
    },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...stamps,
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable('users');
  await qi.dropTable('regions');
}
