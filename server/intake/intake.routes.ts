import express, { Router, type ErrorRequestHandler, type NextFunction, type Request, type Response } from 'express';
import { INTAKE_BATCH_SORT_KEYS, type IntakeBatch, type IntakeBatchDetail, type IntakeFileResult, type InventoryMatch } from '@shared/api/intake';
import { FieldReader } from '@shared/api/field-reader';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { knownError } from '../errors/error-handler';
import { parsePathId } from '../http/parse-body';
import { readPageQuery } from '../http/parse-query';
import { parseIntakeFields } from '../scans/parse-scan-input';
import { receiveScanFile, uploadedFile } from '../scans/scan-upload';
import * as intakeService from './intake.service';

/** Largest inventory CSV body (a few thousand rows). */
const INVENTORY_BODY_LIMIT = '5mb';

/** Set once the file is handed to intakeService.receiveFile, which records its outcome from then on. */
interface FileLocals extends Record<string, unknown> {
  isWithService?: boolean;
}

const batchId = (value: unknown) => parsePathId(value, 'intake_batch_not_found', 'intake batch');

function parseLabel(body: unknown): string {
  const reader = new FieldReader(body);
  const label = reader.text('label', { isRequired: true, maxLength: 200 });
  reader.refuseUnreadKeys();
  if (label === undefined) reader.problem('label', 'label is required (up to 200 characters)');
  if (!reader.isValid || label === undefined) throw validationFailed(reader.details, 'The batch needs a label.');
  return label;
}

/** Mounted at /api/intake behind authenticate: archivists only. */
export function intakeRoutes(deps: AppDeps): Router {
  const { db, storage, config } = deps;
  const router = Router();
  router.use(requireRoles('archivist'));

  router.post('/batches', async (req, res: Response<IntakeBatch>) => {
    res.status(HTTP.created).json(await intakeService.createBatch(db, parseLabel(req.body), signedInPerson(req.user).id));
  });
  router.get('/batches', async (req, res: Response<Page<IntakeBatch>>) => {
    res.json(await intakeService.listBatches(db, readPageQuery(req.query, INTAKE_BATCH_SORT_KEYS)));
  });
  router.get('/batches/:batchId', async (req, res: Response<IntakeBatchDetail>) => {
    res.json(await intakeService.getBatchDetail(db, batchId(req.params.batchId)));
  });

  // A file refused before it reached the service (too large, bad fields, no file part) is recorded here,
  // before the usual error answer; the service records what it refuses itself. An upload the client broke
  // off is not recorded: nothing of it was received or kept.
  const recordRefusedFile: ErrorRequestHandler = (err, req, res: Response<unknown, FileLocals>, next) => {
    const known = knownError(err, config.maxUploadBytes);
    const id = req.params['batchId'];
    if (!known || res.locals.isWithService || req.readableAborted || req.socket.destroyed || typeof id !== 'string' || known.code === 'intake_batch_not_found') {
      next(err);
      return;
    }
    const fileName = uploadedFile(req)?.originalname ?? '(file not received)';
    intakeService.recordRefusal(db, id, fileName, known).then(() => next(err), next);
  };
  router.post(
    '/batches/:batchId/files',
    async (req: Request, _res: Response, next: NextFunction) => {
      // The batch is checked before the file streams in.
      await intakeService.getBatch(db, batchId(req.params.batchId));
      next();
    },
    receiveScanFile(storage, config.maxUploadBytes),
    async (req: Request, res: Response<IntakeFileResult, FileLocals>) => {
      const file = uploadedFile(req);
      const fields = parseIntakeFields(req.body, file !== undefined);
      const received = { tempPath: file!.path, originalName: file!.originalname, sha256: file!.sha256 };
      res.locals.isWithService = true;
      res.status(HTTP.created).json(await intakeService.receiveFile(deps, batchId(req.params.batchId), received, fields, signedInPerson(req.user).id));
    },
    recordRefusedFile,
  );

  router.post(
    '/batches/:batchId/inventory',
    express.text({ type: ['text/csv', 'text/plain', 'application/csv'], limit: INVENTORY_BODY_LIMIT }),
    async (req, res: Response<InventoryMatch>) => {
      const id = batchId(req.params.batchId);
      if (typeof req.body !== 'string') {
        throw new AppError(HTTP.unsupportedMediaType, 'bad_request', 'Send the inventory as a text/csv body with a header row.');
      }
      res.json(await intakeService.importInventory(db, id, req.body, signedInPerson(req.user).id));
    },
  );
  return router;
}
