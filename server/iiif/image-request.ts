import { AppError, HTTP } from '../errors/app-error';

/** Largest width or height of a JPEG, px. */
export const MAX_JPEG_SIDE_PX = 65_535;

/** A parsed IIIF Image API 3.0 request, resolved against the image's size. */
export interface ImageRequest {
  /** Region in image pixels (clipped to the image). */
  region: { x: number; y: number; width: number; height: number };
  /** True when the region is the whole image. */
  isFullRegion: boolean;
  /** Output size in pixels. */
  width: number;
  height: number;
  /** Clockwise degrees, a multiple of 90. */
  rotationDegrees: 0 | 90 | 180 | 270;
  /** Mirror (flip left-right) before rotating. */
  isMirrored: boolean;
  quality: 'default' | 'color' | 'gray' | 'bitonal';
  format: 'jpg' | 'png' | 'webp';
  /** Canonical path segments `{region}/{size}/{rotation}/{quality}.{format}`; sharp's iiif3 tiles use this naming. */
  canonicalPath: string;
}

export interface ImageLimits {
  /** Largest output area (width × height) served, px². */
  maxArea: number;
}

function badRequest(parameter: string, message: string): AppError {
  return new AppError(HTTP.badRequest, 'bad_request', `IIIF ${parameter}: ${message}`, { parameter });
}

const INTEGER = /^\d+$/;
const DECIMAL = /^\d+(\.\d+)?$/;

function parseRegion(text: string, widthPx: number, heightPx: number): { x: number; y: number; width: number; height: number } {
  // IIIF Image 3.0 §4.1 region: full | square | x,y,w,h | pct:x,y,w,h (docs/references.md §7).
  if (text === 'full') return { x: 0, y: 0, width: widthPx, height: heightPx };
  if (text === 'square') {
    const side = Math.min(widthPx, heightPx);
    return { x: Math.floor((widthPx - side) / 2), y: Math.floor((heightPx - side) / 2), width: side, height: side };
  }
  const isPercent = text.startsWith('pct:');
  const parts = (isPercent ? text.slice(4) : text).split(',');
  if (parts.length !== 4 || !parts.every((part) => (isPercent ? DECIMAL : INTEGER).test(part))) {
    throw badRequest('region', `"${text}" is not full, square, x,y,w,h or pct:x,y,w,h`);
  }
  let [x, y, w, h] = parts.map(Number);
  if (isPercent) {
    x = Math.round((x / 100) * widthPx);
    y = Math.round((y / 100) * heightPx);
    w = Math.round((w / 100) * widthPx);
    h = Math.round((h / 100) * heightPx);
  }
  if (w <= 0 || h <= 0) throw badRequest('region', 'width and height must be above zero');
  if (x >= widthPx || y >= heightPx) throw badRequest('region', `the region starts outside the ${widthPx} × ${heightPx} image`);
  // A region reaching past the edge is cut at the edge (§4.1).
  return { x, y, width: Math.min(w, widthPx - x), height: Math.min(h, heightPx - y) };
}

function parseSize(text: string, regionWidth: number, regionHeight: number, limits: ImageLimits): { width: number; height: number } {
  // IIIF Image 3.0 §4.2 size: max | ^max | w, | ,h | pct:n | w,h | !w,h, each with an optional ^ (docs/references.md §7).
  const mayUpscale = text.startsWith('^');
  const body = mayUpscale ? text.slice(1) : text;
  const aspect = regionWidth / regionHeight;
  const fitArea = (width: number, height: number) => {
    const scale = Math.min(1, Math.sqrt(limits.maxArea / (width * height)));
    return { width: Math.max(1, Math.floor(width * scale)), height: Math.max(1, Math.floor(height * scale)) };
  };
  let size: { width: number; height: number };
  if (body === 'max') {
    size = fitArea(regionWidth, regionHeight);
    return size;
  }
  let match: RegExpExecArray | null;
  if ((match = /^pct:(\d+(?:\.\d+)?)$/.exec(body))) {
    const percent = Number(match[1]);
    if (percent <= 0) throw badRequest('size', 'pct:n must be above zero');
    size = { width: Math.max(1, Math.round((regionWidth * percent) / 100)), height: Math.max(1, Math.round((regionHeight * percent) / 100)) };
  } else if ((match = /^(\d+),$/.exec(body))) {
    const width = Number(match[1]);
    size = { width, height: Math.max(1, Math.round(width / aspect)) };
  } else if ((match = /^,(\d+)$/.exec(body))) {
    const height = Number(match[1]);
    size = { width: Math.max(1, Math.round(height * aspect)), height };
  } else if ((match = /^(!)?(\d+),(\d+)$/.exec(body))) {
    const width = Number(match[2]);
    const height = Number(match[3]);
    if (match[1]) {
      // !w,h: the largest size that fits inside w × h keeping the aspect ratio (§4.2).
      const scale = Math.min(width / regionWidth, height / regionHeight);
      size = { width: Math.max(1, Math.round(regionWidth * scale)), height: Math.max(1, Math.round(regionHeight * scale)) };
      if (!mayUpscale && scale > 1) size = { width: regionWidth, height: regionHeight };
    } else size = { width, height };
  } else {
    throw badRequest('size', `"${text}" is not max, w,, ,h, w,h, !w,h or pct:n`);
  }
  if (size.width <= 0 || size.height <= 0) throw badRequest('size', 'width and height must be above zero');
  if (!mayUpscale && (size.width > regionWidth || size.height > regionHeight)) {
    throw badRequest('size', `${size.width} × ${size.height} is larger than the ${regionWidth} × ${regionHeight} region; prefix ^ to upscale`);
  }
  // JPEG stores each side in 16 bits (ITU-T T.81, B.2.2): nothing wider or taller than 65 535 px can be encoded.
  if (size.width > MAX_JPEG_SIDE_PX || size.height > MAX_JPEG_SIDE_PX) {
    throw badRequest('size', `${size.width} × ${size.height} is more than the ${MAX_JPEG_SIDE_PX} px a side a JPEG can hold`);
  }
  if (size.width * size.height > limits.maxArea) throw badRequest('size', `${size.width} × ${size.height} is more than the maxArea of ${limits.maxArea} px²`);
  return size;
}

function parseRotation(text: string): { degrees: 0 | 90 | 180 | 270; isMirrored: boolean } {
  // §4.3 rotation: n or !n; we serve multiples of 90 (rotationBy90s, mirroring).
  const match = /^(!)?(0|90|180|270)$/.exec(text);
  if (!match) throw badRequest('rotation', `"${text}" is not 0, 90, 180 or 270 (optionally with ! to mirror)`);
  return { degrees: Number(match[2]) as 0 | 90 | 180 | 270, isMirrored: match[1] === '!' };
}

/** Parses `{region}/{size}/{rotation}/{quality}.{format}` for an image of widthPx × heightPx; a bad parameter is a 400 naming it. */
export function parseImageRequest(
  parameters: { region: string; size: string; rotation: string; qualityAndFormat: string },
  widthPx: number,
  heightPx: number,
  limits: ImageLimits,
): ImageRequest {
  const region = parseRegion(parameters.region, widthPx, heightPx);
  const size = parseSize(parameters.size, region.width, region.height, limits);
  const rotation = parseRotation(parameters.rotation);
  const match = /^(default|color|gray|bitonal)\.(jpg|png|webp)$/.exec(parameters.qualityAndFormat);
  if (!match) {
    const [quality] = parameters.qualityAndFormat.split('.');
    if (!['default', 'color', 'gray', 'bitonal'].includes(quality)) throw badRequest('quality', `"${quality}" is not default, color, gray or bitonal`);
    throw badRequest('format', `"${parameters.qualityAndFormat}" must end in .jpg, .png or .webp`);
  }
  const isFullRegion = region.x === 0 && region.y === 0 && region.width === widthPx && region.height === heightPx;
  const regionText = isFullRegion ? 'full' : `${region.x},${region.y},${region.width},${region.height}`;
  // §4.7 canonical form: size as w,h; rotation without a trailing .0; quality as given.
  const canonicalPath = `${regionText}/${size.width},${size.height}/${rotation.isMirrored ? '!' : ''}${rotation.degrees}/${match[1]}.${match[2]}`;
  return {
    region,
    isFullRegion,
    width: size.width,
    height: size.height,
    rotationDegrees: rotation.degrees,
    isMirrored: rotation.isMirrored,
    quality: match[1] as ImageRequest['quality'],
    format: match[2] as ImageRequest['format'],
    canonicalPath,
  };
}
