import { Router, type Request } from 'express';
import multer from 'multer';
import { ImportModel, UserModel } from '../../db/models';
import { currentUser, requireRole } from '../../http/auth';
import { badRequest, notFound, unprocessable } from '../../http/errors';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import { idParam } from '../../http/params';
import { importResults, type ImportOutcome } from '../../commands/imports/results';
import { importPolls } from '../../commands/imports/polls';
import { ImportFileError } from '../../commands/imports/csv';
import { presentImport } from './presenter';
import { importBodySchema, importQuerySchema } from './schema';
import type { AppContext } from '../../http/context';

export function importsRouter(ctx: AppContext) {
  const router = Router();
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: ctx.config.UPLOAD_MAX_MB * 1024 * 1024, files: 1, fields: 10 } });

  function fileOf(req: Request): { buffer: Buffer; name: string } {
    const file = req.file;
    if (!file) throw badRequest('Attach the CSV as the multipart field "file"', [{ field: 'file', message: 'file is required' }]);
    return { buffer: file.buffer, name: file.originalname || 'upload.csv' };
  }

  async function run(req: Request, kind: 'results' | 'polls'): Promise<ImportOutcome> {
    const query = parse(importQuerySchema, req.query, 'query');
    const body = parse(importBodySchema, req.body ?? {});
    const { buffer, name } = fileOf(req);
    const user = currentUser(req);
    const common = { fileName: name, userId: user.id, userRole: user.role, dryRun: query.dryRun, validOnly: query.validOnly, columnMap: body.columnMap, reason: body.reason };
    try {
      return kind === 'results'
        ? await importResults(ctx.sequelize, buffer, common)
        : await importPolls(ctx.sequelize, buffer, { ...common, layout: query.layout, optionMap: body.optionMap, pollsterMap: body.pollsterMap });
    } catch (err) {
      if (err instanceof ImportFileError) throw unprocessable(err.code, err.message, { errors: err.errors });
      throw err;
    }
  }

  for (const kind of ['results', 'polls'] as const) {
    router.post(`/${kind}`, requireRole('analyst'), upload.single('file'), async (req, res) => {
      const { httpStatus, ...summary } = await run(req, kind);
      res.status(httpStatus).json(httpStatus === 422 ? { ...summary, error: { code: 'import_invalid', message: `${summary.errors.length} row error(s); nothing was imported`, details: summary.errors.slice(0, 50) } } : summary);
    });
  }

  router.get('/', requireRole('viewer'), async (req, res) => {
    const rows = await ImportModel.findAll({ order: [['id', 'DESC']], limit: 1000 });
    const users = new Map((await UserModel.findAll({ attributes: ['id', 'email'] })).map((u) => [u.id, u.email]));
    sendList(req, res, rows.map((r) => presentImport(r, r.userId ? (users.get(r.userId) ?? null) : null)), { filename: 'imports' });
  });

  router.get('/:id', requireRole('viewer'), async (req, res) => {
    const row = await ImportModel.findByPk(idParam(req.params.id));
    if (!row) throw notFound('Import');
    const user = row.userId ? await UserModel.findByPk(row.userId) : null;
    res.json({ ...presentImport(row, user?.email ?? null), errors: row.errors ? JSON.parse(row.errors) : [] });
  });

  router.get('/:id/errors', requireRole('viewer'), async (req, res) => {
    const row = await ImportModel.findByPk(idParam(req.params.id));
    if (!row) throw notFound('Import');
    const errors = row.errors ? (JSON.parse(row.errors) as object[]) : [];
    sendList(req, res, errors, { filename: `import-${row.id}-errors`, columns: ['row', 'column', 'code', 'message'] });
  });

  return router;
}
