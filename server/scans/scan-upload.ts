import type { Request, RequestHandler } from 'express';
import { createHash, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline, Transform } from 'node:stream';
import multer from 'multer';
import type { Storage } from '../storage/storage';

/** What the hashing storage engine adds to multer's file record. */
export interface HashedUpload extends Express.Multer.File {
  /** Hex SHA-256 of the bytes written, computed while they streamed to disk. */
  sha256: string;
}

/**
 * A multer storage engine that writes to storage.tempDir and hashes on the way, so a 300 MB master is read
 * once. A stream that breaks off (client abort, size limit) removes its partial file before reporting.
 */
function hashingDiskStorage(tempDir: string): multer.StorageEngine {
  return {
    _handleFile(_req: Request, file: Express.Multer.File, done: (error?: unknown, info?: Partial<HashedUpload>) => void) {
      const filePath = path.join(tempDir, `${randomUUID()}.upload`);
      const hash = createHash('sha256');
      let size = 0;
      const hasher = new Transform({
        transform(chunk: Buffer, _encoding, next) {
          hash.update(chunk);
          size += chunk.length;
          next(null, chunk);
        },
      });
      pipeline(file.stream, hasher, fs.createWriteStream(filePath, { flags: 'wx' }), (error) => {
        if (error) {
          fs.rm(filePath, { force: true }, () => done(error));
          return;
        }
        done(null, { path: filePath, destination: tempDir, filename: path.basename(filePath), size, sha256: hash.digest('hex') });
      });
    },
    _removeFile(_req: Request, file: Express.Multer.File, done: (error: Error | null) => void) {
      fs.rm(file.path, { force: true }, () => done(null));
    },
  };
}

/**
 * multer on disk: the upload streams into storage.tempDir (the same disk as the masters, so keeping it
 * is a link, not a copy) and stops at maxUploadBytes with a LIMIT_FILE_SIZE error (413 in the handler).
 * The temp file is removed once the response is over, whatever happened to it.
 */
export function receiveScanFile(storage: Storage, maxUploadBytes: number): RequestHandler[] {
  // multer reads defParamCharset; @types/multer 2.0.0 does not list it yet.
  const options: multer.Options & { defParamCharset: string } = {
    storage: hashingDiskStorage(storage.tempDir),
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

/** The hashed upload of a request that passed receiveScanFile, or undefined when it carried no file. */
export function uploadedFile(req: Request): HashedUpload | undefined {
  return req.file as HashedUpload | undefined;
}
