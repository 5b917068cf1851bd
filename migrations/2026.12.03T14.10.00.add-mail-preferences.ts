import { DataTypes, QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/** What mail a licensee receives: every advisory, corrections only, or a weekly digest. */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('users', 'mail_preference', { type: DataTypes.ENUM('every', 'corrections', 'digest'), allowNull: false, defaultValue: 'every' });
  await qi.addColumn('users', 'digest_sent_at', { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('users', 'digest_sent_at');
  await qi.removeColumn('users', 'mail_preference');
}
