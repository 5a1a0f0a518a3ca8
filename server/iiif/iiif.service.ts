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
import { isAdvertisedRequest } from './advertised-image';
import { buildInfoDocument, MAX_AREA_PX, type InfoDocument } from './info-document';
import { RENDER_CACHE_FOLDER, type RenderCache } from './render-cache';
import type { RenderGate } from './render-gate';
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

/** Where an image answer comes from: a file the worker made (never removed), or bytes rendered or read from the cache. */
export type ImageAnswer = { contentType: string } & ({ filePath: string } | { bytes: Buffer });

/** What an image request needs beside the database and storage: the bounded cache and the render throttle. */
export interface ImageRendering {
  cache: RenderCache;
  gate: RenderGate;
}

/**
 * The answer to an image request: the worker's tile when the pyramid has that exact image; else, for a tile
 * or size the info.json advertises, the cached answer or one rendered now and cached; else one rendered now
 * and not kept. Every render waits its turn at the gate.
 */
export async function getImage(
  db: Db,
  storage: Storage,
  rendering: ImageRendering,
  scanId: string,
  parameters: { region: string; size: string; rotation: string; qualityAndFormat: string },
): Promise<ImageAnswer> {
  const file = await findFile(db, scanId);
  const request = parseImageRequest(parameters, file.widthPx, file.heightPx, { maxArea: MAX_AREA_PX });
  const contentType = CONTENT_TYPES[request.format];
  const isAdvertised = isAdvertisedRequest(request, file.widthPx, file.heightPx);
  if (isAdvertised) {
    const [region, size] = request.canonicalPath.split('/');
    const tilePath = storage.pathOf(path.posix.join(storage.derivativesKey(file.sha256, file.pageIndex), TILES_FOLDER, region, size, '0', 'default.jpg'));
    if (await exists(tilePath)) return { filePath: tilePath, contentType };
  }
  const cacheKey = path.posix.join(
    RENDER_CACHE_FOLDER,
    `${file.sha256}-p${file.pageIndex}`,
    request.canonicalPath.replace(/[/!]/g, (char) => (char === '/' ? '_' : 'm')),
  );
  if (isAdvertised) {
    const cached = await rendering.cache.read(cacheKey);
    if (cached) return { bytes: cached, contentType };
  }
  const bytes = await rendering.gate.run(() => renderImage(storage, file, request));
  if (isAdvertised) await rendering.cache.write(cacheKey, bytes);
  return { bytes, contentType };
}

/** Renders the request from the page's pixels with sharp. */
async function renderImage(storage: Storage, file: ScanFile, request: ImageRequest): Promise<Buffer> {
  if (!(await storage.exists(file.storageKey))) {
    throw new AppError(HTTP.notFound, 'not_found', 'The master file of this scan is missing from storage; its image cannot be made.');
  }
  const source = await findPageSource(storage, file);
  if (!source) throw new AppError(HTTP.conflict, 'derivatives_not_ready', 'The pages of this PDF are still being rendered; try again when its derivatives are ready.');
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
  return image.toBuffer();
}
