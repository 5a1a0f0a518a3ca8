import { applyHomography, fitAffine, fitProjective, fitSimilarity, invert3x3, multiply3x3, type PlanePoint, sumSquaredError } from './homography';

const square: PlanePoint[] = [
  { x: 0, y: 0 },
  { x: 100, y: 0 },
  { x: 100, y: 50 },
  { x: 0, y: 50 },
  { x: 40, y: 20 },
];

describe('homography basics', () => {
  it.each<[string, number[]]>([
    ['a mirrored similarity', [10, 1, 5, 1, -10, 7, 0, 0, 1]],
    ['a projective map', [1.1, 0.2, 3, -0.1, 0.9, 4, 0.001, -0.002, 1]],
  ])('when %s is inverted, then H·H⁻¹ is the identity and points return', (_label, h) => {
    const inverse = invert3x3(h);

    const product = multiply3x3(h, inverse as number[]);
    [1, 0, 0, 0, 1, 0, 0, 0, 1].forEach((value, i) => expect(product[i]).toBeCloseTo(value, 12));
    const p = applyHomography(h, { x: 12, y: -7 });
    const back = applyHomography(inverse as number[], p);
    expect(back.x).toBeCloseTo(12, 9);
    expect(back.y).toBeCloseTo(-7, 9);
  });

  it('when the matrix is singular, then the inverse is null', () => {
    const inverse = invert3x3([1, 2, 3, 2, 4, 6, 0, 0, 1]);

    expect(inverse).toBeNull();
  });
});

describe('fits', () => {
  it.each<[string, (s: PlanePoint[], t: PlanePoint[]) => number[] | null, number[]]>([
    ['similarity (rotation, scale, shift)', fitSimilarity, [8 * Math.cos(0.1), -8 * Math.sin(0.1), 30, 8 * Math.sin(0.1), 8 * Math.cos(0.1), 40, 0, 0, 1]],
    ['similarity with a mirror (paper up, pixels down)', fitSimilarity, [8, 0, 30, 0, -8, 900, 0, 0, 1]],
    ['affine', fitAffine, [8, 0.5, 30, 0.2, -7.5, 900, 0, 0, 1]],
    ['projective', fitProjective, [8, 0.5, 30, 0.2, -7.5, 900, 1e-4, -2e-4, 1]],
  ])('when exact points come from a known %s map, then the fit returns it', (_label, fitMap, truth) => {
    const target = square.map((p) => applyHomography(truth, p));

    const h = fitMap(square, target);

    expect(h).not.toBeNull();
    (h as number[]).forEach((value, i) => expect(value).toBeCloseTo(truth[i], 8));
    expect(sumSquaredError(h as number[], square, target)).toBeLessThan(1e-16);
  });

  it.each<[string, (s: PlanePoint[], t: PlanePoint[]) => number[] | null, PlanePoint[]]>([
    ['affine from collinear points', fitAffine, [{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }, { x: 3, y: 3 }]],
    ['projective from three points', fitProjective, square.slice(0, 3)],
    ['projective with four of five points on a line', fitProjective, [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }, { x: 3, y: 0 }, { x: 1, y: 5 }]],
  ])('when fitting %s, then the fit is null', (_label, fitMap, source) => {
    const h = fitMap(source, source.map((p) => ({ x: 2 * p.x + 1, y: 3 * p.y - 2 })));

    expect(h).toBeNull();
  });
});
