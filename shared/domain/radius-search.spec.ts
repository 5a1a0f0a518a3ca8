import { findRadiusCurvature } from './radius-search';

describe('findRadiusCurvature', () => {
  it.each<[string, (k: number) => number, number, number]>([
    ['a parabola with its minimum inside', (k) => (k - 0.0083) ** 2, 0.02, 0.0083],
    ['a minimum at zero curvature (straight lines)', (k) => k * k + 1, 0.02, 0],
    ['a minimum at the upper bound', (k) => -k, 0.02, 0.02],
    // A second, shallower dip near 0.015 must not capture the search.
    ['two dips, the deeper at 0.004', (k) => Math.min((k - 0.004) ** 2, (k - 0.015) ** 2 + 1e-6), 0.02, 0.004],
  ])('when the error is %s, then the search finds it', (_label, error, maxCurvature, expected) => {
    const k = findRadiusCurvature(error, maxCurvature);

    expect(k).toBeCloseTo(expected, 8);
  });
});
