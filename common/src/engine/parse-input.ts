import { EngineError } from './engine-error';
import { assertStable } from './stability';
import type { BeamInput, Check, Combination, Load, Support } from './types';

/**
 * Validation of untrusted JSON into a BeamInput. Every problem is an
 * EngineError naming the field (`loads[3].x`), what is wrong and how to fix it.
 * Strict on purpose: an unexpected field is an error, because a misspelt
 * `maxabs` silently dropping a cap would pass members that should fail.
 */

type Json = Record<string, unknown>;

const TOP_KEYS = ['length', 'E', 'I', 'supports', 'loads', 'combinations', 'probes', 'checks', 'label'];
const LOAD_KEYS: Record<Load['kind'], string[]> = {
  point: ['case', 'kind', 'x', 'P'],
  udl: ['case', 'kind', 'x1', 'x2', 'w'],
  linear: ['case', 'kind', 'x1', 'x2', 'w1', 'w2'],
  moment: ['case', 'kind', 'x', 'M'],
};
const LOAD_UNITS: Record<string, string> = { P: 'N', w: 'N/m', w1: 'N/m', w2: 'N/m', M: 'N·m' };

function describe(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'an array';
  if (typeof v === 'string') return `the text ${JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v)}`;
  return `a ${typeof v}`;
}

/** `combinations.total` or `combinations["live L/360"]`. */
export function keyPath(base: string, key: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(key) ? `${base}.${key}` : `${base}[${JSON.stringify(key)}]`;
}

function object(v: unknown, path: string, what: string): Json {
  if (typeof v !== 'object' || v === null || Array.isArray(v)) {
    throw new EngineError('INVALID_TYPE', path, `${path || 'The input'} must be an object (${what}), but it is ${describe(v)}.`);
  }
  return v as Json;
}

function array(v: unknown, path: string, what: string): unknown[] {
  if (!Array.isArray(v)) {
    throw new EngineError('INVALID_TYPE', path, `${path} must be an array (${what}), but it is ${v === undefined ? 'missing' : describe(v)}.`);
  }
  return v;
}

function onlyKeys(o: Json, allowed: readonly string[], path: string): void {
  for (const key of Object.keys(o)) {
    if (!allowed.includes(key)) {
      const where = path ? keyPath(path, key) : key;
      throw new EngineError('INVALID_TYPE', where, `Unexpected field "${key}"${path ? ` in ${path}` : ''}. Allowed fields: ${allowed.join(', ')} (names are case-sensitive).`);
    }
  }
}

function finite(v: unknown, path: string, unit: string): number {
  if (typeof v !== 'number') {
    throw new EngineError('INVALID_TYPE', path, `${path} must be a number in ${unit}, but it is ${v === undefined ? 'missing' : describe(v)}.`);
  }
  if (!Number.isFinite(v)) {
    throw new EngineError('NOT_FINITE', path, `${path} must be a finite number in ${unit}, but it is ${String(v)}.`);
  }
  return v + 0;
}

function positive(v: unknown, path: string, unit: string, what: string): number {
  const n = finite(v, path, unit);
  if (n <= 0) throw new EngineError('NOT_POSITIVE', path, `${path} (${what}) must be greater than zero, but it is ${n} ${unit}.`);
  return n;
}

function position(v: unknown, path: string, length: number): number {
  const x = finite(v, path, 'm');
  if (x < 0 || x > length) {
    throw new EngineError('OUT_OF_RANGE', path, `${path} = ${x} m lies outside the member, which runs from x = 0 to x = ${length} m. Measure x from the left end.`);
  }
  return x;
}

function label(v: unknown, path: string, what: string): string {
  if (typeof v !== 'string' || v.trim() === '') {
    throw new EngineError('INVALID_TYPE', path, `${path} must be a non-empty text (${what}), but it is ${v === undefined ? 'missing' : describe(v)}.`);
  }
  return v;
}

function parseSupport(raw: unknown, path: string, length: number): Support {
  const o = object(raw, path, 'a support such as {"x": 0, "kind": "pin"}');
  onlyKeys(o, ['x', 'kind'], path);
  const x = position(o.x, `${path}.x`, length);
  if (o.kind !== 'pin' && o.kind !== 'fixed') {
    throw new EngineError('UNKNOWN_KIND', `${path}.kind`, `${path}.kind must be "pin" or "fixed", but it is ${o.kind === undefined ? 'missing' : describe(o.kind)}.`);
  }
  return { x, kind: o.kind };
}

function parseLoad(raw: unknown, path: string, length: number): Load {
  const o = object(raw, path, 'a load such as {"case": "D", "kind": "udl", "x1": 0, "x2": 6, "w": 3500}');
  const kind = o.kind;
  if (kind !== 'point' && kind !== 'udl' && kind !== 'linear' && kind !== 'moment') {
    throw new EngineError(
      'UNKNOWN_KIND',
      `${path}.kind`,
      `${path}.kind must be one of "point", "udl", "linear", "moment", but it is ${kind === undefined ? 'missing' : describe(kind)}.`,
    );
  }
  onlyKeys(o, LOAD_KEYS[kind], path);
  const c = label(o.case, `${path}.case`, 'the load case, e.g. "D" or "L"');
  const value = (key: string): number => finite(o[key], `${path}.${key}`, LOAD_UNITS[key]);
  switch (kind) {
    case 'point':
      return { case: c, kind, x: position(o.x, `${path}.x`, length), P: value('P') };
    case 'moment':
      return { case: c, kind, x: position(o.x, `${path}.x`, length), M: value('M') };
    case 'udl':
    case 'linear': {
      const x1 = position(o.x1, `${path}.x1`, length);
      const x2 = position(o.x2, `${path}.x2`, length);
      if (!(x2 > x1)) {
        throw new EngineError(
          'OUT_OF_RANGE',
          `${path}.x2`,
          `${path}.x2 = ${x2} m must be greater than x1 = ${x1} m: a distributed load runs left to right over a length greater than zero.`,
        );
      }
      return kind === 'udl' ? { case: c, kind, x1, x2, w: value('w') } : { case: c, kind, x1, x2, w1: value('w1'), w2: value('w2') };
    }
  }
}

function parseCombinations(raw: unknown, cases: readonly string[]): Record<string, Combination> {
  const o = object(raw, 'combinations', 'named factors per load case, e.g. {"total": {"D": 1, "L": 1}}');
  const out: Record<string, Combination> = {};
  for (const name of Object.keys(o)) {
    const path = keyPath('combinations', name);
    if (name.trim() === '') throw new EngineError('INVALID_TYPE', path, 'A combination name must not be empty.');
    const factors = object(o[name], path, 'factors per load case, e.g. {"D": 1, "L": 1}');
    const combination: Combination = {};
    for (const c of Object.keys(factors)) {
      const fpath = keyPath(path, c);
      if (!cases.includes(c)) {
        throw new EngineError(
          'UNKNOWN_CASE',
          fpath,
          `Combination "${name}" names load case "${c}", but no load has that case. ${cases.length ? `Cases of this member: ${cases.join(', ')}` : 'This member has no loads'} (case labels are case-sensitive).`,
        );
      }
      combination[c] = finite(factors[c], fpath, 'a plain factor');
    }
    out[name] = combination;
  }
  return out;
}

function parseCheck(raw: unknown, path: string, combinations: Record<string, Combination>): Check {
  const o = object(raw, path, 'a check such as {"name": "live L/360", "combination": "live", "ratio": 360}');
  onlyKeys(o, ['name', 'combination', 'ratio', 'maxAbs', 'plus'], path);
  const name = label(o.name, `${path}.name`, 'the check name');
  const combination = label(o.combination, `${path}.combination`, 'the name of one of the combinations');
  if (!Object.prototype.hasOwnProperty.call(combinations, combination)) {
    const names = Object.keys(combinations);
    throw new EngineError(
      'UNKNOWN_COMBINATION',
      `${path}.combination`,
      `Check "${name}" names combination "${combination}", which is not defined. ${names.length ? `Defined: ${names.join(', ')}` : 'Define it under "combinations"'}.`,
    );
  }
  const ratio = positive(o.ratio, `${path}.ratio`, 'the n of l/n', 'the span ratio');
  const check: Check = { name, combination, ratio };
  if (o.maxAbs !== undefined && o.maxAbs !== null) check.maxAbs = positive(o.maxAbs, `${path}.maxAbs`, 'm', 'the absolute cap');
  else check.maxAbs = null;
  if (o.plus !== undefined && o.plus !== null) {
    const plus = finite(o.plus, `${path}.plus`, 'm');
    if (plus < 0) throw new EngineError('NOT_POSITIVE', `${path}.plus`, `${path}.plus (the additive allowance) must be zero or more, but it is ${plus} m.`);
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
 * - Positions must lie within 0 ≤ x ≤ length; distributed loads need x1 < x2.
 * - `combinations` is optional: when absent, each load case becomes a
 *   combination of its own, named by the case label ({"D": {"D": 1}, …}).
 * - A combination may not name a case that no load has (UNKNOWN_CASE); a
 *   check may not name an undefined combination (UNKNOWN_COMBINATION).
 * - A mechanism is rejected here too (MECHANISM, path `supports`).
 * - `label` (text) may describe the member; it is checked and dropped.
 * The result is a fresh object holding only the contract's fields.
 */
export function parseBeamInput(raw: unknown): BeamInput {
  const o = object(raw, '', 'a BeamInput with length, E, I, supports, loads, combinations');
  onlyKeys(o, TOP_KEYS, '');
  if (o.label !== undefined && typeof o.label !== 'string') {
    throw new EngineError('INVALID_TYPE', 'label', `label must be a text describing the member, but it is ${describe(o.label)}.`);
  }
  const length = positive(o.length, 'length', 'm', 'the member length');
  const E = positive(o.E, 'E', 'Pa', "Young's modulus");
  const I = positive(o.I, 'I', 'm^4', 'the second moment of area');
  const supports = array(o.supports, 'supports', 'e.g. [{"x": 0, "kind": "pin"}, {"x": 6, "kind": "pin"}]').map((s, i) =>
    parseSupport(s, `supports[${i}]`, length),
  );
  assertStable(supports);
  const loads = array(o.loads === undefined ? [] : o.loads, 'loads', 'e.g. [{"case": "D", "kind": "udl", "x1": 0, "x2": 6, "w": 3500}]').map((l, i) =>
    parseLoad(l, `loads[${i}]`, length),
  );
  const cases = [...new Set(loads.map((l) => l.case))];
  const combinations =
    o.combinations === undefined ? Object.fromEntries(cases.map((c) => [c, { [c]: 1 }])) : parseCombinations(o.combinations, cases);
  const input: BeamInput = { length, E, I, supports, loads, combinations };
  if (o.probes !== undefined) {
    input.probes = array(o.probes, 'probes', 'positions in m, e.g. [3.6, 9.0]').map((p, i) => position(p, `probes[${i}]`, length));
  }
  if (o.checks !== undefined) {
    input.checks = array(o.checks, 'checks', 'e.g. [{"name": "live L/360", "combination": "live", "ratio": 360}]').map((c, i) =>
      parseCheck(c, `checks[${i}]`, combinations),
    );
  }
  return input;
}
