import { Router } from 'express';
import { userUpdateSchema } from '@veracast/shared-types';
import { UserModel } from '../../db/models';
import { requireRole } from '../../http/auth';
import { conflict, notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { presentUser } from '../../http/presenters';
import { sendList } from '../../http/csv';
import { idParam } from '../../http/params';
import type { AppContext } from '../../http/context';

export function usersRouter(ctx: AppContext) {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (req, res) => {
    const users = await UserModel.findAll({ order: [['email', 'ASC']] });
    sendList(req, res, users.map(presentUser), { filename: 'users' });
  });

  router.patch('/:id', async (req, res) => {
    const id = idParam(req.params.id);
    const body = parse(userUpdateSchema, req.body);
    const user = await ctx.sequelize.transaction(async (transaction) => {
      // Lock every admin row so two concurrent demotions cannot both pass the check.
      const admins = await UserModel.findAll({ where: { role: 'admin', disabled: false }, lock: transaction.LOCK.UPDATE, transaction });
      const target = await UserModel.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!target) throw notFound('User');
      const losesAdmin = target.role === 'admin' && !target.disabled && ((body.role && body.role !== 'admin') || body.disabled === true);
      if (losesAdmin && admins.length <= 1) {
        throw conflict('last_admin', 'This is the last active admin; make someone else admin first');
      }
      await target.update({ ...(body.role ? { role: body.role } : {}), ...(body.disabled !== undefined ? { disabled: body.disabled } : {}) }, { transaction });
      return target;
    });
    res.json({ user: presentUser(user) });
  });

  return router;
}
