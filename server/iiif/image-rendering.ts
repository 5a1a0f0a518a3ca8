import type { Response } from 'express';
import type { Logger } from 'pino';
import type { Config } from '../config';
import type { Storage } from '../storage/storage';
import type { ImageAnswer, ImageRendering } from './iiif.service';
import { RenderCache } from './render-cache';
import { RenderGate } from './render-gate';

/** Renders sharp runs at once for image requests (the machine has few cores), and how many may wait behind them. */
const RENDERS_AT_ONCE = 2;
const RENDERS_WAITING = 16;

/** One cache and one gate for the whole app: the IIIF routes and the lesson region images share them. */
export function createImageRendering(storage: Storage, config: Config, logger: Logger): ImageRendering {
  return { cache: new RenderCache(storage, config.iiifCacheMaxBytes, logger), gate: new RenderGate(RENDERS_AT_ONCE, RENDERS_WAITING) };
}

/** Sends an image answer: a worker's file from disk, or the bytes in hand. */
export function sendImage(res: Response, image: ImageAnswer, cacheControl: string): void {
  const headers = { 'Content-Type': image.contentType, 'Cache-Control': cacheControl };
  if ('filePath' in image) res.sendFile(image.filePath, { dotfiles: 'allow', headers });
  else res.set(headers).send(image.bytes);
}
