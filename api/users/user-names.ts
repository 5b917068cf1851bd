import { User } from './user.model';

/** Display names of users by id, for records that show who did something. */
export async function userNames(ids: number[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter(Boolean))];
  if (wanted.length === 0) return new Map();
  const users = await User.findAll({ where: { id: wanted }, attributes: ['id', 'name'] });
  return new Map(users.map((u) => [u.id, u.name]));
}
