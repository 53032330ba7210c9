import { checkBeam, type BeamInput, type Check, type CheckReport, type Combination, type Load, type Support } from '../engine';
import { LimitError } from './limit-error';
import type { LimitRule, LimitSet, MaterialId, RuleSource } from './types';

/** Known load cases first, in this order; any other label after them, alphabetically. */
const CASE_ORDER = ['D', 'L', 'Lr', 'S', 'R', 'W'];

/**
 * The stable name of a combination, built from its factors so equal
 * combinations share one key: { D: 1, L: 1 } → "D+L", { D: 0.5, L: 1 } →
 * "0.5D+L", { W: 0.42 } → "0.42W", { D: 2, L: 1 } → "2D+L", { D: 1, W: -0.6 } → "D-0.6W".
 * Cases with factor 0 are left out; an empty combination is "0".
 */
export function combinationName(combination: Combination): string {
  const cases = Object.keys(combination)
    .filter((c) => combination[c] !== 0)
    .sort((a, b) => {
      const ia = CASE_ORDER.indexOf(a);
      const ib = CASE_ORDER.indexOf(b);
      if (ia >= 0 || ib >= 0) return (ia < 0 ? CASE_ORDER.length : ia) - (ib < 0 ? CASE_ORDER.length : ib);
      return a < b ? -1 : a > b ? 1 : 0;
    });
  if (cases.length === 0) return '0';
  return cases
    .map((c, i) => {
      const f = combination[c];
      const mag = Math.abs(f);
      const term = `${mag === 1 ? '' : String(mag)}${c}`;
      return f < 0 ? `-${term}` : i === 0 ? term : `+${term}`;
    })
    .join('');
}

export interface ChecksForOptions {
  /**
   * The load cases the member has. Factors of other cases are dropped (the
   * engine rejects a combination naming a case no load has), and a check left
   * with no case at all is dropped: a member with no live load has no live check.
   */
  cases?: readonly string[];
  /** Member length, m. Needed when the category has length-dependent rules (framing supporting glass). */
  length?: number;
  /** λΔ for rules with long-term cases (ACI 318-19 §24.2.4.1.1); default: the factor in the rule (2.0 in the preset). */
  lambdaDelta?: number;
}

/** The BeamInput pieces of one member, plus the rule behind each check (same order) for tracing its source. */
export interface MemberChecks {
  combinations: Record<string, Combination>;
  checks: Check[];
  rules: LimitRule[];
}

function inLength(rule: LimitRule, length: number | undefined, category: string): boolean {
  const range = rule.lengthRange;
  if (!range) return true;
  if (length === undefined) {
    throw new LimitError(
      'LENGTH_REQUIRED',
      `Category "${category}" has rules that depend on the member length ("${rule.check}"): pass the member length in metres as options.length.`,
    );
  }
  // "up to" includes the threshold; "longer than" excludes it (IBC §1604.3.7 wording).
  return (range.min === undefined || length > range.min) && (range.max === undefined || length <= range.max);
}

/**
 * The combinations and checks one member gets from a limit set: for each
 * check name of the category, the rule variant for the member's material
 * (e.g. L + 0.5D for dry wood, IBC 2021 Table 1604.3 footnote d; D dropped
 * for steel, footnote g), else the variant for any material. Combination
 * names come from combinationName, so they are stable keys.
 *
 * Throws LimitError UNKNOWN_CATEGORY when the set has no such category, and
 * LENGTH_REQUIRED when a length-dependent rule needs options.length.
 * Units: SI (maxAbs and plus in m), as the engine expects.
 */
export function checksFor(limitSet: LimitSet, category: string, material?: MaterialId | null, options: ChecksForOptions = {}): MemberChecks {
  if (!limitSet.categories.includes(category)) {
    throw new LimitError(
      'UNKNOWN_CATEGORY',
      `Limit set "${limitSet.name}" has no category "${category}". Its categories: ${limitSet.categories.join(', ') || '(none yet)'}.`,
    );
  }
  const order: string[] = [];
  const byCheck = new Map<string, LimitRule[]>();
  for (const rule of limitSet.rules) {
    if (rule.category !== category || !inLength(rule, options.length, category)) continue;
    const list = byCheck.get(rule.check);
    if (list) list.push(rule);
    else {
      byCheck.set(rule.check, [rule]);
      order.push(rule.check);
    }
  }
  const result: MemberChecks = { combinations: {}, checks: [], rules: [] };
  for (const name of order) {
    const variants = byCheck.get(name) as LimitRule[];
    const rule =
      (material ? variants.find((r) => r.materials !== null && r.materials.includes(material)) : undefined) ??
      variants.find((r) => r.materials === null);
    if (!rule) continue;
    const combination: Combination = {};
    for (const c of Object.keys(rule.combination)) {
      if (options.cases && !options.cases.includes(c)) continue;
      const longTerm = options.lambdaDelta !== undefined && rule.longTermCases?.includes(c);
      combination[c] = longTerm ? (options.lambdaDelta as number) : rule.combination[c];
    }
    if (Object.keys(combination).length === 0) continue;
    const key = combinationName(combination);
    result.combinations[key] = combination;
    result.checks.push({ name: rule.check, combination: key, ratio: rule.ratio, maxAbs: rule.maxAbs, plus: rule.plus });
    result.rules.push(rule);
  }
  return result;
}

/** The member part of a BeamInput (SI): what a schedule row gives. */
export interface MemberModel {
  length: number;
  E: number;
  I: number;
  supports: Support[];
  loads: Load[];
  probes?: number[];
}

/**
 * A complete BeamInput for one member under a limit set: the member's own
 * cases and length are passed to checksFor, so combinations never name a
 * case the member lacks.
 */
export function buildBeamInput(
  member: MemberModel,
  limitSet: LimitSet,
  category: string,
  material?: MaterialId | null,
  options: Omit<ChecksForOptions, 'cases' | 'length'> = {},
): BeamInput {
  const cases = [...new Set(member.loads.map((l) => l.case))];
  const { combinations, checks } = checksFor(limitSet, category, material, { ...options, cases, length: member.length });
  const input: BeamInput = { length: member.length, E: member.E, I: member.I, supports: member.supports, loads: member.loads, combinations, checks };
  if (member.probes) input.probes = member.probes;
  return input;
}

/** A check result with the rule (and so the source) it came from. */
export interface SourcedCheckReport extends CheckReport {
  rule: LimitRule;
}

/**
 * Checks one member under a limit set in one call: buildBeamInput, then the
 * engine's bulk fast path (checkBeam), each result paired with its rule so a
 * verdict can show its source. Throws LimitError (category, length) or
 * EngineError (mechanism, bad member) — validate untrusted members with
 * parseBeamInput first.
 */
export function evaluateMember(
  member: MemberModel,
  limitSet: LimitSet,
  category: string,
  material?: MaterialId | null,
  options: Omit<ChecksForOptions, 'cases' | 'length'> = {},
): { input: BeamInput; checks: SourcedCheckReport[] } {
  const cases = [...new Set(member.loads.map((l) => l.case))];
  const pieces = checksFor(limitSet, category, material, { ...options, cases, length: member.length });
  const input: BeamInput = { ...member, combinations: pieces.combinations, checks: pieces.checks };
  const reports = checkBeam(input);
  return { input, checks: reports.map((r, i) => ({ ...r, rule: pieces.rules[i] })) };
}

/** One line for screens and exports: "IBC 2021, Table 1604.3, floor members, L column (from memory)". */
export function describeSource(source: RuleSource): string {
  const doc = source.document.replace(/^.*\(([^)]+)\)$/, '$1');
  return `${doc} ${source.edition}, ${source.clause} (${source.trust})`;
}

/** The caution every verdict carries (domain.md §5, "Cautions the product must show"). */
export const VERDICT_CAUTION =
  "Results support checking; they do not replace the judgement of the engineer of record. The adopted code edition and local amendments govern. Results assume linear-elastic, small-deflection, prismatic members on idealised supports, without shear deformation, vibration, ponding or construction sequence.";
