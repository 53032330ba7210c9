/**
 * LDLᵀ factorization and solve of a symmetric positive-definite band matrix
 * of half-bandwidth 3: the stiffness of a line of Hermite beam elements with
 * two DOFs (v, θ) per node couples DOF i only to i+1, i+2, i+3. Work is O(n)
 * per factorization and per right-hand side.
 *
 * Storage: `band[i * 4 + d]` = A[i][i + d], d = 0..3 (upper band, row-major).
 * After `factorBand`, `band[i * 4]` holds 1/D[i] and `band[i * 4 + d]` holds
 * L[i + d][i] (the unit lower factor, stored by column).
 */

/**
 * Factors `band` (n × 4) in place. Returns the index of the first pivot that
 * is not positive, or -1 on success. Callers detect mechanisms structurally
 * before factoring (stability.ts): a relative pivot threshold here would
 * wrongly reject valid members with very short elements (a load a few
 * micrometres from a support), whose pivots legitimately span many decades.
 */
export function factorBand(band: Float64Array, n: number): number {
  for (let j = 0; j < n; j++) {
    const row = j * 4;
    const d = band[row];
    if (!(d > 0)) return j;
    // Right-looking update of the trailing block with row j (unscaled), then scale row j by 1/d.
    const last = j + 3 < n ? 3 : n - 1 - j;
    for (let a = 1; a <= last; a++) {
      const uja = band[row + a];
      if (uja === 0) continue;
      const f = uja / d;
      const irow = (j + a) * 4;
      for (let b = a; b <= last; b++) band[irow + (b - a)] -= f * band[row + b];
    }
    const inv = 1 / d;
    for (let a = 1; a <= last; a++) band[row + a] *= inv;
    band[row] = inv;
  }
  return -1;
}

/**
 * Solves A X = B in place for `m` right-hand sides stored interleaved:
 * entry (DOF i, column k) at x[i * m + k]. Interleaving lets the m
 * independent substitutions run side by side in the inner loop; the full
 * band rows (all but the last three) are written out.
 */
export function solveBandMany(band: Float64Array, n: number, x: Float64Array, m: number): void {
  // L Z = B, column by column of L
  for (let j = 0; j < n; j++) {
    const row = j * 4;
    const src = j * m;
    if (j + 3 < n) {
      const l1 = band[row + 1];
      const l2 = band[row + 2];
      const l3 = band[row + 3];
      const d1 = src + m;
      const d2 = d1 + m;
      const d3 = d2 + m;
      for (let k = 0; k < m; k++) {
        const v = x[src + k];
        if (v === 0) continue;
        x[d1 + k] -= l1 * v;
        x[d2 + k] -= l2 * v;
        x[d3 + k] -= l3 * v;
      }
    } else {
      for (let a = 1; j + a < n; a++) {
        const l = band[row + a];
        const dst = (j + a) * m;
        for (let k = 0; k < m; k++) x[dst + k] -= l * x[src + k];
      }
    }
  }
  // X = D⁻¹ Z − Lᵀ X, from the last row up (band[row] holds 1/D)
  for (let j = n - 1; j >= 0; j--) {
    const row = j * 4;
    const dst = j * m;
    const inv = band[row];
    if (j + 3 < n) {
      const l1 = band[row + 1];
      const l2 = band[row + 2];
      const l3 = band[row + 3];
      const s1 = dst + m;
      const s2 = s1 + m;
      const s3 = s2 + m;
      for (let k = 0; k < m; k++) x[dst + k] = x[dst + k] * inv - l1 * x[s1 + k] - l2 * x[s2 + k] - l3 * x[s3 + k];
    } else {
      for (let k = 0; k < m; k++) {
        let s = x[dst + k] * inv;
        for (let a = 1; j + a < n; a++) s -= band[row + a] * x[(j + a) * m + k];
        x[dst + k] = s;
      }
    }
  }
}
