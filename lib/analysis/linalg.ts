/**
 * Dense linear algebra for the engine. mathjs has no SVD, so the singular value decomposition comes
 * from ml-matrix (a port of the JAMA one-sided Golub–Kahan–Reinsch SVD: backward stable, the standard
 * dense method). Full null spaces need a full V, so the matrix is padded with zero rows first (a zero
 * row changes neither the singular values nor the right singular vectors).
 */
import { Matrix, SingularValueDecomposition } from "ml-matrix";

export interface RightSvd {
  /** singular values, descending, length min(rows, cols) of the original matrix */
  s: number[];
  /** all right singular vectors as columns (cols × cols), ordered like s and then the rest */
  V: Matrix;
}

/** SVD with a full set of right singular vectors. */
export function svdRight(A: Matrix): RightSvd {
  const m = A.rows;
  const n = A.columns;
  const padded = m >= n ? A : Matrix.zeros(n, n).setSubMatrix(A, 0, 0);
  const svd = new SingularValueDecomposition(padded, {
    computeLeftSingularVectors: false,
    computeRightSingularVectors: true,
    autoTranspose: false,
  });
  const raw = svd.diagonal;
  const order = raw
    .map((v, i) => [v, i] as const)
    .sort((a, b) => b[0] - a[0])
    .map(([, i]) => i);
  const V = new Matrix(n, n);
  order.forEach((src, dst) => V.setColumn(dst, svd.rightSingularVectors.getColumn(src)));
  return { s: order.slice(0, Math.min(m, n)).map((i) => raw[i]), V };
}

/** Numerical rank: singular values above tolerance × σ_max (analysis.md §2). */
export function rankOf(s: number[], tolerance: number): number {
  const max = s.length ? s[0] : 0;
  if (!(max > 0)) return 0;
  return s.filter((v) => v > tolerance * max).length;
}

/** Columns [from, to) of a matrix as a new matrix. */
export function columns(M: Matrix, from: number, to: number): Matrix {
  if (to <= from) return new Matrix(M.rows, 0);
  return M.subMatrix(0, M.rows - 1, from, to - 1);
}

/** Orthonormal basis (columns) of the null space of A, by SVD; `rank` is supplied when known. */
export function nullSpace(A: Matrix, rank?: number, tolerance = 1e-10): Matrix {
  const { s, V } = svdRight(A);
  const r = rank ?? rankOf(s, tolerance);
  return columns(V, r, A.columns);
}

/**
 * Reduced row-echelon form with partial pivoting (Gauss–Jordan). Columns whose remaining entries are all
 * below `tol` × the largest entry are not pivots. Returns the rows and the pivot column of each row.
 */
export function rref(rowsIn: number[][], tol = 1e-9): { rows: number[][]; pivots: number[] } {
  const rows = rowsIn.map((r) => r.slice());
  const k = rows.length;
  const m = k ? rows[0].length : 0;
  const scaleRef = Math.max(1e-300, ...rows.flat().map(Math.abs));
  const pivots: number[] = [];
  let pr = 0;
  for (let j = 0; j < m && pr < k; j++) {
    let best = pr;
    for (let i = pr + 1; i < k; i++) if (Math.abs(rows[i][j]) > Math.abs(rows[best][j])) best = i;
    if (Math.abs(rows[best][j]) <= tol * scaleRef) continue;
    [rows[pr], rows[best]] = [rows[best], rows[pr]];
    const p = rows[pr][j];
    for (let c = 0; c < m; c++) rows[pr][c] /= p;
    for (let i = 0; i < k; i++) {
      if (i === pr) continue;
      const f = rows[i][j];
      if (f !== 0) for (let c = 0; c < m; c++) rows[i][c] -= f * rows[pr][c];
    }
    pivots.push(j);
    pr++;
  }
  return { rows: rows.slice(0, pr), pivots };
}

/**
 * Picks an orthonormal basis of span(Q) (Q with orthonormal columns) whose vectors lie as close as the
 * space allows to the given candidate directions (unit coordinate vectors): greedily take the candidate
 * with the longest projection onto what is left of the space, normalise it, remove it, repeat.
 */
export function alignBasis(Q: Matrix, candidates: number[]): Matrix {
  const n = Q.rows;
  const q = Q.columns;
  // in Q's coordinates: e_idx projects to row idx of Q (Q orthonormal), a chosen vector b = Q β, and
  // lengths are kept, so each candidate costs O(q · chosen) rather than O(n · q)
  const rowOf = (idx: number) => Q.getRow(idx);
  const chosen: number[][] = [];
  for (let step = 0; step < q; step++) {
    let best: number[] | null = null;
    let bestNorm = -1;
    for (const idx of candidates) {
      // π = Qᵀ e_idx − Σ β (β · Qᵀ e_idx)
      const r = rowOf(idx);
      const p = r.slice();
      for (const b of chosen) {
        let coef = 0;
        for (let c = 0; c < q; c++) coef += b[c] * r[c];
        if (coef !== 0) for (let c = 0; c < q; c++) p[c] -= coef * b[c];
      }
      let len = 0;
      for (let c = 0; c < q; c++) len += p[c] * p[c];
      len = Math.sqrt(len);
      if (len > bestNorm + 1e-12) {
        bestNorm = len;
        best = p;
      }
    }
    if (!best || bestNorm < 1e-12) break;
    chosen.push(best.map((v) => v / bestNorm));
  }
  const out = new Matrix(n, chosen.length);
  chosen.forEach((beta, col) => {
    const v = new Array<number>(n).fill(0);
    for (let c = 0; c < q; c++) if (beta[c] !== 0) for (let i = 0; i < n; i++) v[i] += beta[c] * Q.get(i, c);
    out.setColumn(col, v);
  });
  return out;
}
