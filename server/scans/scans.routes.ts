import { Router, type Request, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { SCAN_SORT_KEYS, type ScanDetail, type ScanSummary } from '@shared/api/scans';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP } from '../errors/app-error';
import { readPageQuery } from '../http/parse-query';
import { parseScanFilter, parseScanId, parseUploadFields } from './parse-scan-input';
import { receiveScanFile } from './scan-upload';
import * as scansService from './scans.service';

/** Mounted at /api/scans behind authenticate. */
export function scansRoutes({ db, storage, config }: AppDeps): Router {
  const router = Router();
  const mayRead = requireRoles('archivist', 'volunteer');

  router.get('/', mayRead, async (req, res: Response<Page<ScanSummary>>) => {
    const filter = parseScanFilter(req.query);
    res.json(await scansService.listScans(db, filter, readPageQuery(req.query, SCAN_SORT_KEYS)));
  });

  // Roles are checked before multer so that a refused caller never gets to stream a file to disk.
  router.post('/', requireRoles('archivist'), receiveScanFile(storage, config.maxUploadBytes), async (req: Request, res: Response<ScanDetail>) => {
    const fields = parseUploadFields(req.body, req.file !== undefined);
    const file = { tempPath: req.file!.path, originalName: req.file!.originalname };
    res.status(HTTP.created).json(await scansService.uploadScan(db, storage, file, fields, signedInPerson(req.user).id));
  });

  router.get('/:scanId', mayRead, async (req, res: Response<ScanDetail>) => {
    res.json(await scansService.getScan(db, parseScanId(req.params.scanId)));
  });

  router.get('/:scanId/preview', mayRead, async (req, res) => {
    const previewPath = await scansService.getPreviewPath(db, storage, parseScanId(req.params.scanId));
    // The preview is named by the master's hash, so it never changes under its URL.
    res.sendFile(previewPath, { dotfiles: 'allow', headers: { 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=86400' } });
  });

  return router;
}
