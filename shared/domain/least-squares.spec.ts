import { eigenSymmetric, solveLeastSquares } from './least-squares';

describe('solveLeastSquares', () => {
  it.each<[string, number[][], number[], number[]]>([
    ['a square system', [[2, 1], [1, 3]], [3, 5], [0.8, 1.4]],
    ['an exact line through three points', [[1, 0], [1, 1], [1, 2]], [1, 3, 5], [1, 2]],
    // Least squares through (0,0), (1,1), (2,1): slope 0.5, intercept 1/6 (normal equations by hand).
    ['a line through three scattered points', [[1, 0], [1, 1], [1, 2]], [0, 1, 1], [1 / 6, 0.5]],
  ])('when solving %s, then x is the least-squares solution', (_label, a, b, expected) => {
    const { x, rank } = solveLeastSquares(a, b);

    expect(rank).toBe(expected.length);
    x.forEach((value, i) => expect(value).toBeCloseTo(expected[i], 12));
  });

  it.each<[string, number[][]]>([
    ['two equal columns', [[1, 1], [2, 2], [3, 3]]],
    ['a zero column', [[0, 1], [0, 2], [0, 3]]],
  ])('when the matrix has %s, then the rank shows the deficiency', (_label, a) => {
    const { rank } = solveLeastSquares(a, [1, 2, 3]);

    expect(rank).toBeLessThan(2);
  });
});

describe('eigenSymmetric', () => {
  it.each<[string, number[][], number[]]>([
    ['a diagonal matrix', [[3, 0, 0], [0, 1, 0], [0, 0, 2]], [1, 2, 3]],
    // [[2,1],[1,2]] has eigenvalues 1 and 3 (characteristic polynomial (2−λ)² − 1).
    ['a 2×2 symmetric matrix', [[2, 1], [1, 2]], [1, 3]],
  ])('when given %s, then eigenvalues come ascending and A·v = λ·v', (_label, matrix, expected) => {
    const { values, vectors } = eigenSymmetric(matrix);

    values.forEach((value, i) => expect(value).toBeCloseTo(expected[i], 12));
    vectors.forEach((v, i) => {
      const av = matrix.map((row) => row.reduce((s, m, j) => s + m * v[j], 0));
      av.forEach((component, j) => expect(component).toBeCloseTo(values[i] * v[j], 12));
    });
  });
});
