import { createHash, randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';

/** Where files live under STORAGE_DIR. Masters are keyed by content hash, so a key never changes meaning. */
export interface Storage {
  readonly rootDir: string;
  /** Folder for partly written files (multer uploads, files about to be renamed); same disk as the masters. */
  readonly tempDir: string;
  /** Creates the folders; call once at start. */
  ensureFolders(): Promise<void>;
  /** A fresh path inside tempDir. */
  newTempPath(extension?: string): string;
  /**
   * Moves a finished temp file to masters/ab/<sha256>.<ext>. Never overwrites: if the master exists
   * already (same hash, hence same bytes) the temp file is dropped. `isCreated` says whether this call
   * made the file, so the caller knows whether to remove it when its database write fails.
   */
  putMaster(tempPath: string, sha256: string, extension: string): Promise<{ key: string; isCreated: boolean }>;
  /** Absolute path of a stored key. */
  pathOf(key: string): string;
  /** Key of the cached preview of one page of a master (page 0 keeps the plain `<sha256>.jpg` name). */
  previewKey(sha256: string, pageIndex?: number): string;
  /** Key of the folder holding one page's derivatives (page raster, thumbnail, IIIF tiles, rendered IIIF answers). */
  derivativesKey(sha256: string, pageIndex: number): string;
  /**
   * Puts a finished temp folder at `key`, replacing the folder there (caches only). The swap is two renames,
   * so a reader sees the old set or the new set of files, never a half-written one.
   */
  putFolder(tempFolder: string, key: string): Promise<void>;
  /** Removes a stored folder and everything in it; a missing folder is not an error. */
  removeFolder(key: string): Promise<void>;
  /** Moves a finished temp file to `key`, replacing whatever is there (for caches only). */
  putCache(tempPath: string, key: string): Promise<void>;
  /** Removes a stored file; a missing file is not an error. */
  remove(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
}

const SHA256_PATTERN = /^[0-9a-f]{64}$/;

function isMissing(error: unknown): boolean {
  return (error as NodeJS.ErrnoException)?.code === 'ENOENT';
}

/** SHA-256 of a file as lower-case hex, streamed so large scans are not held in memory. */
export async function sha256OfFile(filePath: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(filePath)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

/** Storage on the local disk under rootDir. */
export function createFileStorage(rootDir: string): Storage {
  const root = path.resolve(rootDir);
  const tempDir = path.join(root, 'tmp');
  const pathOf = (key: string): string => {
    const full = path.resolve(root, key);
    if (!full.startsWith(root + path.sep)) throw new Error(`Storage key escapes the storage folder: ${key}`);
    return full;
  };
  const removeQuietly = async (fullPath: string): Promise<void> => {
    try {
      await fs.unlink(fullPath);
    } catch (error) {
      if (!isMissing(error)) throw error;
    }
  };

  return {
    rootDir: root,
    tempDir,
    async ensureFolders() {
      await fs.mkdir(tempDir, { recursive: true });
      await fs.mkdir(path.join(root, 'masters'), { recursive: true });
      await fs.mkdir(path.join(root, 'previews'), { recursive: true });
    },
    newTempPath(extension = '') {
      return path.join(tempDir, `${randomUUID()}${extension}`);
    },
    async putMaster(tempPath, sha256, extension) {
      if (!SHA256_PATTERN.test(sha256)) throw new Error(`Not a SHA-256 hex digest: ${sha256}`);
      const key = `masters/${sha256.slice(0, 2)}/${sha256}.${extension}`;
      const target = pathOf(key);
      await fs.mkdir(path.dirname(target), { recursive: true });
      try {
        // link() fails with EEXIST instead of replacing, which is what "never rewritten" needs;
        // it is atomic, so a reader sees either no master or the whole master.
        await fs.link(tempPath, target);
        return { key, isCreated: true };
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'EEXIST') return { key, isCreated: false };
        throw error;
      } finally {
        await removeQuietly(tempPath);
      }
    },
    pathOf,
    previewKey(sha256, pageIndex = 0) {
      if (!SHA256_PATTERN.test(sha256)) throw new Error(`Not a SHA-256 hex digest: ${sha256}`);
      return `previews/${sha256.slice(0, 2)}/${sha256}${pageIndex === 0 ? '' : `-p${pageIndex}`}.jpg`;
    },
    derivativesKey(sha256, pageIndex) {
      if (!SHA256_PATTERN.test(sha256)) throw new Error(`Not a SHA-256 hex digest: ${sha256}`);
      if (!Number.isInteger(pageIndex) || pageIndex < 0) throw new Error(`Not a page index: ${pageIndex}`);
      return `derivatives/${sha256.slice(0, 2)}/${sha256}-p${pageIndex}`;
    },
    async putFolder(tempFolder, key) {
      const target = pathOf(key);
      await fs.mkdir(path.dirname(target), { recursive: true });
      const retired = path.join(tempDir, `${randomUUID()}.retired`);
      try {
        await fs.rename(target, retired);
      } catch (error) {
        if (!isMissing(error)) throw error;
      }
      await fs.rename(tempFolder, target);
      await fs.rm(retired, { recursive: true, force: true });
    },
    async removeFolder(key) {
      await fs.rm(pathOf(key), { recursive: true, force: true });
    },
    async putCache(tempPath, key) {
      const target = pathOf(key);
      await fs.mkdir(path.dirname(target), { recursive: true });
      await fs.rename(tempPath, target);
    },
    async remove(key) {
      await removeQuietly(pathOf(key));
    },
    async exists(key) {
      try {
        await fs.access(pathOf(key));
        return true;
      } catch (error) {
        if (isMissing(error)) return false;
        throw error;
      }
    },
  };
}
