import type { RequestHandler } from 'express';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import multer from 'multer';
import type { Storage } from '../storage/storage';

/**
 * multer on disk: the upload streams into storage.tempDir (the same disk as the masters, so keeping it
 * is a link, not a copy) and stops at maxUploadBytes with a LIMIT_FILE_SIZE error (413 in the handler).
 * The temp file is removed once the response is over, whatever happened to it.
 */
export function receiveScanFile(storage: Storage, maxUploadBytes: number): RequestHandler[] {
  // multer reads defParamCharset; @types/multer 2.0.0 does not list it yet.
  const options: multer.Options & { defParamCharset: string } = {
    storage: multer.diskStorage({ destination: storage.tempDir, filename: (_req, _file, done) => done(null, `${randomUUID()}.upload`) }),
    limits: { fileSize: maxUploadBytes, files: 1, fields: 10, fieldSize: 64 * 1024 },
    // Browsers send the file name as UTF-8; busboy's default latin1 would garble "Kestrel–week 10.png".
    defParamCharset: 'utf8',
  };
  const upload = multer(options);
  const removeTempFileAfterResponse: RequestHandler = (req, res, next) => {
    const tempPath = req.file?.path;
    if (tempPath) res.on('close', () => fs.rm(tempPath, { force: true }, () => undefined));
    next();
  };
  return [upload.single('file'), removeTempFileAfterResponse];
}
