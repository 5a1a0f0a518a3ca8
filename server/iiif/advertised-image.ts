import { IIIF_TILE_SIZE_PX } from '@shared/api/routes';
import type { ImageRequest } from './image-request';
import { buildInfoDocument } from './info-document';

/**
 * True when the request is one the info.json offers: a tile of the pyramid (§5.6 tiles: region a tile's
 * square at one scale factor, clipped at the edge, size that square divided by the factor) or one of the
 * listed full-image sizes (§5.6 sizes), unrotated, in the default quality as JPEG. Only these are cached: a
 * viewer asks for them again and again, and they are few, where any other region or size is a new file each
 * time (finding 3 of issue 13: distinct requests could fill the disk).
 */
export function isAdvertisedRequest(request: ImageRequest, widthPx: number, heightPx: number): boolean {
  if (request.rotationDegrees !== 0 || request.isMirrored || request.format !== 'jpg') return false;
  if (request.quality !== 'default' && request.quality !== 'color') return false;
  const info = buildInfoDocument('', widthPx, heightPx);
  if (request.isFullRegion && info.sizes.some((size) => size.width === request.width && size.height === request.height)) return true;
  const { x, y, width, height } = request.region;
  return info.tiles[0].scaleFactors.some((factor) => {
    const span = IIIF_TILE_SIZE_PX * factor;
    if (x % span !== 0 || y % span !== 0) return false;
    if (width !== Math.min(span, widthPx - x) || height !== Math.min(span, heightPx - y)) return false;
    return request.width === Math.ceil(width / factor) && request.height === Math.ceil(height / factor);
  });
}
