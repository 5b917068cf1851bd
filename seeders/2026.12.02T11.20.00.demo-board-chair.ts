import { QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };
const CHAIR = 'maren.holt@corran-firth.example';

export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.bulkUpdate('users', { board_chair: true }, { email: CHAIR });
  await qi.bulkUpdate('board_rules', { quorum: 2, majority: 0.5 }, { id: 1 });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.bulkUpdate('users', { board_chair: false }, { email: CHAIR });
}
