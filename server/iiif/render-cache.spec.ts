import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import pino from 'pino';
import { createFileStorage, type Storage } from '../storage/storage';
import { RENDER_CACHE_FOLDER, RenderCache } from './render-cache';

describe('RenderCache', () => {
  let rootDir: string;
  let storage: Storage;
  const logger = pino({ level: 'silent' });
  const key = (name: string) => `${RENDER_CACHE_FOLDER}/scan-p0/${name}`;
  const onDisk = async () => (await fs.readdir(storage.pathOf(`${RENDER_CACHE_FOLDER}/scan-p0`)).catch(() => [] as string[])).sort();

  beforeEach(async () => {
    rootDir = await fs.mkdtemp(path.join(os.tmpdir(), 'isallo-render-cache-'));
    storage = createFileStorage(rootDir);
    await storage.ensureFolders();
  });

  afterEach(async () => {
    await fs.rm(rootDir, { recursive: true, force: true });
  });

  it('when the files pass the byte bound, then the least recently used ones are evicted from the index and the disk', async () => {
    const cache = new RenderCache(storage, 250, logger);
    await cache.write(key('a'), Buffer.alloc(100, 1));
    await cache.write(key('b'), Buffer.alloc(100, 2));

    await cache.read(key('a'));
    await cache.write(key('c'), Buffer.alloc(100, 3));

    expect(cache.totalBytes).toBe(200);
    expect(await cache.read(key('b'))).toBeUndefined();
    expect(await cache.read(key('a'))).toEqual(Buffer.alloc(100, 1));
    expect(await cache.read(key('c'))).toEqual(Buffer.alloc(100, 3));
    expect(await onDisk()).toEqual(['a', 'c']);
    expect(await fs.readdir(storage.tempDir)).toEqual([]);
  });

  it('when one image is larger than the whole bound, then it is not kept', async () => {
    const cache = new RenderCache(storage, 50, logger);

    await cache.write(key('big'), Buffer.alloc(51));

    expect(cache.totalBytes).toBe(0);
    expect(await onDisk()).toEqual([]);
  });

  it('when the app starts, then files an earlier run left in the cache folder are removed, since no index knows them', async () => {
    await fs.mkdir(storage.pathOf(`${RENDER_CACHE_FOLDER}/scan-p0`), { recursive: true });
    await fs.writeFile(storage.pathOf(key('old')), Buffer.alloc(10));

    const cache = new RenderCache(storage, 1000, logger);

    expect(await cache.read(key('old'))).toBeUndefined();
    expect(await onDisk()).toEqual([]);
  });
});
