import fs from 'node:fs/promises';
import { LRUCache } from 'lru-cache';
import type { Logger } from 'pino';
import type { Storage } from '../storage/storage';

/** Storage folder of the cached IIIF answers; emptied at start, since the index of what it holds lives in memory. */
export const RENDER_CACHE_FOLDER = 'cache/iiif';

/**
 * The IIIF answers kept on disk, bounded by their total bytes (IIIF_CACHE_MAX_BYTES) with least-recently-used
 * eviction (lru-cache, sized by each file's bytes). Files are written to a temp path and renamed into place,
 * so a reader never sees half an image; an evicted file is removed from disk.
 */
export class RenderCache {
  private readonly index: LRUCache<string, number>;
  private readonly emptied: Promise<void>;
  /** Removals of evicted files that the write which caused them waits for. */
  private readonly removals: Promise<void>[] = [];

  constructor(
    private readonly storage: Storage,
    readonly maxBytes: number,
    logger: Logger,
  ) {
    this.index = new LRUCache<string, number>({
      maxSize: Math.max(1, maxBytes),
      sizeCalculation: (bytes) => Math.max(1, bytes),
      dispose: (_bytes, key, reason) => {
        // 'set' replaces an entry with the same file, which must stay; only evicted or deleted ones go.
        if (reason !== 'evict' && reason !== 'delete') return;
        this.removals.push(storage.remove(key).catch((error: unknown) => logger.warn({ err: error, key }, 'could not remove an evicted IIIF cache file')));
      },
    });
    this.emptied = storage.removeFolder(RENDER_CACHE_FOLDER);
  }

  /** Total bytes the cache holds now. */
  get totalBytes(): number {
    return this.index.calculatedSize;
  }

  /** The cached bytes under `key` (and marks them recently used), or undefined. */
  async read(key: string): Promise<Buffer | undefined> {
    await this.emptied;
    if (this.index.get(key) === undefined) return undefined;
    try {
      return await fs.readFile(this.storage.pathOf(key));
    } catch (error) {
      // Removed under us (an eviction racing this read): answer as a miss and render again.
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') {
        this.index.delete(key);
        return undefined;
      }
      throw error;
    }
  }

  /** Keeps `bytes` under `key`, evicting the least recently used files past the bound; an image larger than the whole bound is not kept. */
  async write(key: string, bytes: Buffer): Promise<void> {
    await this.emptied;
    if (bytes.length > this.maxBytes || this.index.has(key)) return;
    const tempPath = this.storage.newTempPath();
    try {
      await fs.writeFile(tempPath, bytes);
      await this.storage.putCache(tempPath, key);
    } finally {
      await fs.rm(tempPath, { force: true });
    }
    this.index.set(key, bytes.length);
    await Promise.all(this.removals.splice(0));
  }
}
