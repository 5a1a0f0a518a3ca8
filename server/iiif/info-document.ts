import { IIIF_TILE_SIZE_PX } from '@shared/api/routes';

export const IMAGE_CONTEXT = 'http://iiif.io/api/image/3/context.json';
/** IIIF Image 3.0 §5.1: the info document's media type (jsonldMediaType, a level-1 feature). */
export const INFO_MEDIA_TYPE = `application/ld+json;profile="${IMAGE_CONTEXT}"`;
/** Largest image area one request is served, px²: a 300 MB master never travels whole to a browser. */
export const MAX_AREA_PX = 4096 * 4096;

/** Scale factors of the tile pyramid: halvings until the whole image fits one tile (what libvips's iiif3 layout makes). */
export function scaleFactors(widthPx: number, heightPx: number): number[] {
  const factors = [1];
  while (Math.max(widthPx, heightPx) / factors[factors.length - 1] > IIIF_TILE_SIZE_PX) factors.push(factors[factors.length - 1] * 2);
  return factors;
}

export interface InfoDocument {
  '@context': string;
  id: string;
  type: 'ImageService3';
  protocol: 'http://iiif.io/api/image';
  profile: 'level2';
  width: number;
  height: number;
  maxArea: number;
  sizes: { width: number; height: number }[];
  tiles: { width: number; height: number; scaleFactors: number[] }[];
  preferredFormats: string[];
  extraFormats: string[];
  extraQualities: string[];
  extraFeatures: string[];
}

/**
 * The info.json of one scan (IIIF Image 3.0 §5, required properties as in docs/references.md §7): level 2
 * (regionByPct, sizeByPct, sizeByConfinedWh, rotationBy90s, color/gray and png are all cheap with sharp).
 */
export function buildInfoDocument(baseUri: string, widthPx: number, heightPx: number): InfoDocument {
  const factors = scaleFactors(widthPx, heightPx);
  const sizes = factors
    .map((factor) => ({ width: Math.ceil(widthPx / factor), height: Math.ceil(heightPx / factor) }))
    .filter((size) => size.width * size.height <= MAX_AREA_PX)
    .reverse();
  return {
    '@context': IMAGE_CONTEXT,
    id: baseUri,
    type: 'ImageService3',
    protocol: 'http://iiif.io/api/image',
    profile: 'level2',
    width: widthPx,
    height: heightPx,
    maxArea: MAX_AREA_PX,
    sizes,
    tiles: [{ width: IIIF_TILE_SIZE_PX, height: IIIF_TILE_SIZE_PX, scaleFactors: factors }],
    preferredFormats: ['jpg'],
    extraFormats: ['webp'],
    extraQualities: ['bitonal'],
    extraFeatures: ['mirroring', 'sizeUpscaling'],
  };
}
