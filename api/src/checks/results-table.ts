import type { CopyValue } from '../db/copy-rows';
import type { ResultRow } from './member-analysis';

/**
 * The `results` table, one row per member × check × segment (SI; deflection positive up), in one
 * place: its columns, a row as read back, and a ResultRow as the values of those columns.
 */
export const RESULT_FIELDS = [
  'check_name', 'combination', 'rule_id', 'segment_index', 'segment_kind', 'segment_from', 'segment_to', 'x',
  'deflection', 'effective_length', 'span_ratio', 'limit_ratio', 'max_abs', 'plus', 'allowed', 'governing', 'utilization', 'pass', 'required_i',
] as const;

/** A result as read back from `results` (the columns of RESULT_FIELDS). */
export interface StoredResultRow {
  check_name: string;
  combination: string;
  rule_id: string;
  segment_index: number;
  segment_kind: 'span' | 'overhang';
  segment_from: number;
  segment_to: number;
  x: number;
  deflection: number;
  effective_length: number;
  span_ratio: number | null;
  limit_ratio: number;
  max_abs: number | null;
  plus: number;
  allowed: number;
  governing: 'ratio' | 'maxAbs';
  utilization: number;
  pass: boolean;
  required_i: number;
}

/** The engine's result as the values of RESULT_FIELDS, in order (for COPY). */
export function resultValues(r: ResultRow): CopyValue[] {
  return [
    r.checkName, r.combination, r.ruleId, r.segmentIndex, r.segmentKind, r.segmentFrom, r.segmentTo, r.x,
    r.deflection, r.effectiveLength, r.spanRatio, r.limitRatio, r.maxAbs, r.plus, r.allowed, r.governing, r.utilization, r.pass, r.requiredI,
  ];
}
