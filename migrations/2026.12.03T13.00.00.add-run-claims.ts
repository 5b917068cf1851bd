import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/** Which worker claimed a run and how many times it was claimed (a stalled run is claimed again). */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('runs', 'attempts', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await qi.addColumn('runs', 'worker', { type: DataTypes.STRING(120), allowNull: true });
  await qi.addIndex('runs', ['status', 'created_by']);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeIndex('runs', ['status', 'created_by']);
  await qi.removeColumn('runs', 'worker');
  await qi.removeColumn('runs', 'attempts');
}
