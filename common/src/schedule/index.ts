/**
 * The member schedule format (Sagline's own): a Members sheet with one row per
 * member and an optional Loads sheet. Pure functions over already-read cell
 * values, shared by the api import and the web's template and preview.
 */
export {
  columnLetter,
  displayValue,
  resolveCell,
  type CellPrimitive,
  type CellValue,
  type ErrorCell,
  type FormulaCell,
  type HyperlinkCell,
  type ResolvedCell,
  type RichTextCell,
  type SheetData,
} from './cells';
export {
  LOAD_CASES,
  LOAD_KINDS,
  MATERIALS,
  SUPPORT_CODES,
  matchCode,
  wordKey,
  type CodeDef,
  type LoadCaseCode,
  type LoadKindCode,
  type MaterialCode,
  type SupportCode,
} from './codes';
export {
  LOAD_CASE_COLUMN,
  LOAD_COLUMNS,
  LOAD_VALUE_QUANTITIES,
  MARK_MAX,
  MEMBER_COLUMNS,
  NOTES_MAX,
  TEMPLATE_LOAD_CASES,
  columnHeader,
  type ColumnDef,
  type ColumnKind,
} from './columns';
export { splitHeader } from './header';
export { parseSchedule, DEFAULT_MAX_PROBLEMS, DEFAULT_MAX_ROWS } from './parse-schedule';
export { markKey, LONG_SPAN_M } from './parse-members';
export { memberBeamInput, memberLength, memberLoads, memberSupports } from './member-model';
export { diffMembers, memberChanges, type FieldChange, type MemberChange, type MemberDiff } from './diff';
export { governingLength, I_MIN_PEERS, I_OUTLIER_FACTOR, I_PEER_LENGTH_RATIO, SLENDER_RATIO } from './warnings';
export { TEMPLATE_HELP, codeTables, columnHelpRows, unitSystemNote, type ColumnHelpRow } from './template-help';
export { SHEET_NAMES, findSheet } from './sheets';
export { csvSheet, parseCsv } from './csv';
export type {
  BeamLoad,
  BeamSupport,
  LoadOrigin,
  ParseScheduleInput,
  ParseScheduleResult,
  ProblemCode,
  ScheduleLoad,
  ScheduleMember,
  ScheduleProblem,
} from './types';
