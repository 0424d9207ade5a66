// Independent reference for the characteristic exponent, used only by tests: the one-period monodromy
// matrix of w'' + (a − 2q cos 2ξ) w = 0 over ξ ∈ [0, π], integrated with the 3-stage Gauss–Legendre
// collocation method (order 6; E. Hairer, C. Lubich, G. Wanner, Geometric Numerical Integration, 2nd ed.
// 2006, Table II.1.1). Floquet theory: cos πν = ½ trace of the monodromy matrix (DLMF 28.2.16–28.2.20 area).

const SQRT15 = Math.sqrt(15);
const C = [0.5 - SQRT15 / 10, 0.5, 0.5 + SQRT15 / 10];
const A = [
  [5 / 36, 2 / 9 - SQRT15 / 15, 5 / 36 - SQRT15 / 30],
  [5 / 36 + SQRT15 / 24, 2 / 9, 5 / 36 - SQRT15 / 24],
  [5 / 36 + SQRT15 / 30, 2 / 9 + SQRT15 / 15, 5 / 36],
];
const B = [5 / 18, 4 / 9, 5 / 18];

function solve(matrix: number[][], rhs: number[]): number[] {
  const n = rhs.length;
  const m = matrix.map((row, i) => [...row, rhs[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    for (let r = col + 1; r < n; r++) {
      const factor = m[r][col] / m[col][col];
      for (let c = col; c <= n; c++) m[r][c] -= factor * m[col][c];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c];
    x[r] = s / m[r][r];
  }
  return x;
}

/** Monodromy matrix [[u(π), w(π)], [u'(π), w'(π)]] with u(0)=1,u'(0)=0, w(0)=0,w'(0)=1. */
export function monodromy(a: number, q: number, steps = 400): number[][] {
  const h = Math.PI / steps;
  // Columns: two fundamental solutions, each [w, w'].
  const columns = [
    [1, 0],
    [0, 1],
  ];
  for (let s = 0; s < steps; s++) {
    const t0 = s * h;
    const k = C.map((c) => a - 2 * q * Math.cos(2 * (t0 + c * h))); // w'' = −k w
    // Unknowns per stage i: K_i = [Kw_i, Kv_i]; Kw_i = v + hΣA_ij Kv_j; Kv_i = −k_i (w + hΣA_ij Kw_j).
    const matrix: number[][] = [];
    for (let i = 0; i < 3; i++) {
      const rowW = new Array<number>(6).fill(0);
      const rowV = new Array<number>(6).fill(0);
      rowW[2 * i] = 1;
      rowV[2 * i + 1] = 1;
      for (let j = 0; j < 3; j++) {
        rowW[2 * j + 1] -= h * A[i][j];
        rowV[2 * j] += k[i] * h * A[i][j];
      }
      matrix.push(rowW, rowV);
    }
    for (const col of columns) {
      const rhs: number[] = [];
      for (let i = 0; i < 3; i++) rhs.push(col[1], -k[i] * col[0]);
      const stages = solve(matrix, rhs);
      let dw = 0;
      let dv = 0;
      for (let i = 0; i < 3; i++) {
        dw += B[i] * stages[2 * i];
        dv += B[i] * stages[2 * i + 1];
      }
      col[0] += h * dw;
      col[1] += h * dv;
    }
  }
  return [
    [columns[0][0], columns[1][0]],
    [columns[0][1], columns[1][1]],
  ];
}

/** ½ trace of the monodromy matrix = cos πν. */
export function halfTraceByIntegration(a: number, q: number, steps = 400): number {
  const m = monodromy(a, q, steps);
  return 0.5 * (m[0][0] + m[1][1]);
}
