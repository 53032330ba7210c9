/**
 * The Hermite (cubic) Euler–Bernoulli beam element and the exact fixed-end
 * actions of loads anywhere on it.
 *
 * Conventions: local coordinate x from the element's left node (ξ = x/le);
 * DOFs per node v (m, positive up) and θ = dv/dx (rad, positive
 * counter-clockwise); loads positive down, moments positive counter-clockwise;
 * EI·v⁗ = −q (domain.md §4).
 *
 * Sources: the stiffness matrix and shape functions are the standard
 * direct-stiffness beam element (domain.md §4, "Direct stiffness method");
 * the consistent nodal loads are the work-equivalent loads f_i = −P·N_i(a)
 * (force), f_i = M·N_i′(a) (couple) and f_i = −∫N_i·q dx (line load), which
 * for this element equal the exact fixed-end actions with their signs
 * reversed, so nodal displacements are exact.
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
 * Consistent nodal loads [F1, M1, F2, M2] (up, counter-clockwise) of a
 * downward force P at x = a of an element of length le: −P·[N1, N2, N3, N4](a)
 * with N1 = 1 − 3ξ² + 2ξ³, N2 = le(ξ − 2ξ² + ξ³), N3 = 3ξ² − 2ξ³, N4 = le(ξ³ − ξ²).
 * (At midspan: −P/2, −Pl/8, −P/2, +Pl/8, the textbook fixed-end actions.)
 */
export function consistentPoint(le: number, a: number, P: number, out: Float64Array): void {
  const xi = a / le;
  const xi2 = xi * xi;
  const om = 1 - xi;
  out[0] = -P * om * om * (1 + 2 * xi);
  out[1] = -P * le * xi * om * om;
  out[2] = -P * xi2 * (3 - 2 * xi);
  out[3] = P * le * xi2 * om;
}

/**
 * Consistent nodal loads of a counter-clockwise couple M at x = a:
 * M·[N1′, N2′, N3′, N4′](a), derivatives with respect to x.
 */
export function consistentMoment(le: number, a: number, M: number, out: Float64Array): void {
  const xi = a / le;
  const om = 1 - xi;
  const d = (6 * xi * om) / le;
  out[0] = -M * d;
  out[1] = M * om * (1 - 3 * xi);
  out[2] = M * d;
  out[3] = M * xi * (3 * xi - 2);
}

/** N_i^(k)(ξ)/k! for k = 0..3 (Taylor coefficients in ξ), per shape function, le factors left out of N2, N4. */
function taylorShape(xi: number, t: Float64Array): void {
  const xi2 = xi * xi;
  // N1 = 1 − 3ξ² + 2ξ³
  t[0] = 1 - 3 * xi2 + 2 * xi2 * xi;
  t[1] = -6 * xi + 6 * xi2;
  t[2] = -3 + 6 * xi;
  t[3] = 2;
  // N2/le = ξ − 2ξ² + ξ³
  t[4] = xi - 2 * xi2 + xi2 * xi;
  t[5] = 1 - 4 * xi + 3 * xi2;
  t[6] = -2 + 3 * xi;
  t[7] = 1;
  // N3 = 3ξ² − 2ξ³
  t[8] = 3 * xi2 - 2 * xi2 * xi;
  t[9] = 6 * xi - 6 * xi2;
  t[10] = 3 - 6 * xi;
  t[11] = -2;
  // N4/le = ξ³ − ξ²
  t[12] = xi2 * xi - xi2;
  t[13] = 3 * xi2 - 2 * xi;
  t[14] = 3 * xi - 1;
  t[15] = 1;
}

const shape = new Float64Array(16);

/**
 * Consistent nodal loads of a downward line load varying linearly from wa at
 * x = a to wb at x = b (0 ≤ a < b ≤ le): f_i = −∫ N_i q dx, integrated
 * exactly along the load (u ∈ [0, 1], ξ = ξa + Δu, q = wa(1 − u) + wb·u):
 * f_i = −le·Δ·Σ_k [N_i^(k)(ξa)Δ^k/k!]·[wa/((k+1)(k+2)) + wb/(k+2)],
 * free of cancellation even for very short loads.
 * (Uniform over the whole element: −wl/2, −wl²/12, −wl/2, +wl²/12.)
 */
export function consistentLine(le: number, a: number, b: number, wa: number, wb: number, out: Float64Array): void {
  const xi = a / le;
  const delta = (b - a) / le;
  taylorShape(xi, shape);
  let f1 = 0;
  let f2 = 0;
  let f3 = 0;
  let f4 = 0;
  let dk = 1;
  for (let k = 0; k <= 3; k++) {
    const g = dk * (wa / ((k + 1) * (k + 2)) + wb / (k + 2));
    f1 += shape[k] * g;
    f2 += shape[4 + k] * g;
    f3 += shape[8 + k] * g;
    f4 += shape[12 + k] * g;
    dk *= delta;
  }
  const s = -le * delta;
  out[0] = s * f1;
  out[1] = s * le * f2;
  out[2] = s * f3;
  out[3] = s * le * f4;
}
