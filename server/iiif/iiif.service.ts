import fs from 'node:fs/promises';
import path from 'node:path';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { TILES_FOLDER } from '../jobs/make-derivatives';
import { findPageSource } from '../jobs/page-source';
import * as scansRepository from '../scans/scans.repository';
import type { ScanFile } from '../scans/scans.repository';
import type { Storage } from '../storage/storage';
import { parseImageRequest, type ImageRequest } from './image-request';
import { buildInfoDocument, MAX_AREA_PX, type InfoDocument } from './info-document';
import { buildBoxCollection, buildManifest } from './manifest-document';

export const CONTENT_TYPES: Record<ImageRequest['format'], string> = { jpg: 'image/jpeg', png: 'image/png', webp: 'image/webp' };

function scanNotFound(): AppError {
  return new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
}

async function findFile(db: Db, scanId: string): Promise<ScanFile> {
  const file = await scansRepository.findScanFile(db, scanId);
  if (!file) throw scanNotFound();
  return file;
}

export async function getInfoDocument(db: Db, scanId: string, baseUri: string): Promise<InfoDocument> {
  const file = await findFile(db, scanId);
  return buildInfoDocument(baseUri, file.widthPx, file.heightPx);
}

export async function getManifest(db: Db, scanId: string, origin: string): Promise<Record<string, unknown>> {
  const scan = await scansRepository.findScanById(db, scanId);
  if (!scan) throw scanNotFound();
  return buildManifest(origin, scan);
}

export async function getBoxCollection(db: Db, collection: string, box: string, origin: string): Promise<Record<string, unknown>> {
  const scans = await scansRepository.findScansInBox(db, collection, box);
  if (scans.length === 0) throw new AppError(HTTP.notFound, 'not_found', `No scans are catalogued in collection "${collection}", box "${box}".`);
  return buildBoxCollection(origin, collection, box, scans);
}

async function exists(filePath: string): Promise<boolean> {
  return fs.access(filePath).then(
    () => true,
    () => false,
  );
}

/**
 * The file answering an image request: the worker's tile when the pyramid has that exact image, else a
 * cached earlier answer, else rendered now by sharp from the page's pixels and cached (written atomically).
 */
export async function getImageFile(
  db: Db,
  storage: Storage,
  scanId: string,
  parameters: { region: string; size: string; rotation: string; qualityAndFormat: string },
): Promise<{ filePath: string; contentType: string }> {
  const file = await findFile(db, scanId);
  const request = parseImageRequest(parameters, file.widthPx, file.heightPx, { maxArea: MAX_AREA_PX });
  const contentType = CONTENT_TYPES[request.format];
  const folder = storage.derivativesKey(file.sha256, file.pageIndex);
  const isTileShaped = request.rotationDegrees === 0 && !request.isMirrored && (request.quality === 'default' || request.quality === 'color') && request.format === 'jpg';
  if (isTileShaped) {
    const [region, size] = request.canonicalPath.split('/');
    const tilePath = storage.pathOf(path.posix.join(folder, TILES_FOLDER, region, size, '0', 'default.jpg'));
    if (await exists(tilePath)) return { filePath: tilePath, contentType };
  }
  const cacheKey = path.posix.join(folder, 'rendered', request.canonicalPath.replace(/[/!]/g, (char) => (char === '/' ? '_' : 'm')));
  const cachedPath = storage.pathOf(cacheKey);
  if (await exists(cachedPath)) return { filePath: cachedPath, contentType };

  if (!(await storage.exists(file.storageKey))) {
    throw new AppError(HTTP.notFound, 'not_found', 'The master file of this scan is missing from storage; its image cannot be made.');
  }
  const source = await findPageSource(storage, file);
  if (!source) throw new AppError(HTTP.conflict, 'derivatives_not_ready', 'The pages of this PDF are still being rendered; try again when its derivatives are ready.');
  const tempPath = storage.newTempPath(`.${request.format}`);
  try {
    let image = source.open();
    if (!request.isFullRegion) image = image.extract({ left: request.region.x, top: request.region.y, width: request.region.width, height: request.region.height });
    image = image.resize(request.width, request.height, { fit: 'fill' });
    if (request.isMirrored) image = image.flop();
    if (request.rotationDegrees !== 0) image = image.rotate(request.rotationDegrees);
    if (request.quality === 'gray' || request.quality === 'bitonal') image = image.grayscale().toColourspace('b-w');
    if (request.quality === 'bitonal') image = image.threshold(128);
    if (request.format === 'jpg') image = image.flatten({ background: '#ffffff' }).jpeg({ quality: 85 });
    else if (request.format === 'png') image = image.png();
    else image = image.webp({ quality: 85 });
    await image.toFile(tempPath);
    await storage.putCache(tempPath, cacheKey);
  } finally {
    await fs.rm(tempPath, { force: true });
  }
  return { filePath: cachedPath, contentType };
}
