import { DEFAULT_LAMBDA_DELTA } from '../aci-long-term';
import type { LimitRule, LimitSet, RuleSource } from '../types';

/**
 * ACI 318-19 Table 24.2.2, maximum permissible calculated deflections
 * (verified, reproduced 318-19 text; domain.md §2.2). The two rows on the
 * deflection after attachment of nonstructural elements are written as a
 * combination: λΔ × (immediate deflection under the sustained dead load) +
 * (immediate deflection under live load), i.e. { D: λΔ, L: 1 } (domain.md §3,
 * "For the product"). This is exact only if one I (e.g. Ie) applies to every
 * case, an approximation for cracked concrete.
 */

const ACI = 'ACI 318, Building Code Requirements for Structural Concrete';

const T24_2_2 = (row: string, note?: string): RuleSource => ({
  document: ACI,
  edition: '318-19',
  clause: `Table 24.2.2, ${row}`,
  trust: 'verified',
  ...(note ? { note } : {}),
});

const AFTER_ATTACHMENT_NOTE =
  `Deflection after attachment = time-dependent deflection under all sustained loads + immediate deflection under any added live load, written as { D: λΔ, L: 1 } with λΔ = ξ/(1 + 50ρ′) (§24.2.4.1.1, verified). Default λΔ = ${DEFAULT_LAMBDA_DELTA}: ξ = 2.0 (sustained 5 years or more) and ρ′ = 0 (no compression steel), the conservative end; pass the member's λΔ to checksFor. The time-dependent part may exclude what occurs before the elements are attached (note [2]).`;

function rule(id: string, category: string, check: string, combination: Record<string, number>, ratio: number, source: RuleSource, longTerm = false): LimitRule {
  return {
    id,
    category,
    check,
    combination,
    ratio,
    maxAbs: null,
    plus: null,
    materials: null,
    lengthRange: null,
    longTermCases: longTerm ? ['D'] : null,
    source,
  };
}

const FLAT_ROOF = 'flat roofs not supporting or attached to nonstructural elements likely to be damaged (immediate, largest of Lr, S, R)';
const PONDING = 'Not a ponding check (note [1]): ponding needs its own analysis.';

export const ACI_318_19: LimitSet = {
  id: 'aci-318-19',
  name: 'ACI 318-19 (Table 24.2.2)',
  description:
    'Concrete members: ACI 318-19 Table 24.2.2, with the long-term multiplier λΔ of §24.2.4.1.1 as a combination factor. Enter the effective moment of inertia Ie (Table 24.2.3.5) as I. The adopted edition governs.',
  categories: ['concrete-floor', 'concrete-flat-roof', 'concrete-damage-prone', 'concrete-not-damage-prone'],
  rules: [
    rule('concrete-flat-roof.roof-live', 'concrete-flat-roof', 'ℓ/180 roof live', { Lr: 1 }, 180, T24_2_2(FLAT_ROOF, PONDING)),
    rule('concrete-flat-roof.snow', 'concrete-flat-roof', 'ℓ/180 snow', { S: 1 }, 180, T24_2_2(FLAT_ROOF, PONDING)),
    rule('concrete-flat-roof.rain', 'concrete-flat-roof', 'ℓ/180 rain', { R: 1 }, 180, T24_2_2(FLAT_ROOF, PONDING)),
    rule('concrete-floor.live', 'concrete-floor', 'ℓ/360 live', { L: 1 }, 360, T24_2_2('floors not supporting or attached to nonstructural elements likely to be damaged (immediate, L)')),
    rule(
      'concrete-damage-prone.after-attachment',
      'concrete-damage-prone',
      'ℓ/480 after attachment',
      { D: DEFAULT_LAMBDA_DELTA, L: 1 },
      480,
      T24_2_2('roofs or floors supporting or attached to nonstructural elements likely to be damaged', `${AFTER_ATTACHMENT_NOTE} The limit may be exceeded if measures prevent damage (note [3]).`),
      true,
    ),
    rule(
      'concrete-not-damage-prone.after-attachment',
      'concrete-not-damage-prone',
      'ℓ/240 after attachment',
      { D: DEFAULT_LAMBDA_DELTA, L: 1 },
      240,
      T24_2_2('roofs or floors supporting or attached to nonstructural elements not likely to be damaged', `${AFTER_ATTACHMENT_NOTE} The limit must not exceed the nonstructural elements' tolerance (note [4]).`),
      true,
    ),
  ],
  notes: [
    {
      text: 'Effective moment of inertia: ACI 318-19 uses Ie = Icr / [1 − ((2/3)Mcr/Ma)²(1 − Icr/Ig)] when Ma > (2/3)Mcr (Table 24.2.3.5); Branson\'s form belongs to 318-14 and earlier. Results are only as good as the I entered.',
      source: { document: ACI, edition: '318-19', clause: 'Table 24.2.3.5', trust: 'verified' },
    },
  ],
};
