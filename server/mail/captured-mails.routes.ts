import { Router, type Response } from 'express';
import type { CapturedMail } from '@shared/api/mail';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { requireRoles } from '../auth/require-roles';
import { AppError, HTTP } from '../errors/app-error';
import { readPageQuery } from '../http/parse-query';
import { listCapturedMails } from './captured-mails';

/**
 * Mounted at /api/dev/mails behind authenticate: the mails the local SMTP fake captured, for the admin.
 * There only when MAIL_CAPTURE_DIR is set (npm start and the tests); a real deployment answers 404.
 */
export function capturedMailsRoutes({ config }: AppDeps): Router {
  const router = Router();
  router.get('/', requireRoles('admin'), async (req, res: Response<Page<CapturedMail>>) => {
    if (config.mailCaptureDir === null) throw new AppError(HTTP.notFound, 'not_found', 'Captured mails are shown only in development, with the local mail fake.');
    const query = readPageQuery(req.query, [] as const);
    const { items, total } = await listCapturedMails(config.mailCaptureDir, query);
    res.json({ items, total, page: query.page, pageSize: query.pageSize });
  });
  return router;
}
