import { EngineError } from './engine-error';
import { assertStable, assertSupportsApart } from './stability';
import type { BeamInput, Check, Combination, Load, Support } from './types';

/**
 * Validation of untrusted JSON into a BeamInput. Every problem is an
 * EngineError naming the field (`loads[3].x`), what is wrong and how to fix it.
 * Strict on purpose: an unexpected field is an error, because a misspelt
 * `maxabs` silently dropping a cap would pass members that should fail.
 * Paths and messages are only built when something is wrong, so validating
 * a large schedule costs little more than copying it.
 */

type Json = Record<string, unknown>;

const TOP_KEYS = new Set(['length', 'E', 'I', 'supports', 'loads', 'combinations', 'probes', 'checks', 'label']);
const SUPPORT_KEYS = new Set(['x', 'kind']);
const CHECK_KEYS = new Set(['name', 'combination', 'ratio', 'maxAbs', 'plus']);
const LOAD_KEYS: Record<Load['kind'], Set<string>> = {
  point: new Set(['case', 'kind', 'x', 'P']),
  udl: new Set(['case', 'kind', 'x1', 'x2', 'w']),
  linear: new Set(['case', 'kind', 'x1', 'x2', 'w1', 'w2']),
  moment: new Set(['case', 'kind', 'x', 'M']),
};
const UNITS: Record<string, string> = { x: 'm', x1: 'm', x2: 'm', P: 'N', w: 'N/m', w1: 'N/m', w2: 'N/m', M: 'N·m' };

function describe(v: unknown): string {
  if (v === undefined) return 'missing';
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  if (typeof v === 'string') return `the text ${JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v)}`;
  return `a ${typeof v}`;
}

/** `combinations.total` or `combinations["live L/360"]`. */
export function keyPath(base: string, key: string): string {
  const head = base === '' ? '' : base;
  if (/^[A-Za-z_][A-Za-z0-9_]*$/.test(key)) return head ? `${head}.${key}` : key;
  return `${head}[${JSON.stringify(key)}]`;
}

/** A field's path from its parent (`loads`, 3) and name (`x`), built only on error. */
function at(list: string, index: number, key?: string): string {
  const base = index < 0 ? list : `${list}[${index}]`;
  return key === undefined ? base : keyPath(base, key);
}

function isObject(v: unknown): v is Json {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function requireObject(v: unknown, path: () => string, what: string): Json {
  if (!isObject(v)) {
    const p = path();
    throw new EngineError('INVALID_TYPE', p, `${p || 'The input'} must be an object (${what}), but it is ${describe(v)}.`);
  }
  return v;
}

function requireArray(v: unknown, path: string, what: string): unknown[] {
  if (!Array.isArray(v)) throw new EngineError('INVALID_TYPE', path, `${path} must be an array (${what}), but it is ${describe(v)}.`);
  return v;
}

function onlyKeys(o: Json, allowed: Set<string>, list: string, index: number): void {
  for (const key in o) {
    if (!allowed.has(key)) {
      const p = at(list, index, key);
      const where = list === '' ? '' : ` in ${at(list, index)}`;
      throw new EngineError('INVALID_TYPE', p, `Unexpected field "${key}"${where}. Allowed fields: ${[...allowed].join(', ')} (names are case-sensitive).`);
    }
  }
}

function finite(v: unknown, list: string, index: number, key: string | undefined, unit: string): number {
  if (typeof v === 'number' && v - v === 0) return v + 0; // finite (NaN − NaN and ∞ − ∞ are NaN); −0 → 0
  const p = at(list, index, key);
  if (typeof v !== 'number') throw new EngineError('INVALID_TYPE', p, `${p} must be a number in ${unit}, but it is ${describe(v)}.`);
  throw new EngineError('NOT_FINITE', p, `${p} must be a finite number in ${unit}, but it is ${String(v)}.`);
}

function positive(v: unknown, list: string, index: number, key: string | undefined, unit: string, what: string): number {
  const n = finite(v, list, index, key, unit);
  if (n <= 0) {
    const p = at(list, index, key);
    throw new EngineError('NOT_POSITIVE', p, `${p} (${what}) must be greater than zero, but it is ${n} ${unit}.`);
  }
  return n;
}

function position(v: unknown, list: string, index: number, key: string | undefined, length: number): number {
  const x = finite(v, list, index, key, 'm');
  if (x < 0 || x > length) {
    const p = at(list, index, key);
    throw new EngineError('OUT_OF_RANGE', p, `${p} = ${x} m lies outside the member, which runs from x = 0 to x = ${length} m. Measure x from the left end.`);
  }
  return x;
}

function label(v: unknown, list: string, index: number, key: string, what: string): string {
  if (typeof v === 'string' && v.trim() !== '') return v;
  const p = at(list, index, key);
  throw new EngineError('INVALID_TYPE', p, `${p} must be a non-empty text (${what}), but it is ${describe(v)}.`);
}

function parseSupport(raw: unknown, i: number, length: number): Support {
  const o = requireObject(raw, () => at('supports', i), 'a support such as {"x": 0, "kind": "pin"}');
  onlyKeys(o, SUPPORT_KEYS, 'supports', i);
  const x = position(o.x, 'supports', i, 'x', length);
  const kind = o.kind;
  if (kind !== 'pin' && kind !== 'fixed') {
    const p = at('supports', i, 'kind');
    throw new EngineError('UNKNOWN_KIND', p, `${p} must be "pin" or "fixed", but it is ${describe(kind)}.`);
  }
  return { x, kind };
}

function parseLoad(raw: unknown, i: number, length: number): Load {
  const o = requireObject(raw, () => at('loads', i), 'a load such as {"case": "D", "kind": "udl", "x1": 0, "x2": 6, "w": 3500}');
  const kind = o.kind;
  if (kind !== 'point' && kind !== 'udl' && kind !== 'linear' && kind !== 'moment') {
    const p = at('loads', i, 'kind');
    throw new EngineError('UNKNOWN_KIND', p, `${p} must be one of "point", "udl", "linear", "moment", but it is ${describe(kind)}.`);
  }
  onlyKeys(o, LOAD_KEYS[kind], 'loads', i);
  const c = label(o.case, 'loads', i, 'case', 'the load case, e.g. "D" or "L"');
  if (kind === 'point') return { case: c, kind, x: position(o.x, 'loads', i, 'x', length), P: finite(o.P, 'loads', i, 'P', UNITS.P) };
  if (kind === 'moment') return { case: c, kind, x: position(o.x, 'loads', i, 'x', length), M: finite(o.M, 'loads', i, 'M', UNITS.M) };
  const x1 = position(o.x1, 'loads', i, 'x1', length);
  const x2 = position(o.x2, 'loads', i, 'x2', length);
  if (!(x2 > x1)) {
    const p = at('loads', i, 'x2');
    throw new EngineError(
      'OUT_OF_RANGE',
      p,
      `${p} = ${x2} m must be greater than x1 = ${x1} m: a distributed load runs left to right over a length greater than zero.`,
    );
  }
  if (kind === 'udl') return { case: c, kind, x1, x2, w: finite(o.w, 'loads', i, 'w', UNITS.w) };
  return { case: c, kind, x1, x2, w1: finite(o.w1, 'loads', i, 'w1', UNITS.w1), w2: finite(o.w2, 'loads', i, 'w2', UNITS.w2) };
}

function parseCombinations(raw: unknown, cases: readonly string[]): Record<string, Combination> {
  const o = requireObject(raw, () => 'combinations', 'named factors per load case, e.g. {"total": {"D": 1, "L": 1}}');
  const out: Record<string, Combination> = {};
  for (const name in o) {
    const path = keyPath('combinations', name);
    if (name.trim() === '') throw new EngineError('INVALID_TYPE', path, 'A combination name must not be empty.');
    const factors = requireObject(o[name], () => path, 'factors per load case, e.g. {"D": 1, "L": 1}');
    const combination: Combination = {};
    for (const c in factors) {
      if (!cases.includes(c)) {
        throw new EngineError(
          'UNKNOWN_CASE',
          keyPath(path, c),
          `Combination "${name}" names load case "${c}", but no load has that case. ${cases.length ? `Cases of this member: ${cases.join(', ')}` : 'This member has no loads'} (case labels are case-sensitive).`,
        );
      }
      combination[c] = finite(factors[c], path, -1, c, 'a plain factor');
    }
    out[name] = combination;
  }
  return out;
}

function parseCheck(raw: unknown, i: number, combinations: Record<string, Combination>): Check {
  const o = requireObject(raw, () => at('checks', i), 'a check such as {"name": "live L/360", "combination": "live", "ratio": 360}');
  onlyKeys(o, CHECK_KEYS, 'checks', i);
  const name = label(o.name, 'checks', i, 'name', 'the check name');
  const combination = label(o.combination, 'checks', i, 'combination', 'the name of one of the combinations');
  if (!Object.prototype.hasOwnProperty.call(combinations, combination)) {
    const names = Object.keys(combinations);
    throw new EngineError(
      'UNKNOWN_COMBINATION',
      at('checks', i, 'combination'),
      `Check "${name}" names combination "${combination}", which is not defined. ${names.length ? `Defined: ${names.join(', ')}` : 'Define it under "combinations"'}.`,
    );
  }
  const ratio = positive(o.ratio, 'checks', i, 'ratio', 'the n of l/n', 'the span ratio');
  const maxAbs = o.maxAbs === undefined || o.maxAbs === null ? null : positive(o.maxAbs, 'checks', i, 'maxAbs', 'm', 'the absolute cap');
  const check: Check = { name, combination, ratio, maxAbs };
  if (o.plus !== undefined && o.plus !== null) {
    const plus = finite(o.plus, 'checks', i, 'plus', 'm');
    if (plus < 0) {
      const p = at('checks', i, 'plus');
      throw new EngineError('NOT_POSITIVE', p, `${p} (the additive allowance) must be zero or more, but it is ${plus} m.`);
    }
    check.plus = plus;
  }
  return check;
}

/**
 * Validates untrusted JSON (already parsed) into a BeamInput; throws
 * EngineError with a code, a field path and an actionable message.
 *
 * - Units: SI base units only (m, N, N/m, N·m, Pa, m^4); loads positive down,
 *   moments positive counter-clockwise (calc-contract.md).
 * - Positions must lie within 0 ≤ x ≤ length; distributed loads need x1 < x2;
 *   two supports at different x must be at least 1e-9 × length apart.
 * - `loads` may be omitted (no loads). `combinations` is optional: when
 *   absent, each load case becomes a combination of its own, named by the
 *   case label ({"D": {"D": 1}, …}).
 * - A combination may not name a case that no load has (UNKNOWN_CASE); a
 *   check may not name an undefined combination (UNKNOWN_COMBINATION).
 * - A mechanism is rejected here too (MECHANISM, path `supports`).
 * - `label` (text) may describe the member; it is checked and dropped.
 * The result is a fresh object holding only the contract's fields.
 */
export function parseBeamInput(raw: unknown): BeamInput {
  const o = requireObject(raw, () => '', 'a BeamInput with length, E, I, supports, loads, combinations');
  onlyKeys(o, TOP_KEYS, '', -1);
  if (o.label !== undefined && typeof o.label !== 'string') {
    throw new EngineError('INVALID_TYPE', 'label', `label must be a text describing the member, but it is ${describe(o.label)}.`);
  }
  const length = positive(o.length, 'length', -1, undefined, 'm', 'the member length');
  const E = positive(o.E, 'E', -1, undefined, 'Pa', "Young's modulus");
  const I = positive(o.I, 'I', -1, undefined, 'm^4', 'the second moment of area');
  const rawSupports = requireArray(o.supports, 'supports', 'e.g. [{"x": 0, "kind": "pin"}, {"x": 6, "kind": "pin"}]');
  const supports: Support[] = new Array(rawSupports.length);
  for (let i = 0; i < rawSupports.length; i++) supports[i] = parseSupport(rawSupports[i], i, length);
  assertStable(supports);
  assertSupportsApart(supports, length);
  const rawLoads = o.loads === undefined ? [] : requireArray(o.loads, 'loads', 'e.g. [{"case": "D", "kind": "udl", "x1": 0, "x2": 6, "w": 3500}]');
  const loads: Load[] = new Array(rawLoads.length);
  const cases: string[] = [];
  for (let i = 0; i < rawLoads.length; i++) {
    const load = parseLoad(rawLoads[i], i, length);
    loads[i] = load;
    if (!cases.includes(load.case)) cases.push(load.case);
  }
  let combinations: Record<string, Combination>;
  if (o.combinations === undefined) {
    combinations = {};
    for (const c of cases) combinations[c] = { [c]: 1 };
  } else combinations = parseCombinations(o.combinations, cases);
  const input: BeamInput = { length, E, I, supports, loads, combinations };
  if (o.probes !== undefined) {
    const raw = requireArray(o.probes, 'probes', 'positions in m, e.g. [3.6, 9.0]');
    input.probes = raw.map((p, i) => position(p, 'probes', i, undefined, length));
  }
  if (o.checks !== undefined) {
    const raw = requireArray(o.checks, 'checks', 'e.g. [{"name": "live L/360", "combination": "live", "ratio": 360}]');
    input.checks = raw.map((c, i) => parseCheck(c, i, combinations));
  }
  return input;
}
