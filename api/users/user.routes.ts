import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { requireRole } from '../http/auth';
import { validateBody } from '../http/validate';
import { userController } from './user.controller';
import { createUserSchema, resetPasswordSchema, updateUserSchema } from './user.schemas';
import { UserService } from './user.service';

export function userRoutes(sequelize: Sequelize): Router {
  const users = userController(new UserService(sequelize));
  const router = Router();
  router.get('/', requireRole('admin'), users.list);
  router.post('/', requireRole('admin'), validateBody(createUserSchema), users.create);
  router.patch('/:id', requireRole('admin'), validateBody(updateUserSchema), users.update);
  router.post('/:id/password', requireRole('admin'), validateBody(resetPasswordSchema), users.resetPassword);
  return router;
}
