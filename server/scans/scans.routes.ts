import { Router, type Request, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { parseScanBulkEditInput } from '@shared/api/parse-scan-bulk-edit';
import { parseScanMetadataInput, parseScanStatusChange } from '@shared/api/parse-scan-metadata';
import { SCAN_SORT_KEYS, type ScanBulkEditResult, type ScanChangeLogEntry, type ScanDetail, type ScanStatusCounts, type ScanSummary } from '@shared/api/scans';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { readPageQuery, refuseUnknownQuery } from '../http/parse-query';
import { parseScanFilter, parseScanId, parseUploadFields, SCAN_FILTER_PARAMETERS } from './parse-scan-input';
import { receiveScanFile, uploadedFile } from './scan-upload';
import { bulkEditScans } from './scan-bulk-edit.service';
import * as scansService from './scans.service';

/** Withdrawn scans are the archivist's business: a volunteer neither lists nor opens them (as the Desk never offers them). */
export function seesWithdrawn(req: Request): boolean {
  return signedInPerson(req.user).roles.includes('archivist');
}

/** Mounted at /api/scans behind authenticate. */
export function scansRoutes(deps: AppDeps): Router {
  const { db, storage, config } = deps;
  const router = Router();
  const mayRead = requireRoles('archivist', 'volunteer');
  const mayEdit = requireRoles('archivist');

  router.get('/', mayRead, async (req, res: Response<Page<ScanSummary>>) => {
    const filter = { ...parseScanFilter(req.query), hideWithdrawn: !seesWithdrawn(req) };
    res.json(await scansService.listScans(db, filter, readPageQuery(req.query, SCAN_SORT_KEYS, SCAN_FILTER_PARAMETERS)));
  });

  router.get('/status-counts', mayEdit, async (req, res: Response<ScanStatusCounts>) => {
    refuseUnknownQuery(req.query, SCAN_FILTER_PARAMETERS);
    res.json(await scansService.countScansByStatus(db, parseScanFilter(req.query)));
  });

  // Roles are checked before multer so that a refused caller never gets to stream a file to disk.
  router.post('/', mayEdit, receiveScanFile(storage, config.maxUploadBytes), async (req: Request, res: Response<ScanDetail>) => {
    const file = uploadedFile(req);
    const fields = parseUploadFields(req.body, file !== undefined);
    const received = { tempPath: file!.path, originalName: file!.originalname, sha256: file!.sha256 };
    res.status(HTTP.created).json(await scansService.uploadScan(deps, received, fields, signedInPerson(req.user).id));
  });

  router.post('/bulk-edit', mayEdit, async (req, res: Response<ScanBulkEditResult>) => {
    const input = valueOrThrow(parseScanBulkEditInput(req.body), 'The bulk edit has invalid fields.');
    res.json(await bulkEditScans(db, input, signedInPerson(req.user).id));
  });

  router.get('/:scanId', mayRead, async (req, res: Response<ScanDetail>) => {
    res.json(await scansService.getScan(db, parseScanId(req.params.scanId), { hideWithdrawn: !seesWithdrawn(req) }));
  });

  router.patch('/:scanId', mayEdit, async (req, res: Response<ScanDetail>) => {
    const scanId = parseScanId(req.params.scanId);
    const input = valueOrThrow(parseScanMetadataInput(req.body), 'The scan has invalid fields.');
    res.json(await scansService.updateScanMetadata(db, scanId, input, signedInPerson(req.user).id));
  });

  router.post('/:scanId/status', mayEdit, async (req, res: Response<ScanDetail>) => {
    const scanId = parseScanId(req.params.scanId);
    const change = valueOrThrow(parseScanStatusChange(req.body), 'The status change is invalid.');
    res.json(await scansService.changeScanStatus(db, scanId, change, signedInPerson(req.user).id));
  });

  router.get('/:scanId/change-log', mayEdit, async (req, res: Response<Page<ScanChangeLogEntry>>) => {
    const scanId = parseScanId(req.params.scanId);
    // Newest first, always: the trail has no other sort.
    const query = readPageQuery(req.query, [] as const);
    res.json(await scansService.listScanChangeLog(db, scanId, query));
  });

  router.post('/:scanId/derivatives/retry', mayEdit, async (req, res: Response<ScanDetail>) => {
    res.json(await scansService.retryDerivatives(deps, parseScanId(req.params.scanId)));
  });

  router.get('/:scanId/preview', mayRead, async (req, res) => {
    const scanId = parseScanId(req.params.scanId);
    await scansService.getScan(db, scanId, { hideWithdrawn: !seesWithdrawn(req) });
    const previewPath = await scansService.getPreviewPath(db, storage, scanId);
    // The preview is named by the master's hash, so it never changes under its URL.
    res.sendFile(previewPath, { dotfiles: 'allow', headers: { 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=86400' } });
  });

  return router;
}
