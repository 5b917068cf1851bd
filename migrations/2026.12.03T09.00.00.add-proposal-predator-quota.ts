import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/** A proposal for linked stocks carries a predator catch beside the prey catch (null for single stocks). */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('proposals', 'predator_quota', { type: DataTypes.DOUBLE, allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('proposals', 'predator_quota');
}
