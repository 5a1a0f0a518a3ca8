import { eigenSymmetric, solveLeastSquares } from './least-squares';

/** A point in a plane: paper mm or scan pixels, depending on the caller. */
export interface PlanePoint {
  x: number;
  y: number;
}

/** Applies a row-major 3×3 homography to a point; returns NaN coordinates for points mapped to infinity. */
export function applyHomography(h: readonly number[], point: PlanePoint): PlanePoint {
  const w = h[6] * point.x + h[7] * point.y + h[8];
  return { x: (h[0] * point.x + h[1] * point.y + h[2]) / w, y: (h[3] * point.x + h[4] * point.y + h[5]) / w };
}

/** Product a·b of two row-major 3×3 matrices. */
export function multiply3x3(a: readonly number[], b: readonly number[]): number[] {
  const out = new Array<number>(9).fill(0);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let k = 0; k < 3; k++) out[i * 3 + j] += a[i * 3 + k] * b[k * 3 + j];
  return out;
}

/** Inverse of a row-major 3×3 matrix; null when it is singular (|det| below 1e-300). */
export function invert3x3(m: readonly number[]): number[] | null {
  const [a, b, c, d, e, f, g, h, i] = m;
  const co00 = e * i - f * h;
  const co01 = -(d * i - f * g);
  const co02 = d * h - e * g;
  const det = a * co00 + b * co01 + c * co02;
  if (!Number.isFinite(det) || Math.abs(det) < 1e-300) return null;
  const inv = [
    co00, -(b * i - c * h), b * f - c * e,
    co01, a * i - c * g, -(a * f - c * d),
    co02, -(a * h - b * g), a * e - b * d,
  ];
  return inv.map((x) => x / det);
}

/** Scales a homography so its last element is 1 (when it is not ~0), for readable output. */
function normaliseScale(h: number[]): number[] {
  const s = Math.abs(h[8]) > 1e-12 ? h[8] : 1;
  return h.map((x) => x / s);
}

/**
 * Hartley normalisation: moves the centroid to the origin and scales the mean distance to √2,
 * so that the fits see coordinates of order 1 whatever the scan resolution.
 */
function normalisingTransform(points: PlanePoint[]): number[] {
  const n = points.length;
  const cx = points.reduce((s, p) => s + p.x, 0) / n;
  const cy = points.reduce((s, p) => s + p.y, 0) / n;
  const meanDistance = points.reduce((s, p) => s + Math.hypot(p.x - cx, p.y - cy), 0) / n;
  const s = meanDistance > 0 ? Math.SQRT2 / meanDistance : 1;
  return [s, 0, -s * cx, 0, s, -s * cy, 0, 0, 1];
}

/** Fits in normalised coordinates, then maps the result back: H = T_dst⁻¹ · Hn · T_src. */
function fitNormalised(source: PlanePoint[], target: PlanePoint[], fitMap: (s: PlanePoint[], t: PlanePoint[]) => number[] | null): number[] | null {
  const tSource = normalisingTransform(source);
  const tTarget = normalisingTransform(target);
  const hn = fitMap(source.map((p) => applyHomography(tSource, p)), target.map((p) => applyHomography(tTarget, p)));
  const tTargetInverse = invert3x3(tTarget);
  if (hn === null || tTargetInverse === null) return null;
  return normaliseScale(multiply3x3(tTargetInverse, multiply3x3(hn, tSource)));
}

/** Sum of squared distances between mapped sources and targets. */
export function sumSquaredError(h: readonly number[], source: PlanePoint[], target: PlanePoint[]): number {
  return source.reduce((s, p, i) => {
    const q = applyHomography(h, p);
    return s + (q.x - target[i].x) ** 2 + (q.y - target[i].y) ** 2;
  }, 0);
}

function fitSimilarityRaw(source: PlanePoint[], target: PlanePoint[], isMirrored: boolean): number[] | null {
  // Proper: x = a·u − b·v + tx, y = b·u + a·v + ty. Mirrored (paper v up, pixel y down): v → −v.
  const m = isMirrored ? -1 : 1;
  const rows: number[][] = [];
  const rhs: number[] = [];
  for (let i = 0; i < source.length; i++) {
    const { x: u, y: v0 } = source[i];
    const v = m * v0;
    rows.push([u, -v, 1, 0]);
    rhs.push(target[i].x);
    rows.push([v, u, 0, 1]);
    rhs.push(target[i].y);
  }
  const { x, rank } = solveLeastSquares(rows, rhs);
  if (rank < 4) return null;
  const [a, b, tx, ty] = x;
  return [a, -b * m, tx, b, a * m, ty, 0, 0, 1];
}

/**
 * Least-squares similarity (rotation, uniform scale, translation; a mirror image allowed, since paper v
 * grows up while pixel y grows down). Needs ≥ 2 distinct points; null when degenerate.
 */
export function fitSimilarity(source: PlanePoint[], target: PlanePoint[]): number[] | null {
  const candidates = [false, true]
    .map((isMirrored) => fitNormalised(source, target, (s, t) => fitSimilarityRaw(s, t, isMirrored)))
    .filter((h): h is number[] => h !== null);
  if (candidates.length === 0) return null;
  return candidates.reduce((best, h) => (sumSquaredError(h, source, target) < sumSquaredError(best, source, target) ? h : best));
}

/** Least-squares affine map (6 parameters). Needs ≥ 3 non-collinear points; null when degenerate. */
export function fitAffine(source: PlanePoint[], target: PlanePoint[]): number[] | null {
  return fitNormalised(source, target, (s, t) => {
    const rows = s.map((p) => [p.x, p.y, 1]);
    const fx = solveLeastSquares(rows, t.map((p) => p.x));
    const fy = solveLeastSquares(rows, t.map((p) => p.y));
    if (fx.rank < 3 || fy.rank < 3) return null;
    return [...fx.x, ...fy.x, 0, 0, 1];
  });
}

/** Normalised DLT: the homography is the eigenvector of AᵀA with the smallest eigenvalue. */
function fitProjectiveDlt(s: PlanePoint[], t: PlanePoint[]): number[] | null {
  const ata: number[][] = Array.from({ length: 9 }, () => new Array<number>(9).fill(0));
  const addRow = (row: number[]) => {
    for (let i = 0; i < 9; i++) for (let j = 0; j < 9; j++) ata[i][j] += row[i] * row[j];
  };
  for (let i = 0; i < s.length; i++) {
    const { x: u, y: v } = s[i];
    const { x, y } = t[i];
    addRow([u, v, 1, 0, 0, 0, -x * u, -x * v, -x]);
    addRow([0, 0, 0, u, v, 1, -y * u, -y * v, -y]);
  }
  const { values, vectors } = eigenSymmetric(ata);
  const largest = Math.max(...values.map(Math.abs));
  // A second (near-)null vector means the points do not pin the homography down (too many on one line).
  if (!(largest > 0) || values[1] < largest * 1e-12) return null;
  return refineProjective(normaliseScale(vectors[0]), s, t);
}

/** Gauss–Newton on the pixel (geometric) error, starting from the DLT (algebraic) solution. */
function refineProjective(start: number[], s: PlanePoint[], t: PlanePoint[]): number[] {
  if (Math.abs(start[8]) < 1e-12) return start;
  let h = start.slice();
  let error = sumSquaredError(h, s, t);
  for (let iteration = 0; iteration < 20; iteration++) {
    const rows: number[][] = [];
    const rhs: number[] = [];
    for (let i = 0; i < s.length; i++) {
      const { x: u, y: v } = s[i];
      const w = h[6] * u + h[7] * v + 1;
      const px = (h[0] * u + h[1] * v + h[2]) / w;
      const py = (h[3] * u + h[4] * v + h[5]) / w;
      rows.push([u / w, v / w, 1 / w, 0, 0, 0, (-px * u) / w, (-px * v) / w]);
      rhs.push(t[i].x - px);
      rows.push([0, 0, 0, u / w, v / w, 1 / w, (-py * u) / w, (-py * v) / w]);
      rhs.push(t[i].y - py);
    }
    const { x: step, rank } = solveLeastSquares(rows, rhs);
    if (rank < 8) break;
    const next = [...h.slice(0, 8).map((value, k) => value + step[k]), 1];
    const nextError = sumSquaredError(next, s, t);
    if (!(nextError < error)) break;
    const isConverged = error - nextError < 1e-14 * (1 + error);
    h = next;
    error = nextError;
    if (isConverged) break;
  }
  return h;
}

/** Least-squares projective map (8 parameters, normalised DLT then geometric refinement). Needs ≥ 4 points, no 3 of 4 collinear. */
export function fitProjective(source: PlanePoint[], target: PlanePoint[]): number[] | null {
  if (source.length < 4) return null;
  return fitNormalised(source, target, fitProjectiveDlt);
}
