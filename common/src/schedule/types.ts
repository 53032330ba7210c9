import type { UnitSystemId } from '../units';
import type { SheetData } from './cells';
import type { LoadCaseCode, MaterialCode, SupportCode } from './codes';

/*
 * Engine-shaped supports and loads (calc-contract.md, "BeamInput"). Defined
 * here rather than imported so the schedule does not depend on the engine;
 * the shapes must stay equal to the contract. All SI: m, N, N/m, N·m.
 * x from the member's left end; forces positive downward; moments positive
 * counter-clockwise.
 */
export interface BeamSupport {
  x: number;
  kind: 'pin' | 'fixed';
}
export type BeamLoad =
  | { case: string; kind: 'udl'; x1: number; x2: number; w: number }
  | { case: string; kind: 'point'; x: number; P: number }
  | { case: string; kind: 'linear'; x1: number; x2: number; w1: number; w2: number }
  | { case: string; kind: 'moment'; x: number; M: number };

/** Where a load came from in the workbook. */
export interface LoadOrigin {
  sheet: string;
  row: number;
  /** The header of the Members load column, for uniform loads from the Members sheet. */
  column?: string;
}

/** A load in the engine's shape with the row it came from. */
export type ScheduleLoad = BeamLoad & { origin: LoadOrigin };

/** One member of a parsed schedule, in SI units (m, N/m, N, N·m, Pa, m^4). */
export interface ScheduleMember {
  mark: string;
  level: string;
  grid: string | null;
  category: string;
  material: MaterialCode;
  section: string | null;
  /** Span lengths between supports, left to right, m. For a cantilever: its length. */
  spans: number[];
  /** m, 0 when none. */
  leftOverhang: number;
  rightOverhang: number;
  supports: SupportCode;
  /** Pa */
  E: number;
  /** m^4 */
  I: number;
  /** m, null when not given */
  depth: number | null;
  /** m, upward, null when not given */
  camber: number | null;
  /** Uniform loads of the Members load columns, then the Loads sheet rows, in sheet order. */
  loads: ScheduleLoad[];
  reviewerEmail: string | null;
  notes: string | null;
  /** The Members sheet row (header = 1). */
  sourceRow: number;
}

export type ProblemCode =
  | 'EMPTY_SHEET'
  | 'NO_MEMBERS'
  | 'MISSING_COLUMN'
  | 'DUPLICATE_COLUMN'
  | 'UNKNOWN_UNIT'
  | 'WRONG_UNIT'
  | 'UNKNOWN_COLUMN'
  | 'UNKNOWN_LOAD_CASE'
  | 'UNIT_IGNORED'
  | 'UNTITLED_COLUMN'
  | 'NOT_A_NUMBER'
  | 'FORMULA_NO_RESULT'
  | 'CELL_ERROR'
  | 'SPANS_FORMULA'
  | 'MISSING_VALUE'
  | 'EMPTY_MARK'
  | 'DUPLICATE_MARK'
  | 'TOO_LONG'
  | 'UNKNOWN_LEVEL'
  | 'UNKNOWN_CATEGORY'
  | 'UNKNOWN_MATERIAL'
  | 'UNKNOWN_SUPPORT'
  | 'UNKNOWN_KIND'
  | 'NOT_POSITIVE'
  | 'NEGATIVE'
  | 'CANTILEVER_LAYOUT'
  | 'BAD_EMAIL'
  | 'UNKNOWN_MARK'
  | 'LOAD_OUTSIDE'
  | 'LOAD_RANGE'
  | 'UDL_END_VALUE'
  | 'VALUE_IGNORED'
  | 'TOO_MANY_ROWS'
  | 'TOO_MANY_PROBLEMS'
  | 'SLENDER'
  | 'I_OUTLIER'
  | 'LONG_SPAN'
  | 'NO_LOADS';

export interface ScheduleProblem {
  /** 'error' is fatal: an import with any error stores nothing. */
  severity: 'error' | 'warning';
  code: ProblemCode;
  sheet: string;
  /** Spreadsheet row number (the header is row 1). */
  row: number;
  /** Header text and column letter, e.g. "Spans [m] (column G)"; null for a whole row or sheet. */
  column: string | null;
  columnLetter: string | null;
  header: string | null;
  /** The member's mark when known. */
  mark?: string;
  /** The cell as read (formulas as "=…", dates as ISO text). */
  value: string | number | boolean | null;
  /** What is wrong, where, and how to fix it. */
  message: string;
}

export interface ParseScheduleInput {
  members: SheetData;
  loads?: SheetData;
  unitSystem: UnitSystemId;
  /** The limit-set category ids a member may use. */
  categories: readonly string[];
  /** When given, a member's level must be one of these (matched ignoring case). */
  levels?: readonly string[];
  /** Data rows allowed on the Members sheet (default 5000); Loads gets four times as many. */
  maxRows?: number;
  /** Problems reported before the list is cut short (default 1000). */
  maxProblems?: number;
}

export interface ParseScheduleResult {
  /** Members whose rows had no error, in sheet order. */
  members: ScheduleMember[];
  problems: ScheduleProblem[];
  summary: { memberRows: number; loadRows: number; errors: number; warnings: number };
}

export type { LoadCaseCode };
