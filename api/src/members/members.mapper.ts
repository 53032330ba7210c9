import type { ImportFieldChange, LimitRuleView, MemberLoadView, MemberResultView, MemberRow, RevisionRef, UnitSystem } from '@sagline/common/api-types';
import { combinationName, describeSource, type LimitRule } from '@sagline/common/limits';
import type { FieldChange, ScheduleLoad, ScheduleMember } from '@sagline/common/schedule';
import { fieldText } from '../imports/preview-diff';
import type { StoredResultRow } from '../checks/results-table';
import type { MemberFullRow, MemberListRow, MemberLoadRow, RevisionRefRow } from './members.repository';

export function toRevisionRef(row: RevisionRefRow): RevisionRef {
  return { id: row.id, number: row.number, label: row.label, createdAt: row.created_at.toISOString() };
}

export function toMemberRow(row: MemberListRow): MemberRow {
  return {
    id: row.id,
    mark: row.mark,
    level: { id: row.level_id, name: row.level_name },
    grid: row.grid,
    category: row.category,
    material: row.material,
    section: row.section,
    supports: row.supports,
    spans: row.spans,
    leftOverhang: row.left_overhang,
    rightOverhang: row.right_overhang,
    length: row.length,
    governingCheck: row.governing_check,
    maxUtilization: row.max_utilization,
    verdict: row.verdict,
    requiredI: row.required_i,
    I: row.i,
    reviewer: row.reviewer_id !== null ? { id: row.reviewer_id, name: row.reviewer_name ?? '' } : null,
    reviewerEmail: row.reviewer_email,
    openFlagCount: row.open_flag_count,
  };
}

export function toLoadView(row: MemberLoadRow): MemberLoadView {
  return {
    position: row.position,
    case: row.case,
    kind: row.kind,
    x1: row.x1,
    x2: row.x2,
    value1: row.value1,
    value2: row.value2,
    source: { sheet: row.source_sheet, row: row.source_row, column: row.source_column },
  };
}

/** A stored load back in the parser's shape (the inverse of the import's write). */
export function toScheduleLoad(l: MemberLoadRow): ScheduleLoad {
  const origin = { sheet: l.source_sheet, row: l.source_row, ...(l.source_column ? { column: l.source_column } : {}) };
  switch (l.kind) {
    case 'point':
      return { case: l.case, kind: 'point', x: l.x1, P: l.value1, origin };
    case 'moment':
      return { case: l.case, kind: 'moment', x: l.x1, M: l.value1, origin };
    case 'udl':
      return { case: l.case, kind: 'udl', x1: l.x1, x2: l.x2!, w: l.value1, origin };
    case 'linear':
      return { case: l.case, kind: 'linear', x1: l.x1, x2: l.x2!, w1: l.value1, w2: l.value2!, origin };
  }
}

/** A stored member back in the parser's shape, so common/src/schedule builds its engine input and diffs it. */
export function toScheduleMember(row: MemberFullRow, loads: MemberLoadRow[]): ScheduleMember {
  return {
    mark: row.mark,
    level: row.level_name,
    grid: row.grid,
    category: row.category,
    material: row.material as ScheduleMember['material'],
    section: row.section,
    spans: row.spans,
    leftOverhang: row.left_overhang,
    rightOverhang: row.right_overhang,
    supports: row.supports as ScheduleMember['supports'],
    E: row.e,
    I: row.i,
    depth: row.depth,
    camber: row.camber,
    loads: loads.map(toScheduleLoad),
    reviewerEmail: row.reviewer_email,
    notes: row.notes,
    sourceRow: row.source_row,
  };
}

export function toResultView(r: StoredResultRow): MemberResultView {
  return {
    checkName: r.check_name,
    combination: r.combination,
    ruleId: r.rule_id,
    segmentIndex: r.segment_index,
    segmentKind: r.segment_kind,
    segmentFrom: r.segment_from,
    segmentTo: r.segment_to,
    x: r.x,
    deflection: r.deflection,
    effectiveLength: r.effective_length,
    spanRatio: r.span_ratio,
    limitRatio: r.limit_ratio,
    maxAbs: r.max_abs,
    plus: r.plus,
    allowed: r.allowed,
    governing: r.governing,
    utilization: r.utilization,
    pass: r.pass,
    requiredI: r.required_i,
  };
}

/** A rule as the api shows it (the same fields as the limit-set screen's, checks/checks.mapper.ts). */
export function toRuleView(r: LimitRule): LimitRuleView {
  return {
    id: r.id,
    category: r.category,
    check: r.check,
    combination: r.combination,
    combinationName: combinationName(r.combination),
    ratio: r.ratio,
    maxAbs: r.maxAbs,
    plus: r.plus,
    materials: r.materials,
    lengthRange: r.lengthRange,
    source: r.source,
    sourceText: describeSource(r.source),
  };
}

/** Labels of the diff's fields, as the import's diff names them (imports/preview-diff.ts). */
const LABELS: Record<string, string> = {
  level: 'Level', grid: 'Grid', category: 'Category', material: 'Material', section: 'Section', spans: 'Spans',
  leftOverhang: 'Left overhang', rightOverhang: 'Right overhang', supports: 'Supports', E: 'E', I: 'I', depth: 'Depth',
  camber: 'Camber', reviewerEmail: 'Reviewer', notes: 'Notes',
};

export function toFieldChange(c: FieldChange, system: UnitSystem): ImportFieldChange {
  const label = c.field.startsWith('loads.') ? `Loads ${c.field.slice(6)}` : (LABELS[c.field] ?? c.field);
  return { field: c.field, label, before: c.before, after: c.after, beforeText: fieldText(c.field, c.before, system), afterText: fieldText(c.field, c.after, system) };
}
