import { Router } from 'express';
import { apiTokenCreateSchema } from '@veracast/shared-types';
import { ApiTokenModel } from '../../db/models';
import { currentUser, requireSignedIn } from '../../http/auth';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { presentApiToken } from '../../http/presenters';
import { sendList } from '../../http/csv';
import { idParam } from '../../http/params';
import { randomToken, sha256 } from '../../services/crypto';

/** Personal API tokens: the secret is shown once; only its SHA-256 is stored. */
export function apiTokensRouter() {
  const router = Router();
  router.use(requireSignedIn);

  router.post('/', async (req, res) => {
    const { name } = parse(apiTokenCreateSchema, req.body);
    const secret = `vc_${randomToken(32)}`;
    const token = await ApiTokenModel.create({ userId: currentUser(req).id, name, prefix: secret.slice(0, 10), tokenHash: sha256(secret), lastUsedAt: null, revokedAt: null });
    res.status(201).json({ id: token.id, name: token.name, token: secret });
  });

  router.get('/', async (req, res) => {
    const tokens = await ApiTokenModel.findAll({ where: { userId: currentUser(req).id }, order: [['createdAt', 'DESC']] });
    sendList(req, res, tokens.map(presentApiToken), { filename: 'api-tokens' });
  });

  router.delete('/:id', async (req, res) => {
    const user = currentUser(req);
    const token = await ApiTokenModel.findByPk(idParam(req.params.id));
    // Admins may revoke anyone's token (SPEC §2); others only their own.
    if (!token || (token.userId !== user.id && user.role !== 'admin')) throw notFound('API token');
    if (!token.revokedAt) await token.update({ revokedAt: new Date() });
    res.status(204).end();
  });

  return router;
}
