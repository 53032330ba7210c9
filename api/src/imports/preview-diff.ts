import type {
  ImportChangedMember,
  ImportDiff,
  ImportFieldChange,
  ImportMemberRef,
  ImportVerdictFlip,
  UnitSystem,
  Verdict,
} from '@sagline/common/api-types';
import { diffMembers, markKey, type BeamLoad, type FieldChange, type ScheduleMember } from '@sagline/common/schedule';
import { formatQuantity, type Quantity } from '@sagline/common/units';
import type { MemberVerdict } from '../checks/member-analysis';

/** A member of either side of the diff, with its verdict. */
export interface VerdictedMember {
  member: ScheduleMember;
  verdict: Verdict | null;
  governingCheck: string | null;
  maxUtilization: number | null;
}

const LABELS: Record<string, string> = {
  level: 'Level', grid: 'Grid', category: 'Category', material: 'Material', section: 'Section', spans: 'Spans',
  leftOverhang: 'Left overhang', rightOverhang: 'Right overhang', supports: 'Supports', E: 'E', I: 'I', depth: 'Depth',
  camber: 'Camber', reviewerEmail: 'Reviewer', notes: 'Notes',
};

const QUANTITY: Record<string, Quantity> = {
  spans: 'span', leftOverhang: 'span', rightOverhang: 'span', E: 'modulus', I: 'inertia', depth: 'depth', camber: 'camber',
};

function ref(v: VerdictedMember): ImportMemberRef {
  return { mark: v.member.mark, level: v.member.level, category: v.member.category, verdict: v.verdict, maxUtilization: v.maxUtilization };
}

/** One load for a person, in the project's units: "udl 0.00–7.20 m 3.50 kN/m". */
function loadText(l: BeamLoad, system: UnitSystem): string {
  const at = (x: number) => formatQuantity(x, 'position', system);
  switch (l.kind) {
    case 'point':
      return `point at ${at(l.x)} ${formatQuantity(l.P, 'force', system)}`;
    case 'moment':
      return `moment at ${at(l.x)} ${formatQuantity(l.M, 'moment', system)}`;
    case 'udl':
      return `udl ${at(l.x1)}–${at(l.x2)} ${formatQuantity(l.w, 'lineLoad', system)}`;
    case 'linear':
      return `linear ${at(l.x1)}–${at(l.x2)} ${formatQuantity(l.w1, 'lineLoad', system)} to ${formatQuantity(l.w2, 'lineLoad', system)}`;
  }
}

/** A field value as text in the project's unit system. */
export function fieldText(field: string, value: unknown, system: UnitSystem): string {
  if (value === null || value === undefined || value === '') return '—';
  if (field.startsWith('loads.')) {
    const list = value as BeamLoad[];
    return list.length ? list.map((l) => loadText(l, system)).join('; ') : 'none';
  }
  const q = QUANTITY[field];
  if (q && Array.isArray(value)) return value.map((v: number) => formatQuantity(v, q, system)).join(' + ');
  if (q && typeof value === 'number') return formatQuantity(value, q, system);
  return String(value);
}

function toFieldChange(c: FieldChange, system: UnitSystem): ImportFieldChange {
  const label = c.field.startsWith('loads.') ? `Loads ${c.field.slice(6)}` : (LABELS[c.field] ?? c.field);
  return { field: c.field, label, before: c.before, after: c.after, beforeText: fieldText(c.field, c.before, system), afterText: fieldText(c.field, c.after, system) };
}

/**
 * What committing `next` would change against the latest revision: members
 * added, removed and changed field by field (common/src/schedule diffMembers:
 * matched by mark ignoring case), and the verdicts that flipped among members
 * in both. A member whose own fields did not change can still flip (the
 * limit set changed); it is then listed in `flips` only.
 */
export function previewDiff(
  against: { id: number; number: number; label: string | null } | null,
  previous: readonly VerdictedMember[],
  next: readonly VerdictedMember[],
  system: UnitSystem,
): ImportDiff {
  const diff = diffMembers(
    previous.map((p) => p.member),
    next.map((n) => n.member),
  );
  const before = new Map(previous.map((p) => [markKey(p.member.mark), p]));
  const after = new Map(next.map((n) => [markKey(n.member.mark), n]));
  const changed: ImportChangedMember[] = diff.changed.map((c) => {
    const b = before.get(markKey(c.mark))!;
    const a = after.get(markKey(c.mark))!;
    return { ...ref(a), verdictBefore: b.verdict, changes: c.changes.map((f) => toFieldChange(f, system)) };
  });
  const flips: ImportVerdictFlip[] = [];
  for (const n of next) {
    const p = before.get(markKey(n.member.mark));
    if (!p || p.verdict === null || n.verdict === null || p.verdict === n.verdict) continue;
    flips.push({ mark: n.member.mark, level: n.member.level, from: p.verdict, to: n.verdict, governingCheck: n.governingCheck, maxUtilization: n.maxUtilization });
  }
  return {
    against,
    added: diff.added.map((m) => ref(after.get(markKey(m.mark))!)),
    removed: diff.removed.map((m) => ref(before.get(markKey(m.mark))!)),
    changed,
    flips,
    unchanged: diff.unchanged,
  };
}

/** Members with the verdicts of their analyses, in the same order. */
export function withVerdicts(members: readonly ScheduleMember[], verdicts: readonly MemberVerdict[]): VerdictedMember[] {
  return members.map((member, i) => ({ member, ...verdicts[i] }));
}
