import { Router } from 'express';
import { MailMessageModel } from '../../db/models';
import { requireRole } from '../../http/auth';
import { notFound } from '../../http/errors';
import { presentMail } from '../../http/presenters';
import { sendList } from '../../http/csv';
import { idParam } from '../../http/params';

/** The local mailbox: what the fake SMTP server received (admins only). */
export function mailboxRouter() {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', async (req, res) => {
    const rows = await MailMessageModel.findAll({ order: [['id', 'DESC']], limit: 500 });
    sendList(req, res, rows.map(presentMail), { filename: 'mailbox' });
  });
  router.get('/:id', async (req, res) => {
    const row = await MailMessageModel.findByPk(idParam(req.params.id));
    if (!row) throw notFound('Message');
    res.json(presentMail(row));
  });
  return router;
}
