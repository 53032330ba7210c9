/**
 * Real roots of small polynomials on the open unit interval, to full double
 * precision, without sampling: the roots of p′ (found the same way,
 * recursively) split (0, 1) into stretches where p is monotonic, so each
 * stretch holds at most one root, bracketed by a sign change and refined by
 * Newton steps kept inside the bracket (bisection when a step leaves it).
 * Used on y′ of one element (degree ≤ 4) to locate deflection extremes
 * (domain.md §6: "find it as a root of y′ on the exact curve").
 */

const MAX_DEGREE = 5;
/** Coefficient buffers per recursion level: level k holds the k-th derivative. */
const levels: Float64Array[] = Array.from({ length: MAX_DEGREE + 1 }, () => new Float64Array(MAX_DEGREE + 1));
/** Root buffers per recursion level. */
const levelRoots: Float64Array[] = Array.from({ length: MAX_DEGREE + 1 }, () => new Float64Array(MAX_DEGREE + 1));

function horner(p: Float64Array, deg: number, x: number): number {
  let s = p[deg];
  for (let k = deg - 1; k >= 0; k--) s = s * x + p[k];
  return s;
}

/**
 * Newton–bisection on [lo, hi] where p(lo) = plo and p(hi) = phi have
 * opposite signs: starts at the secant point, takes Newton steps while they
 * stay inside the shrinking bracket, bisects otherwise; stops at full double
 * precision (a Newton step below 1e-10, or a step of a few ulps).
 */
function refine(p: Float64Array, deg: number, lo: number, hi: number, plo: number, phi: number): number {
  let x = lo + (hi - lo) * (plo / (plo - phi));
  if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
  for (let iter = 0; iter < 100; iter++) {
    let f = p[deg];
    let df = 0;
    for (let k = deg - 1; k >= 0; k--) {
      df = df * x + f;
      f = f * x + p[k];
    }
    if (f === 0) return x;
    if ((f < 0) === (plo < 0)) lo = x;
    else hi = x;
    let next = x - f / df;
    const newton = next > lo && next < hi;
    if (!newton) next = 0.5 * (lo + hi);
    const step = next - x;
    const size = step < 0 ? -step : step;
    // Newton converges quadratically: once a Newton step is below 1e-10 (the interval is
    // the unit one), the point it lands on is accurate to about 1e-20, i.e. to the last bit.
    if ((newton && size <= 1e-10) || size <= 4e-16 * (x < 0 ? -x : x) || next === lo || next === hi) return next;
    x = next;
  }
  return x;
}

/** Roots in (0, 1) of p0 + p1 ξ + p2 ξ² (cancellation-free quadratic formula), ascending into out; returns the count. */
function quadraticRoots(p0: number, p1: number, p2: number, out: Float64Array): number {
  if (p2 === 0) {
    if (p1 === 0) return 0;
    const r = -p0 / p1;
    if (r > 0 && r < 1) {
      out[0] = r;
      return 1;
    }
    return 0;
  }
  const disc = p1 * p1 - 4 * p2 * p0;
  if (disc < 0) return 0;
  const sq = Math.sqrt(disc);
  const q = -0.5 * (p1 < 0 ? p1 - sq : p1 + sq);
  if (q === 0) return 0; // p0 = p1 = 0: the only root is ξ = 0
  let r1 = q / p2;
  let r2 = p0 / q;
  if (r1 > r2) {
    const t = r1;
    r1 = r2;
    r2 = t;
  }
  let count = 0;
  if (r1 > 0 && r1 < 1) out[count++] = r1;
  if (r2 > 0 && r2 < 1 && r2 !== r1) out[count++] = r2;
  return count;
}

/**
 * Roots in (0, 1) of the polynomial at `levels[level]` of degree `deg`
 * (coefficients low to high), written ascending into `levelRoots[level]`.
 * Degree ≤ 2 in closed form; higher degrees bracket between the roots of p′.
 * A point where p touches zero exactly at a critical point is included
 * (a harmless extra candidate for the caller).
 */
function rootsAtLevel(level: number, deg: number): number {
  const p = levels[level];
  while (deg > 0 && p[deg] === 0) deg--;
  const out = levelRoots[level];
  if (deg <= 2) return deg === 0 ? 0 : quadraticRoots(p[0], p[1], deg === 2 ? p[2] : 0, out);
  const q = levels[level + 1];
  for (let k = 1; k <= deg; k++) q[k - 1] = k * p[k];
  const nc = rootsAtLevel(level + 1, deg - 1);
  const crit = levelRoots[level + 1];
  let count = 0;
  let a = 0;
  let fa = p[0];
  for (let i = 0; i <= nc; i++) {
    const b = i < nc ? crit[i] : 1;
    const fb = horner(p, deg, b);
    if (fa === 0 && a > 0) out[count++] = a;
    else if ((fa < 0 && fb > 0) || (fa > 0 && fb < 0)) out[count++] = refine(p, deg, a, b, fa, fb);
    a = b;
    fa = fb;
  }
  return count;
}

/**
 * Roots in (0, 1) of the derivative of y(ξ) = Σ c[o+k] ξ^k, k = 0..5, written
 * ascending into `out`; returns their number (at most 4). Roots of a
 * quadratic y′ come from the closed form and get one Newton polish.
 */
export function derivativeRootsInUnit(c: Float64Array, o: number, out: Float64Array): number {
  const p = levels[0];
  for (let k = 1; k <= MAX_DEGREE; k++) p[k - 1] = k * c[o + k];
  const n = rootsAtLevel(0, MAX_DEGREE - 1);
  const r = levelRoots[0];
  const closedForm = p[4] === 0 && p[3] === 0;
  for (let i = 0; i < n; i++) {
    let x = r[i];
    if (closedForm) {
      const f = p[0] + x * (p[1] + x * p[2]);
      const df = p[1] + 2 * x * p[2];
      if (df !== 0) {
        const next = x - f / df;
        if (next > 0 && next < 1) x = next;
      }
    }
    out[i] = x;
  }
  return n;
}

/**
 * An upper bound of |y| on [0, 1] for y(ξ) = Σ c[o+k] ξ^k (k = 0..5): the
 * largest |Bernstein coefficient| of degree 5 (the convex-hull property),
 * b_i = Σ_k C(i,k)/C(5,k)·c_k, written out. Lets the extreme search skip
 * elements that cannot beat the best value so far.
 */
export function bernsteinBound(c: Float64Array, o: number): number {
  const c0 = c[o];
  const c1 = c[o + 1];
  const c2 = c[o + 2];
  const c3 = c[o + 3];
  const c4 = c[o + 4];
  const c5 = c[o + 5];
  let best = Math.abs(c0);
  const b1 = Math.abs(c0 + c1 / 5);
  if (b1 > best) best = b1;
  const b2 = Math.abs(c0 + (2 * c1) / 5 + c2 / 10);
  if (b2 > best) best = b2;
  const b3 = Math.abs(c0 + (3 * c1) / 5 + (3 * c2) / 10 + c3 / 10);
  if (b3 > best) best = b3;
  const b4 = Math.abs(c0 + (4 * c1) / 5 + (6 * c2) / 10 + (4 * c3) / 10 + c4 / 5);
  if (b4 > best) best = b4;
  const b5 = Math.abs(c0 + c1 + c2 + c3 + c4 + c5);
  if (b5 > best) best = b5;
  return best;
}

/**
 * True when y′ of y(ξ) = Σ c[o+k] ξ^k keeps one strict sign on [0, 1], shown
 * by the degree-4 Bernstein coefficients of y′ all having that sign; then
 * |y| peaks at an element end and no root search is needed. (False means
 * "maybe not monotonic", never the reverse.)
 */
export function isMonotonic(c: Float64Array, o: number): boolean {
  const p0 = c[o + 1];
  const p1 = 2 * c[o + 2];
  const p2 = 3 * c[o + 3];
  const p3 = 4 * c[o + 4];
  const p4 = 5 * c[o + 5];
  const b1 = p0 + p1 / 4;
  const b2 = p0 + p1 / 2 + p2 / 6;
  const b3 = p0 + (3 * p1) / 4 + p2 / 2 + p3 / 4;
  const b4 = p0 + p1 + p2 + p3 + p4;
  if (p0 > 0) return b1 > 0 && b2 > 0 && b3 > 0 && b4 > 0;
  if (p0 < 0) return b1 < 0 && b2 < 0 && b3 < 0 && b4 < 0;
  return false;
}
