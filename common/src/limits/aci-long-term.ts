/**
 * ACI 318-19 §24.2.4.1.1 (verified, domain.md §2.2): the additional long-term
 * deflection is λΔ × the immediate deflection under sustained load, with
 * λΔ = ξ / (1 + 50ρ′). ρ′ (compression reinforcement ratio) is taken at
 * midspan for simple and continuous spans and at the support for cantilevers.
 */

/**
 * Time-dependent factor ξ by sustained-load duration in months: 3 → 1.0,
 * 6 → 1.2, 12 → 1.4, 60 (5 years or more) → 2.0. Values verified; the table
 * number (24.2.4.1.3) is from memory.
 */
export const ACI_XI_BY_MONTHS: Readonly<Record<3 | 6 | 12 | 60, number>> = { 3: 1.0, 6: 1.2, 12: 1.4, 60: 2.0 };

/** λΔ with ξ = 2.0 (5 years or more) and ρ′ = 0: the conservative default of the ACI preset. */
export const DEFAULT_LAMBDA_DELTA = 2.0;

/**
 * λΔ = ξ / (1 + 50ρ′) (ACI 318-19 §24.2.4.1.1). ξ > 0, ρ′ ≥ 0 (a ratio, e.g.
 * 0.005). Throws RangeError for values outside those ranges.
 */
export function aciLambdaDelta(xi: number, rhoPrime: number): number {
  if (!(xi > 0) || !Number.isFinite(xi)) throw new RangeError(`ξ must be a positive number, got ${xi}.`);
  if (!(rhoPrime >= 0) || !Number.isFinite(rhoPrime)) throw new RangeError(`ρ′ must be zero or a positive ratio, got ${rhoPrime}.`);
  return xi / (1 + 50 * rhoPrime);
}
