import { memberLoads } from './member-model';
import { markKey } from './parse-members';
import type { BeamLoad, ScheduleMember } from './types';

/** One field that differs; values in SI (loads in the engine's shape). */
export interface FieldChange {
  /** A ScheduleMember field name, or "loads.<case>" for the loads of one load case. */
  field: string;
  before: unknown;
  after: unknown;
}

export interface MemberChange {
  mark: string;
  before: ScheduleMember;
  after: ScheduleMember;
  changes: FieldChange[];
}

export interface MemberDiff {
  added: ScheduleMember[];
  removed: ScheduleMember[];
  changed: MemberChange[];
  unchanged: number;
}

/** Fields compared, in the order changes are listed. The source row is not: moving a row changes nothing. */
const FIELDS = [
  'level', 'grid', 'category', 'material', 'section', 'spans', 'leftOverhang', 'rightOverhang',
  'supports', 'E', 'I', 'depth', 'camber', 'reviewerEmail', 'notes',
] as const satisfies readonly (keyof ScheduleMember)[];

// Values converted from other units (24 ft against 7.3152 m) may differ in the last bits.
const REL_TOL = 1e-9;

function sameNumber(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= REL_TOL * Math.max(Math.abs(a), Math.abs(b));
}

function same(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return sameNumber(a, b);
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((v, i) => same(v, b[i]));
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    return ka.length === kb.length && ka.every((k) => same((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
  }
  return a === b;
}

function loadSortKey(load: BeamLoad): [string, number, number] {
  switch (load.kind) {
    case 'udl':
      return [load.kind, load.x1, load.x2];
    case 'linear':
      return [load.kind, load.x1, load.x2];
    case 'point':
    case 'moment':
      return [load.kind, load.x, 0];
  }
}

/** Loads grouped by case, each group in a stable order so that reordering rows is not a change. */
function loadsByCase(member: ScheduleMember): Map<string, BeamLoad[]> {
  const groups = new Map<string, BeamLoad[]>();
  for (const load of memberLoads(member)) groups.set(load.case, [...(groups.get(load.case) ?? []), load]);
  for (const list of groups.values()) {
    list.sort((a, b) => {
      const [ka, xa, ya] = loadSortKey(a);
      const [kb, xb, yb] = loadSortKey(b);
      return ka < kb ? -1 : ka > kb ? 1 : xa - xb || ya - yb;
    });
  }
  return groups;
}

/** What changed between two field values of a member, field by field. */
export function memberChanges(before: ScheduleMember, after: ScheduleMember): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const field of FIELDS) {
    if (!same(before[field], after[field])) changes.push({ field, before: before[field], after: after[field] });
  }
  const lb = loadsByCase(before);
  const la = loadsByCase(after);
  const cases = [...new Set([...lb.keys(), ...la.keys()])].sort();
  for (const c of cases) {
    const b = lb.get(c) ?? [];
    const a = la.get(c) ?? [];
    if (!same(b, a)) changes.push({ field: `loads.${c}`, before: b, after: a });
  }
  return changes;
}

/**
 * Members added, removed and changed from one revision to the next, matched
 * by mark (ignoring case). A renamed mark is one removal and one addition.
 */
export function diffMembers(previous: readonly ScheduleMember[], next: readonly ScheduleMember[]): MemberDiff {
  const before = new Map(previous.map((m) => [markKey(m.mark), m]));
  const nextKeys = new Set(next.map((m) => markKey(m.mark)));
  const diff: MemberDiff = { added: [], removed: [], changed: [], unchanged: 0 };
  for (const m of next) {
    const old = before.get(markKey(m.mark));
    if (!old) {
      diff.added.push(m);
      continue;
    }
    const changes = memberChanges(old, m);
    if (changes.length) diff.changed.push({ mark: m.mark, before: old, after: m, changes });
    else diff.unchanged++;
  }
  for (const m of previous) if (!nextKeys.has(markKey(m.mark))) diff.removed.push(m);
  return diff;
}
