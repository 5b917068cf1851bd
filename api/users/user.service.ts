/** User administration: every change is audited in the same transaction. */
import type { Sequelize } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import { hashPassword } from '../auth/auth.service';
import { recordAudit } from '../audit/audit.service';
import { ConflictError, NotFoundError, ValidationError } from '../http/http-error';
import { Region } from '../regions/region.model';
import { User } from './user.model';
import type { CreateUserBody, ResetPasswordBody, UpdateUserBody, UserView } from './user.schemas';

export class UserService {
  constructor(private readonly sequelize: Sequelize) {}

  /** Every user, by name. */
  async list(): Promise<UserView[]> {
    return (await User.findAll({ order: [['name', 'ASC']] })).map((u) => u.toView());
  }

  /** Creates a user; a licensee must belong to a region. */
  async create(actorId: number, body: CreateUserBody): Promise<UserView> {
    await this.checkRegion(body.role, body.regionId ?? null);
    const passwordHash = await hashPassword(body.password);
    try {
      return await this.sequelize.transaction(async (t) => {
        const user = await User.create({
          email: body.email.toLowerCase(), name: body.name, role: body.role, passwordHash,
          organisation: body.organisation ?? null, regionId: body.regionId ?? null,
        }, { transaction: t });
        await recordAudit({ actorId, action: 'user.create', entityType: 'user', entityId: user.id, after: user.toView() }, t);
        return user.toView();
      });
    } catch (err) {
      if (err instanceof UniqueConstraintError) throw new ConflictError('EMAIL_TAKEN', 'A user with this e-mail already exists.');
      throw err;
    }
  }

  /** Changes role, region, chair or active flag; an administrator cannot lock themself out. */
  async update(actorId: number, id: number, body: UpdateUserBody): Promise<UserView> {
    return this.sequelize.transaction(async (t) => {
      const user = await User.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!user) throw new NotFoundError('User');
      if (id === actorId && ((body.role && body.role !== 'admin') || body.active === false)) {
        throw new ConflictError('SELF_LOCKOUT', 'You cannot remove your own administrator access.');
      }
      const before = user.toView();
      const role = body.role ?? user.role;
      const regionId = body.regionId !== undefined ? body.regionId : user.regionId;
      await this.checkRegion(role, regionId);
      const boardChair = role !== 'board' ? false : body.boardChair ?? user.boardChair;
      if (body.boardChair && role !== 'board') {
        throw new ValidationError('Only a board member can chair the board.', { boardChair: ['the user is not a board member'] });
      }
      if (boardChair && !user.boardChair) {
        const previous = await User.findAll({ where: { boardChair: true }, transaction: t, lock: t.LOCK.UPDATE });
        for (const p of previous) {
          const was = p.toView();
          await p.update({ boardChair: false }, { transaction: t });
          await recordAudit({ actorId, action: 'user.update', entityType: 'user', entityId: p.id, before: was, after: p.toView() }, t);
        }
      }
      await user.update({ role, regionId, active: body.active ?? user.active, boardChair }, { transaction: t });
      await recordAudit({ actorId, action: 'user.update', entityType: 'user', entityId: id, before, after: user.toView() }, t);
      return user.toView();
    });
  }

  /** Sets a new password chosen by the administrator; the audit entry records that it changed, never the password. */
  async resetPassword(actorId: number, id: number, body: ResetPasswordBody): Promise<UserView> {
    const passwordHash = await hashPassword(body.password);
    return this.sequelize.transaction(async (t) => {
      const user = await User.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!user) throw new NotFoundError('User');
      await user.update({ passwordHash }, { transaction: t });
      await recordAudit({ actorId, action: 'user.password.reset', entityType: 'user', entityId: id, after: { passwordChanged: true } }, t);
      return user.toView();
    });
  }

  private async checkRegion(role: string, regionId: number | null): Promise<void> {
    if (role === 'licensee' && regionId === null) {
      throw new ValidationError('A licensee must belong to a region.', { regionId: ['required for a licensee'] });
    }
    if (regionId !== null && !(await Region.findByPk(regionId))) {
      throw new ValidationError('That region does not exist.', { regionId: ['no such region'] });
    }
  }
}
