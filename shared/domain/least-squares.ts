/**
 * Small dense linear algebra for the pin fits: least squares by Householder QR (stable without
 * forming normal equations) and the symmetric eigenproblem by cyclic Jacobi (for the DLT null vector).
 * Matrices are arrays of rows; sizes here are tiny (≤ 2·pins × 9), so clarity beats speed.
 */

/** Result of a least-squares solve: the solution and the numerical rank seen by QR. */
export interface LeastSquaresSolution {
  x: number[];
  rank: number;
}

/**
 * Solves min ‖A·x − b‖₂ for a tall matrix A (rows ≥ columns). rank < columns means A is rank deficient
 * (relative tolerance 1e-10 on R's diagonal); x is then not meaningful and callers should report the cause.
 */
export function solveLeastSquares(a: number[][], b: number[]): LeastSquaresSolution {
  const rows = a.length;
  const cols = rows > 0 ? a[0].length : 0;
  const r = a.map((row) => row.slice());
  const y = b.slice();
  let maxDiagonal = 0;
  const diagonal: number[] = [];
  for (let k = 0; k < cols; k++) {
    let norm = 0;
    for (let i = k; i < rows; i++) norm += r[i][k] * r[i][k];
    norm = Math.sqrt(norm);
    if (norm === 0) {
      diagonal.push(0);
      continue;
    }
    const alpha = r[k][k] > 0 ? -norm : norm;
    const v: number[] = new Array(rows).fill(0);
    for (let i = k; i < rows; i++) v[i] = r[i][k];
    v[k] -= alpha;
    let vNorm2 = 0;
    for (let i = k; i < rows; i++) vNorm2 += v[i] * v[i];
    if (vNorm2 > 0) {
      for (let j = k; j < cols; j++) {
        let dot = 0;
        for (let i = k; i < rows; i++) dot += v[i] * r[i][j];
        const f = (2 * dot) / vNorm2;
        for (let i = k; i < rows; i++) r[i][j] -= f * v[i];
      }
      let dot = 0;
      for (let i = k; i < rows; i++) dot += v[i] * y[i];
      const f = (2 * dot) / vNorm2;
      for (let i = k; i < rows; i++) y[i] -= f * v[i];
    }
    diagonal.push(Math.abs(r[k][k]));
    maxDiagonal = Math.max(maxDiagonal, Math.abs(r[k][k]));
  }
  const tolerance = maxDiagonal * 1e-10;
  const rank = diagonal.filter((d) => d > tolerance).length;
  const x: number[] = new Array(cols).fill(0);
  if (rank < cols || rows < cols) return { x, rank: Math.min(rank, rows) };
  for (let k = cols - 1; k >= 0; k--) {
    let s = y[k];
    for (let j = k + 1; j < cols; j++) s -= r[k][j] * x[j];
    x[k] = s / r[k][k];
  }
  return { x, rank };
}

/** Eigen-decomposition of a symmetric matrix: eigenvalues ascending, eigenvectors[i] belongs to values[i]. */
export interface SymmetricEigen {
  values: number[];
  vectors: number[][];
}

/** Cyclic Jacobi eigen-decomposition of a symmetric n×n matrix (n ≤ ~20); converges to machine precision. */
export function eigenSymmetric(matrix: number[][]): SymmetricEigen {
  const n = matrix.length;
  const a = matrix.map((row) => row.slice());
  const v: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) off += a[i][j] * a[i][j];
    if (off < 1e-30) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        if (a[p][q] === 0) continue;
        const theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k][p];
          const akq = a[k][q];
          a[k][p] = c * akp - s * akq;
          a[k][q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p][k];
          const aqk = a[q][k];
          a[p][k] = c * apk - s * aqk;
          a[q][k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k][p];
          const vkq = v[k][q];
          v[k][p] = c * vkp - s * vkq;
          v[k][q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => a[i][i] - a[j][j]);
  return { values: order.map((i) => a[i][i]), vectors: order.map((i) => v.map((row) => row[i])) };
}
