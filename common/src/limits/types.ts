import type { Combination } from '../engine';

/**
 * How far a rule's value has been checked (domain.md, trust marks):
 * - verified: read in stored public copies of the clause (or a faithful quotation);
 * - from memory: not checked here; check it against the adopted edition before relying on it;
 * - common practice: what engineers usually do, with no standard behind it.
 */
export type Trust = 'verified' | 'from memory' | 'common practice';

/** Where a limit comes from. Every preset rule carries one. */
export interface RuleSource {
  /** e.g. "International Building Code (IBC)". */
  document: string;
  /** e.g. "2021". */
  edition: string;
  /** e.g. "Table 1604.3, footnote d". */
  clause: string;
  trust: Trust;
  /** What exactly was verified or assumed. */
  note?: string;
}

/**
 * Material ids; the same codes as the schedule's Material column
 * (common/src/schedule codes), repeated here so limits do not depend on the
 * spreadsheet rules.
 */
export const MATERIAL_IDS = ['steel', 'cold-formed-steel', 'timber', 'engineered-wood', 'concrete', 'masonry', 'aluminium', 'other'] as const;
export type MaterialId = (typeof MATERIAL_IDS)[number];

/** A member category: the row of a limit set a member is checked under. */
export interface MemberCategory {
  id: string;
  label: string;
  /** The material such members usually are (a hint for forms; rules may still vary by material), or null. */
  materialHint: MaterialId | null;
  description: string;
}

/**
 * One check of one member category: a serviceability combination and its
 * limit, allowed = min(l_eff / ratio + plus, maxAbs), with l_eff twice the
 * length on overhangs and cantilevers (the engine applies that; IBC 2021
 * Table 1604.3 cantilever footnote).
 */
export interface LimitRule {
  /** Stable id within the set, e.g. "floor.total.wood". */
  id: string;
  /** A MemberCategory id. */
  category: string;
  /** The check's name as shown and stored, e.g. "L/360 live". */
  check: string;
  /** Factors per load case, e.g. { D: 0.5, L: 1 }. */
  combination: Combination;
  /** The n of l/n, > 0. */
  ratio: number;
  /** Absolute cap, m, or null. */
  maxAbs: number | null;
  /** Additive allowance, m, or null (IBC §1604.3.7: l/240 + 1/4 in). */
  plus: number | null;
  /**
   * Materials this variant is for; null = every material without a variant
   * of its own. For one category and check name, checksFor takes the variant
   * listing the member's material, else the null one.
   */
  materials: MaterialId[] | null;
  /** Member lengths (m) the rule applies to, e.g. glass framing up to 13 ft 6 in; null = any. */
  lengthRange: { min?: number; max?: number } | null;
  /**
   * Cases whose factor in `combination` is the long-term multiplier λΔ
   * (ACI 318-19 §24.2.4.1.1); checksFor replaces it when given one. Null otherwise.
   */
  longTermCases: string[] | null;
  source: RuleSource;
}

/** A note that belongs to the set as a whole (cantilever length, what the limits do not cover). */
export interface LimitSetNote {
  text: string;
  source: RuleSource;
}

/** A named set of rules: a preset shipped with its sources, or a project's copy. */
export interface LimitSet {
  id: string;
  name: string;
  description: string;
  /** The categories this set has rules for, in display order (MemberCategory ids). */
  categories: string[];
  rules: LimitRule[];
  notes: LimitSetNote[];
}
