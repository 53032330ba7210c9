import { findCategory, validateLimitSet, type LimitRule, type LimitSet, type MaterialId, type Trust } from '@sagline/common/limits';
import { LIMIT_SET_LIMITS, type ApiErrorDetail } from '@sagline/common/api-types';

/**
 * Turns the rules of an edit (plain JSON from the request) into limit rules,
 * listing every problem with its path (`body.rules[2].ratio`), then runs the
 * set through common/src/limits validateLimitSet so the api refuses exactly
 * what the engine could not use. Nothing here touches the database.
 */

const RULE_FIELDS = ['id', 'category', 'check', 'combination', 'ratio', 'maxAbs', 'plus', 'materials', 'lengthRange', 'longTermCases', 'source'];
const SOURCE_FIELDS = ['document', 'edition', 'clause', 'trust', 'note'];

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

export interface ParsedEdit {
  rules: LimitRule[];
  problems: ApiErrorDetail[];
}

/**
 * `previous`: the set's stored rules, so a rule sent back without
 * `longTermCases` keeps them. New rules (no id) get `<category>.<n>`.
 */
export function parseRules(raw: unknown[], previous: readonly LimitRule[]): ParsedEdit {
  const problems: ApiErrorDetail[] = [];
  const add = (path: string, message: string) => problems.push({ path: `body.${path}`, message });
  const byId = new Map(previous.map((r) => [r.id, r]));
  const rules: LimitRule[] = [];
  if (raw.length > LIMIT_SET_LIMITS.rulesMax) add('rules', `has ${raw.length} rules; a set may have at most ${LIMIT_SET_LIMITS.rulesMax}.`);
  const taken = new Set(raw.filter(isObject).map((r) => r.id).filter((id): id is string => typeof id === 'string'));
  raw.forEach((item, i) => {
    const p = `rules[${i}]`;
    if (!isObject(item)) {
      add(p, 'must be a rule object with category, check, combination, ratio, maxAbs and source.');
      return;
    }
    for (const k of Object.keys(item)) if (!RULE_FIELDS.includes(k)) add(`${p}.${k}`, 'is not a field of a rule; remove it');
    const text = (key: string, max: number, what: string): string => {
      const v = item[key];
      if (typeof v !== 'string' || v.trim() === '') {
        add(`${p}.${key}`, `is required: ${what}`);
        return '';
      }
      if (v.trim().length > max) add(`${p}.${key}`, `must be at most ${max} characters`);
      return v.trim();
    };
    const category = text('category', 80, 'the member category the rule applies to, e.g. "floor"');
    const check = text('check', LIMIT_SET_LIMITS.checkMax, 'the check\'s name, e.g. "L/360 live"');

    const combination: Record<string, number> = {};
    if (!isObject(item.combination)) add(`${p}.combination`, 'must give a factor per load case, e.g. {"L": 1} or {"D": 0.5, "L": 1}');
    else {
      for (const [c, f] of Object.entries(item.combination)) {
        if (!/^[A-Za-z][A-Za-z0-9]{0,7}$/.test(c)) add(`${p}.combination`, `"${c}" is not a load case label (letters and digits, e.g. D, L, Lr, S, W)`);
        else if (!isNum(f)) add(`${p}.combination.${c}`, `the factor on ${c} must be a number, e.g. 1 or 0.5`);
        else combination[c] = f;
      }
    }
    const ratio = isNum(item.ratio) ? item.ratio : NaN;
    if (!isNum(item.ratio)) add(`${p}.ratio`, 'must be a number: the n of span/n, e.g. 360');
    const length = (key: 'maxAbs' | 'plus'): number | null => {
      const v = item[key];
      if (v === undefined || v === null) return null;
      if (!isNum(v)) {
        add(`${p}.${key}`, 'must be a length in metres, or null for none');
        return null;
      }
      return v;
    };
    const maxAbs = length('maxAbs');
    const plus = length('plus');

    let materials: MaterialId[] | null = null;
    if (item.materials !== undefined && item.materials !== null) {
      if (!Array.isArray(item.materials) || !item.materials.every((m) => typeof m === 'string')) add(`${p}.materials`, 'must be a list of material codes, or null for every material');
      else materials = item.materials as MaterialId[];
    }
    let lengthRange: LimitRule['lengthRange'] = null;
    if (item.lengthRange !== undefined && item.lengthRange !== null) {
      const r = item.lengthRange;
      if (!isObject(r) || (r.min !== undefined && !isNum(r.min)) || (r.max !== undefined && !isNum(r.max))) add(`${p}.lengthRange`, 'must be {"min": m, "max": m} (either may be left out), or null');
      else lengthRange = { ...(r.min !== undefined ? { min: r.min as number } : {}), ...(r.max !== undefined ? { max: r.max as number } : {}) };
    }
    const id = typeof item.id === 'string' && item.id.trim() !== '' ? item.id.trim() : newId(category || 'rule', taken);
    let longTermCases: string[] | null = byId.get(id)?.longTermCases ?? null;
    if (item.longTermCases !== undefined) {
      if (item.longTermCases !== null && (!Array.isArray(item.longTermCases) || !item.longTermCases.every((c) => typeof c === 'string'))) add(`${p}.longTermCases`, 'must be a list of load cases, or null');
      else longTermCases = item.longTermCases as string[] | null;
    }

    const src = item.source;
    const source = { document: '', edition: '', clause: '', trust: 'common practice' as Trust, note: undefined as string | undefined };
    if (!isObject(src)) add(`${p}.source`, 'is required: the document, edition and clause the limit comes from (for the project\'s own criteria, e.g. "Basis of design", its issue and section)');
    else {
      for (const k of Object.keys(src)) if (!SOURCE_FIELDS.includes(k)) add(`${p}.source.${k}`, 'is not a field of a source; remove it');
      for (const k of ['document', 'edition', 'clause'] as const) {
        const v = src[k];
        if (typeof v !== 'string' || v.trim() === '') add(`${p}.source.${k}`, `is required: the ${k} the limit comes from`);
        else if (v.trim().length > LIMIT_SET_LIMITS.sourceFieldMax) add(`${p}.source.${k}`, `must be at most ${LIMIT_SET_LIMITS.sourceFieldMax} characters`);
        else source[k] = v.trim();
      }
      source.trust = src.trust as Trust;
      if (src.note !== undefined && src.note !== null) {
        if (typeof src.note !== 'string') add(`${p}.source.note`, 'must be text');
        else if (src.note.length > LIMIT_SET_LIMITS.noteMax) add(`${p}.source.note`, `must be at most ${LIMIT_SET_LIMITS.noteMax} characters`);
        else if (src.note.trim() !== '') source.note = src.note.trim();
      }
    }
    const { note, ...rest } = source;
    rules.push({ id, category, check, combination, ratio, maxAbs, plus, materials, lengthRange, longTermCases, source: note ? { ...rest, note } : rest });
  });
  return { rules, problems };
}

function newId(category: string, taken: Set<string>): string {
  for (let n = 1; ; n++) {
    const id = `${category}.rule-${n}`;
    if (!taken.has(id)) {
      taken.add(id);
      return id;
    }
  }
}

/**
 * The categories of the edited set: those given, else the set's own plus any
 * new category a rule uses (appended in the order met). Unknown category ids
 * are allowed only if the set had them already (a project's own category).
 */
export function categoriesOf(given: string[] | undefined, previous: readonly string[], rules: readonly LimitRule[]): { categories: string[]; problems: ApiErrorDetail[] } {
  const problems: ApiErrorDetail[] = [];
  const list = given ? [...given] : [...previous];
  if (!given) for (const r of rules) if (r.category && !list.includes(r.category)) list.push(r.category);
  list.forEach((c, i) => {
    if (!findCategory(c) && !previous.includes(c)) {
      problems.push({ path: given ? `body.categories[${i}]` : `body.rules[${rules.findIndex((r) => r.category === c)}].category`, message: `"${c}" is not a member category Sagline knows; pick one of the listed categories.` });
    }
  });
  if (new Set(list).size !== list.length) problems.push({ path: 'body.categories', message: 'lists a category twice; list each once.' });
  return { categories: list, problems };
}

/** validateLimitSet's problems with the request's paths (`rules[2].ratio` → `body.rules[2].ratio`). */
export function setProblems(set: LimitSet): ApiErrorDetail[] {
  return validateLimitSet(set).map((p) => ({ path: `body.${p.path}`, message: p.message }));
}
