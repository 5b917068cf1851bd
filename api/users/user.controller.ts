import type { Request, Response } from 'express';
import { idParam } from '../http/validate';
import type { UserService } from './user.service';

export function userController(users: UserService) {
  return {
    list: async (_req: Request, res: Response) => {
      res.json({ users: await users.list() });
    },
    create: async (req: Request, res: Response) => {
      res.status(201).json({ user: await users.create(req.user!.id, req.body) });
    },
    resetPassword: async (req: Request, res: Response) => {
      res.json({ user: await users.resetPassword(req.user!.id, idParam(req.params.id), req.body) });
    },
    update: async (req: Request, res: Response) => {
      res.json({ user: await users.update(req.user!.id, idParam(req.params.id), req.body) });
    },
  };
}
