import { LimitError } from './limit-error';
import { MATERIAL_IDS, type LimitSet } from './types';

export interface LimitProblem {
  /** e.g. `rules[2].ratio`. */
  path: string;
  message: string;
}

const TRUST = ['verified', 'from memory', 'common practice'];

const isText = (v: unknown): v is string => typeof v === 'string' && v.trim() !== '';
const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Every problem of a limit set (a project's edited copy or a custom set), so
 * an editor can show them all at once; empty when the set is usable.
 * Checks: names and ids present; each rule's category listed in
 * `categories`; ratio > 0; maxAbs > 0 or null; plus ≥ 0 or null (m);
 * finite, non-empty combination factors; known materials; a source with
 * document, edition, clause and trust; no two rules for the same category,
 * check name and material.
 */
export function validateLimitSet(set: LimitSet): LimitProblem[] {
  const problems: LimitProblem[] = [];
  const add = (path: string, message: string): void => {
    problems.push({ path, message });
  };
  if (!isText(set.id)) add('id', 'The limit set needs an id.');
  if (!isText(set.name)) add('name', 'The limit set needs a name.');
  const categories = new Set(set.categories);
  const seen = new Set<string>();
  set.rules.forEach((rule, i) => {
    const p = `rules[${i}]`;
    if (!isText(rule.id)) add(`${p}.id`, 'Each rule needs an id.');
    if (!categories.has(rule.category)) add(`${p}.category`, `Category "${rule.category}" is not one of the set's categories; add it to categories first.`);
    if (!isText(rule.check)) add(`${p}.check`, 'Each rule needs a check name, e.g. "L/360 live".');
    if (!isNumber(rule.ratio) || rule.ratio <= 0) add(`${p}.ratio`, `The ratio (the n of l/n) must be a number above zero, got ${String(rule.ratio)}.`);
    if (rule.maxAbs !== null && (!isNumber(rule.maxAbs) || rule.maxAbs <= 0)) add(`${p}.maxAbs`, 'The absolute cap must be a length above zero (m), or empty.');
    if (rule.plus !== null && (!isNumber(rule.plus) || rule.plus < 0)) add(`${p}.plus`, 'The additive allowance must be zero or a positive length (m), or empty.');
    const cases = Object.keys(rule.combination ?? {});
    if (cases.length === 0) add(`${p}.combination`, 'The combination needs at least one load case with a factor, e.g. {"L": 1}.');
    for (const c of cases) {
      if (!isNumber(rule.combination[c])) add(`${p}.combination.${c}`, `The factor on ${c} must be a finite number.`);
    }
    for (const m of rule.materials ?? []) {
      if (!(MATERIAL_IDS as readonly string[]).includes(m)) add(`${p}.materials`, `Unknown material "${m}". Allowed: ${MATERIAL_IDS.join(', ')}.`);
    }
    const s = rule.source;
    if (!s || !isText(s.document) || !isText(s.edition) || !isText(s.clause)) {
      add(`${p}.source`, 'Each rule needs its source: document, edition and clause (for project criteria, e.g. "Basis of design", the issue, the section).');
    } else if (!TRUST.includes(s.trust)) {
      add(`${p}.source.trust`, `Trust must be one of: ${TRUST.join(', ')}.`);
    }
    for (const m of rule.materials ?? [null]) {
      const key = `${rule.category}\u0000${rule.check}\u0000${m ?? '*'}`;
      if (seen.has(key)) add(`${p}.check`, `Another rule already defines "${rule.check}" for category "${rule.category}"${m ? ` and material ${m}` : ''}.`);
      seen.add(key);
    }
  });
  return problems;
}

/** Throws LimitError INVALID_LIMIT_SET naming the first problem when the set is not usable. */
export function assertValidLimitSet(set: LimitSet): void {
  const problems = validateLimitSet(set);
  if (problems.length) {
    throw new LimitError('INVALID_LIMIT_SET', `${problems[0].message}${problems.length > 1 ? ` (and ${problems.length - 1} more)` : ''}`, problems[0].path);
  }
}
