import { AppError } from '../errors/app-error';
import { parseImageRequest } from './image-request';

const LIMITS = { maxArea: 4096 * 4096 };

function parse(region: string, size: string, rotation = '0', qualityAndFormat = 'default.jpg') {
  return parseImageRequest({ region, size, rotation, qualityAndFormat }, 1300, 700, LIMITS);
}

describe('parseImageRequest', () => {
  it.each([
    // IIIF Image 3.0 §4.7 canonical URI syntax: full region stays "full", size becomes "w,h" (docs/references.md §7).
    ['full', 'max', 'full/1300,700/0/default.jpg'],
    ['square', 'max', '300,0,700,700/700,700/0/default.jpg'],
    ['pct:10,10,50,50', 'max', '130,70,650,350/650,350/0/default.jpg'],
    ['0,0,1300,700', '650,', 'full/650,350/0/default.jpg'],
    ['1024,512,500,500', 'max', '1024,512,276,188/276,188/0/default.jpg'],
    ['full', '!500,500', 'full/500,269/0/default.jpg'],
  ])('when region %s and size %s are asked for, then the canonical path is %s', (region, size, canonicalPath) => {
    const request = parse(region, size);

    expect(request.canonicalPath).toBe(canonicalPath);
  });

  it('when the size would exceed maxArea, then max is scaled down to fit it', () => {
    const request = parseImageRequest({ region: 'full', size: 'max', rotation: '0', qualityAndFormat: 'default.jpg' }, 10_000, 5_000, { maxArea: 1_000_000 });

    expect(request.width * request.height).toBeLessThanOrEqual(1_000_000);
    expect(request.width / request.height).toBeCloseTo(2, 2);
  });

  it('when the rotation is !180, then the image is mirrored and turned half round', () => {
    const request = parse('full', 'max', '!180', 'gray.png');

    expect([request.isMirrored, request.rotationDegrees, request.quality, request.format]).toEqual([true, 180, 'gray', 'png']);
  });

  it.each([
    ['region', () => parse('0,0,0,10', 'max')],
    ['region', () => parse('1300,0,10,10', 'max')],
    ['size', () => parse('full', '1301,')],
    ['size', () => parse('full', 'pct:0')],
    ['rotation', () => parse('full', 'max', '30')],
    ['quality', () => parse('full', 'max', '0', 'sepia.jpg')],
    ['format', () => parse('full', 'max', '0', 'default.tif')],
  ])('when the %s is not allowed, then a 400 names it', (parameter, call) => {
    let error: unknown;

    try {
      call();
    } catch (caught) {
      error = caught;
    }

    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(400);
    expect((error as AppError).details).toEqual({ parameter });
  });
});
