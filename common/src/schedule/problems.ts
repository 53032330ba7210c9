import { displayValue, type CellValue } from './cells';
import type { ProblemCode, ScheduleProblem } from './types';

/** A cell position for a report. */
export interface Where {
  sheet: string;
  /** Spreadsheet row (header = 1). */
  row: number;
  column?: { letter: string; header: string } | null;
  mark?: string;
  value?: CellValue;
}

/** "Spans [m] (column G)" */
export function columnLabel(column: { letter: string; header: string }): string {
  return column.header === '' ? `column ${column.letter}` : `${column.header} (column ${column.letter})`;
}

/** "Members row 14, Spans [m] (column G)" — the start of every cell message. */
export function placeLabel(where: Where): string {
  const row = `${where.sheet} row ${where.row}`;
  return where.column ? `${row}, ${columnLabel(where.column)}` : row;
}

/**
 * Collects problems up to a cap, and counts every one, so a file with a
 * wrong header unit on 5000 rows gives a readable report.
 */
export class ProblemList {
  readonly items: ScheduleProblem[] = [];
  errors = 0;
  warnings = 0;
  private omitted = 0;

  constructor(private readonly max: number) {}

  add(severity: 'error' | 'warning', code: ProblemCode, where: Where, message: string): void {
    if (severity === 'error') this.errors++;
    else this.warnings++;
    if (this.items.length >= this.max) {
      this.omitted++;
      return;
    }
    this.items.push({
      severity,
      code,
      sheet: where.sheet,
      row: where.row,
      column: where.column ? columnLabel(where.column) : null,
      columnLetter: where.column?.letter ?? null,
      header: where.column?.header ?? null,
      ...(where.mark !== undefined ? { mark: where.mark } : {}),
      value: where.value === undefined ? null : displayValue(where.value),
      message,
    });
  }

  error(code: ProblemCode, where: Where, message: string): void {
    this.add('error', code, where, message);
  }

  warning(code: ProblemCode, where: Where, message: string): void {
    this.add('warning', code, where, message);
  }

  /** The list, with a closing note when some problems were left out. */
  finish(sheet: string): ScheduleProblem[] {
    if (this.omitted > 0) {
      this.items.push({
        severity: this.errors > 0 ? 'error' : 'warning',
        code: 'TOO_MANY_PROBLEMS',
        sheet,
        row: 1,
        column: null,
        columnLetter: null,
        header: null,
        value: null,
        message: `${this.omitted} more problems were found and are not listed. Fix the ones above (often one header or unit causes many) and upload again.`,
      });
    }
    return this.items;
  }
}
