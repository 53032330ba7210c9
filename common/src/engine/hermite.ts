/**
 * The Hermite (cubic) Euler–Bernoulli beam element and the exact
 * clamped–clamped solution of a linearly varying load over the whole element.
 *
 * Conventions: local coordinate ξ = (x − x_i)/le ∈ [0, 1]; DOFs per node are
 * v (m, positive up) and θ = dv/dx (rad, positive counter-clockwise); loads
 * q (N/m) positive down, so EI·v⁗ = −q (domain.md §4).
 *
 * Sources: the stiffness matrix and shape functions are the standard
 * direct-stiffness beam element (domain.md §4, "Direct stiffness method");
 * the consistent nodal loads are ∫N·q over the element, integrated exactly
 * below; the clamped–clamped particular solution was derived by integrating
 * EI·v⁗ = −q four times with v = v′ = 0 at both ends.
 */

/**
 * Adds the element stiffness (per unit EI) of an element of length `le`
 * between DOFs a..a+3 to the upper band (see banded-ldl.ts):
 * (1/le³)[12, 6le, −12, 6le; 6le, 4le², −6le, 2le²; −12, −6le, 12, −6le; 6le, 2le², −6le, 4le²].
 */
export function addElementStiffness(band: Float64Array, a: number, le: number): void {
  const c = 1 / (le * le * le);
  const k12 = 12 * c;
  const k6 = 6 * le * c;
  const k4 = 4 * le * le * c;
  const k2 = 2 * le * le * c;
  const r0 = a * 4;
  band[r0] += k12;
  band[r0 + 1] += k6;
  band[r0 + 2] -= k12;
  band[r0 + 3] += k6;
  band[r0 + 4] += k4;
  band[r0 + 5] -= k6;
  band[r0 + 6] += k2;
  band[r0 + 8] += k12;
  band[r0 + 9] -= k6;
  band[r0 + 12] += k4;
}

/**
 * Adds the consistent (fixed-end) nodal loads of a downward line load varying
 * linearly from wa (ξ = 0) to wb (ξ = 1) to `f` at a, a + stride, a + 2·stride,
 * a + 3·stride (v1, θ1, v2, θ2), as upward forces and counter-clockwise moments:
 * F1 = −le(7wa + 3wb)/20, M1 = −le²(wa/20 + wb/30),
 * F2 = −le(3wa + 7wb)/20, M2 = +le²(wa/30 + wb/20).
 * (Uniform case: ∓wle/2, ∓wle²/12, the textbook fixed-end actions.)
 */
export function addConsistentLoad(f: Float64Array, a: number, stride: number, le: number, wa: number, wb: number): void {
  const l2 = le * le;
  f[a] -= (le * (7 * wa + 3 * wb)) / 20;
  f[a + stride] -= l2 * (wa / 20 + wb / 30);
  f[a + 2 * stride] -= (le * (3 * wa + 7 * wb)) / 20;
  f[a + 3 * stride] += l2 * (wa / 30 + wb / 20);
}

/**
 * Deflection (m, up) at ξ of an element: Hermite interpolation of the nodal
 * values plus the clamped–clamped particular solution of its line load
 * (wa → wb, N/m down), given per unit EI times `invEI`:
 * v_p(ξ) = −le⁴ ξ²(1 − ξ)² [wb(2 + ξ) + wa(3 − ξ)] / (120 EI).
 * v1, t1, v2, t2 are already in m and rad.
 */
export function elementDeflection(
  xi: number,
  le: number,
  v1: number,
  t1: number,
  v2: number,
  t2: number,
  wa: number,
  wb: number,
  invEI: number,
): number {
  const xi2 = xi * xi;
  const xi3 = xi2 * xi;
  const n1 = 1 - 3 * xi2 + 2 * xi3;
  const n2 = le * (xi - 2 * xi2 + xi3);
  const n3 = 3 * xi2 - 2 * xi3;
  const n4 = le * (xi3 - xi2);
  let y = n1 * v1 + n2 * t1 + n3 * v2 + n4 * t2;
  if (wa !== 0 || wb !== 0) {
    const om = 1 - xi;
    const l2 = le * le;
    y -= (l2 * l2 * xi2 * om * om * (wb * (2 + xi) + wa * (3 - xi)) * invEI) / 120;
  }
  return y;
}

/**
 * Monomial coefficients c[0..5] (m) of the element deflection in ξ, written
 * into `c` at `o`: y(ξ) = Σ c_k ξ^k. Used for root finding of y′; values are
 * evaluated with `elementDeflection` (the shape-function form is exact at the nodes).
 */
export function elementCoefficients(
  c: Float64Array,
  o: number,
  le: number,
  v1: number,
  t1: number,
  v2: number,
  t2: number,
  wa: number,
  wb: number,
  invEI: number,
): void {
  const lt1 = le * t1;
  const lt2 = le * t2;
  c[o] = v1;
  c[o + 1] = lt1;
  c[o + 2] = 3 * (v2 - v1) - 2 * lt1 - lt2;
  c[o + 3] = 2 * (v1 - v2) + lt1 + lt2;
  c[o + 4] = 0;
  c[o + 5] = 0;
  if (wa !== 0 || wb !== 0) {
    // ξ²(1−ξ)²(A + Bξ) = Aξ² + (B − 2A)ξ³ + (A − 2B)ξ⁴ + Bξ⁵, A = 3wa + 2wb, B = wb − wa.
    const l2 = le * le;
    const s = (-l2 * l2 * invEI) / 120;
    const A = 3 * wa + 2 * wb;
    const B = wb - wa;
    c[o + 2] += s * A;
    c[o + 3] += s * (B - 2 * A);
    c[o + 4] = s * (A - 2 * B);
    c[o + 5] = s * B;
  }
}
