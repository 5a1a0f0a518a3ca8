import { isAdvertisedRequest } from './advertised-image';
import { parseImageRequest } from './image-request';

function isAdvertised(region: string, size: string, rotation = '0', qualityAndFormat = 'default.jpg'): boolean {
  // A 1300 × 700 scan: 512 px tiles at scale factors 1, 2 and 4; sizes 325 × 175, 650 × 350 and 1300 × 700.
  const request = parseImageRequest({ region, size, rotation, qualityAndFormat }, 1300, 700, { maxArea: 4096 * 4096 });
  return isAdvertisedRequest(request, 1300, 700);
}

describe('isAdvertisedRequest', () => {
  it.each([
    // IIIF Image 3.0 §5.6 tiles: region a tile square at one scale factor, clipped at the edge, size the square over the factor (docs/references.md §7).
    ['0,0,512,512', '512,512'],
    ['512,0,512,512', '512,'],
    ['1024,512,276,188', '276,188'],
    ['0,0,1024,700', '512,350'],
    ['1024,0,276,700', '138,350'],
    // §5.6 sizes: the whole image at a listed size, asked as w,h, w, or max.
    ['full', '650,350'],
    ['full', '325,'],
    ['full', 'max'],
  ])('when region %s at size %s is asked for, then it is advertised', (region, size) => {
    expect(isAdvertised(region, size)).toBe(true);
  });

  it.each([
    ['a region off the tile grid', '10,10,300,300', '150,', '0', 'default.jpg'],
    ['a tile at a size no scale factor gives', '0,0,512,512', '256,256', '0', 'default.jpg'],
    ['a whole image at an unlisted size', 'full', '640,', '0', 'default.jpg'],
    ['a rotated tile', '0,0,512,512', '512,512', '90', 'default.jpg'],
    ['a mirrored tile', '0,0,512,512', '512,512', '!0', 'default.jpg'],
    ['a grey tile', '0,0,512,512', '512,512', '0', 'gray.jpg'],
    ['a tile as PNG', '0,0,512,512', '512,512', '0', 'default.png'],
  ])('when %s is asked for, then it is not advertised', (_what, region, size, rotation, qualityAndFormat) => {
    expect(isAdvertised(region, size, rotation, qualityAndFormat)).toBe(false);
  });
});
